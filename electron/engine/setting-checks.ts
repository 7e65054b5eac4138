/**
 * Warnings (never refusals) for set-points outside the usual range of engine sets, in words.
 * The bands are common practice for engine-driven sets: speed and reactive droop 1–10 %
 * (3–5 % is usual), no-load frequency and voltage within 10 % of rated, and in speed droop a
 * no-load frequency above rated (else the set cannot give rated kW at rated frequency).
 */
import type { Plant } from '../../shared-types';
import { formatNumber } from '../../shared-types';

/** Widest usual distance of a no-load or set-point frequency or voltage from rated, % (common practice). */
export const SETPOINT_BAND_PCT = 10;
/** Usual droop range, % (common practice; 3–5 % is the most common). */
export const DROOP_USUAL_MIN_PCT = 1;
export const DROOP_USUAL_MAX_PCT = 10;

const pct = (v: number, rated: number) => (100 * (v - rated)) / rated;

/** One sentence per set-point outside its usual range, naming the set and the setting in words. */
export function settingWarnings(plant: Plant): string[] {
  const out: string[] = [];
  const fr = plant.ratedFrequencyHz;
  const vr = plant.ratedVoltageV;
  for (const s of plant.sets) {
    const g = s.governor;
    const r = s.regulator;
    if (g.mode === 'droop') {
      if (g.droopPct < DROOP_USUAL_MIN_PCT || g.droopPct > DROOP_USUAL_MAX_PCT)
        out.push(`${s.id}: speed droop ${g.droopPct} % is outside the usual ${DROOP_USUAL_MIN_PCT}–${DROOP_USUAL_MAX_PCT} % (3–5 % is common).`);
      const d = pct(g.noLoadHz, fr);
      if (Math.abs(d) > SETPOINT_BAND_PCT)
        out.push(`${s.id}: no-load frequency ${g.noLoadHz} Hz is ${formatNumber(d, 1)} % from rated ${fr} Hz (usually within ±${SETPOINT_BAND_PCT} %).`);
      if (g.noLoadHz <= fr)
        out.push(
          `${s.id}: no-load frequency ${g.noLoadHz} Hz is not above rated ${fr} Hz: in speed droop the set then carries no kW at rated frequency or above (usual: rated × (1 + droop) = ${formatNumber(fr * (1 + g.droopPct / 100), 2)} Hz).`,
        );
    } else if (g.mode === 'isochronous') {
      const d = pct(g.setpointHz, fr);
      if (Math.abs(d) > SETPOINT_BAND_PCT)
        out.push(`${s.id}: frequency setting ${g.setpointHz} Hz is ${formatNumber(d, 1)} % from rated ${fr} Hz (usually within ±${SETPOINT_BAND_PCT} %).`);
    }
    if (r.mode === 'reactive-droop') {
      if (r.droopPct < DROOP_USUAL_MIN_PCT || r.droopPct > DROOP_USUAL_MAX_PCT)
        out.push(`${s.id}: reactive droop ${r.droopPct} % is outside the usual ${DROOP_USUAL_MIN_PCT}–${DROOP_USUAL_MAX_PCT} % (3–5 % is common).`);
      const d = pct(r.noLoadV, vr);
      if (Math.abs(d) > SETPOINT_BAND_PCT)
        out.push(`${s.id}: no-load voltage ${r.noLoadV} V is ${formatNumber(d, 1)} % from rated ${vr} V (usually within ±${SETPOINT_BAND_PCT} %).`);
    } else if (r.mode === 'voltage' || r.mode === 'cross-current') {
      const d = pct(r.setpointV, vr);
      if (Math.abs(d) > SETPOINT_BAND_PCT)
        out.push(`${s.id}: voltage setting ${r.setpointV} V is ${formatNumber(d, 1)} % from rated ${vr} V (usually within ±${SETPOINT_BAND_PCT} %).`);
    }
  }
  return out;
}
