/**
 * Closed-form speed-droop plan. A droop set gives `P = ratedKW (f_nl − f) / (droop f_rated)`,
 * so sets with equal droop and equal no-load frequency share kW in proportion to rating at
 * every load, and the bus frequency is `f = f_nl − droop · f_rated · u`, u the droop sets'
 * loading (per unit of their rated kW). Over a load range u_lo..u_hi the frequency swings by
 * `droop · f_rated · (u_hi − u_lo)`; the largest droop that fits a band of width W is
 * `W / (f_rated · (u_hi − u_lo))`, and the no-load frequency that centres the swing is
 * `(f_min + f_max)/2 + droop · f_rated · (u_lo + u_hi)/2`.
 */
import type { Band, PlanLimits, Plant } from '../../../shared-types';
import type { LoadPoint } from './load-points';
import { clamp, fmt } from './plan-limits';
import { overrunsBand, pickSlope, planByLaw, weightedDroop } from './plan-shape';
import type { PlanFound, PlanInput, PlanLaw } from './plan-shape';

/** What the planner chose for the governors. */
export interface SpeedPlan {
  /** Indices (into `plant.sets`) of the sets whose governor is planned. */
  planned: number[];
  droopPct: number;
  noLoadHz: number;
  droopFree: boolean;
  noLoadFree: boolean;
  reasons: string[];
  tradeoffs: string[];
  notes: string[];
}

/** Loading of the droop sets (per unit of their rated kW) at each point, base-load sets taken out. */
export function droopLoading(plant: Plant, planned: readonly number[], points: readonly LoadPoint[]): number[] {
  let rated = 0;
  for (const i of planned) rated += plant.sets[i]!.ratedKW;
  let base = 0;
  for (const s of plant.sets) if (s.online && s.governor.mode === 'baseload') base += s.governor.baseKW;
  return points.map((p) => (p.load.kW - base) / rated);
}

type SpeedField = 'droopPct' | 'noLoadHz';

/** The speed-droop law's part of the plan: the governors of the online droop sets. */
const SPEED_LAW: PlanLaw<SpeedField, SpeedPlan> = {
  sort: (s) =>
    s.governor.mode === 'droop'
      ? true
      : s.governor.mode === 'isochronous'
        ? `${s.name} is isochronous: it holds the frequency, so the governors are left as they are.`
        : `${s.name} is in base load (${fmt(s.governor.baseKW, 0)} kW): it is left as it is and the droop sets carry the rest.`,
  holds: (s) => s.governor.mode === 'isochronous',
  none: ({ reasons, notes }) => ({ planned: [], droopPct: 0, noLoadHz: 0, droopFree: false, noLoadFree: false, reasons, tradeoffs: [], notes }),
  solve: solveSpeed,
};

/** Plans droop and no-load frequency for the online droop sets. */
export function planSpeedDroop(
  plant: Plant,
  points: readonly LoadPoint[],
  band: Band,
  limits: PlanLimits,
  fixed: (i: number, field: SpeedField) => boolean,
): SpeedPlan {
  return planByLaw({ plant, points, band, limits, fixed }, SPEED_LAW);
}

function solveSpeed({ plant, points, band, limits, fixed }: PlanInput<SpeedField>, { planned, reasons, notes }: PlanFound): SpeedPlan {
  const fr = plant.ratedFrequencyHz;
  const u = droopLoading(plant, planned, points);
  const uLo = Math.min(...u);
  const uHi = Math.max(...u);
  const du = uHi - uLo;
  const width = band.max - band.min;

  const fixedDroop = planned.filter((i) => fixed(i, 'droopPct'));
  const fixedNoLoad = planned.filter((i) => fixed(i, 'noLoadHz'));
  const droopOf = (i: number) => plant.sets[i]!.governor.droopPct;
  const noLoadOf = (i: number) => plant.sets[i]!.governor.noLoadHz;
  if (new Set(fixedDroop.map(droopOf)).size > 1)
    notes.push('Sets with different fixed speed droops cannot share kW in proportion at every load; the planner matches the first.');
  if (new Set(fixedNoLoad.map(noLoadOf)).size > 1)
    notes.push('Sets with different fixed no-load frequencies cannot share kW in proportion; the planner matches the first.');

  const preferred = clamp(
    weightedDroop(planned, (i) => plant.sets[i]!.ratedKW, droopOf),
    limits.speedDroopPct.min,
    limits.speedDroopPct.max,
  );
  const fnlFixed = fixedNoLoad.length > 0 ? noLoadOf(fixedNoLoad[0]!) : null;

  // Interval of droop (%) that keeps the swing in the band and meets a fixed no-load frequency.
  let lo = limits.speedDroopPct.min;
  let hi = limits.speedDroopPct.max;
  const bandMax = du > 0 ? (100 * width) / (fr * du) : Number.POSITIVE_INFINITY;
  hi = Math.min(hi, bandMax);
  if (fnlFixed !== null) {
    if (uLo > 0) lo = Math.max(lo, (100 * (fnlFixed - band.max)) / (fr * uLo));
    if (uHi > 0) hi = Math.min(hi, (100 * (fnlFixed - band.min)) / (fr * uHi));
  }

  const droopPct = pickSlope(
    fixedDroop.length > 0 ? droopOf(fixedDroop[0]!) : null,
    preferred,
    lo,
    hi,
    clamp(bandMax, limits.speedDroopPct.min, limits.speedDroopPct.max),
  );

  const swing = (droopPct / 100) * fr * du;
  if (overrunsBand(swing, width)) {
    const why = fixedDroop.length > 0 ? `the fixed speed droop of ${fmt(droopPct, 2)} %` : `even the smallest speed droop allowed, ${fmt(droopPct, 2)} %,`;
    reasons.push(
      `Frequency band: ${why} swings the bus ${fmt(swing, 3)} Hz over the load range, ${fmt(swing - width, 3)} Hz more than the ${fmt(width, 3)} Hz band allows.`,
    );
  }
  const centred = (band.min + band.max) / 2 + ((droopPct / 100) * fr * (uLo + uHi)) / 2;
  const noLoadHz = fnlFixed ?? centred;
  const hzLo = (limits.noLoadHzPct.min / 100) * fr;
  const hzHi = (limits.noLoadHzPct.max / 100) * fr;
  if (noLoadHz < hzLo || noLoadHz > hzHi) {
    reasons.push(
      `No-load frequency ${fmt(noLoadHz, 3)} Hz is outside the allowed ${fmt(hzLo, 2)}–${fmt(hzHi, 2)} Hz, by ${fmt(Math.max(hzLo - noLoadHz, noLoadHz - hzHi), 3)} Hz.`,
    );
  }
  const tradeoffs = [
    `Speed droop ${fmt(droopPct, 2)} % on every droop set: more droop holds the kW split steadier against speed-setpoint error, less droop narrows the frequency swing (here ${fmt(swing, 3)} Hz of the ${fmt(width, 3)} Hz band).`,
    `No-load frequency ${fmt(noLoadHz, 3)} Hz on every droop set: equal no-load settings with equal droop share kW in proportion to rating${fnlFixed === null ? ', and this one centres the swing in the band' : ' (kept from the fixed set)'}.`,
  ];
  return { planned, droopPct, noLoadHz, droopFree: fixedDroop.length === 0, noLoadFree: fnlFixed === null, reasons, tradeoffs, notes };
}
