/**
 * Feeds a plant back through the sharing solver at the plan's load points and judges the
 * bus against the bands: the proof that a proposal holds, and the figures it is shown with.
 */
import type { Band, BandVerdict, LoadOverride, Plant, PlanCheck, PlanPoint, SharingResult } from '../../../shared-types';
import { Diverged, EngineError } from '../errors';
import { solveSharing } from '../sharing';
import type { LoadPoint } from './load-points';
import { formatNumber } from '../../../shared-types';

/**
 * Load used for a no-load point the network solver does not converge at, as a fraction of the
 * online rated kW: with perfectly matched settings every set carries nothing at no load and the
 * feeder Newton–Raphson has no current to work from. The point says so in its `note`.
 */
export const NO_LOAD_TRACE = 1e-4;

function solveAt(plant: Plant, load: LoadOverride, ratedKW: number): { r: SharingResult; note?: string } {
  try {
    return { r: solveSharing(plant, load) };
  } catch (err) {
    if (!(err instanceof Diverged) || load.kW > 0 || load.kVAR !== 0) throw err;
    const kW = NO_LOAD_TRACE * ratedKW;
    return {
      r: solveSharing(plant, { kW, kVAR: 0 }),
      note: `Solved at ${kW.toPrecision(2)} kW (a trace of load): the network solver does not converge at exactly no load with these settings.`,
    };
  }
}

/** Solves `plant` at every point; a point without a steady state carries the reason instead of figures. */
export function checkPlan(plant: Plant, points: readonly LoadPoint[]): PlanCheck {
  let worstKW: number | null = null;
  let worstKVAR: number | null = null;
  let ratedKW = 0;
  for (const s of plant.sets) if (s.online) ratedKW += s.ratedKW;
  const out: PlanPoint[] = points.map((p) => {
    const base = { loadPct: p.loadPct, loadKW: p.load.kW, loadKVAR: p.load.kVAR };
    try {
      const { r, note } = solveAt(plant, p.load, ratedKW);
      let eKW = 0;
      let eKVAR = 0;
      for (const s of r.sets) {
        if (!s.online) continue;
        eKW = Math.max(eKW, Math.abs(s.sharingErrorKWPct));
        eKVAR = Math.max(eKVAR, Math.abs(s.sharingErrorKVARPct));
      }
      worstKW = Math.max(worstKW ?? 0, eKW);
      worstKVAR = Math.max(worstKVAR ?? 0, eKVAR);
      return {
        ...base,
        frequencyHz: r.bus.frequencyHz,
        voltageV: r.bus.voltageV,
        worstKWErrorPct: eKW,
        worstKVARErrorPct: eKVAR,
        setKW: r.sets.map((s) => (s.online ? s.kW : null)),
        setKVAR: r.sets.map((s) => (s.online ? s.kVAR : null)),
        ...(note === undefined ? {} : { note }),
      };
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      return {
        ...base,
        frequencyHz: null,
        voltageV: null,
        worstKWErrorPct: null,
        worstKVARErrorPct: null,
        setKW: plant.sets.map(() => null),
        setKVAR: plant.sets.map(() => null),
        error: err.message,
      };
    }
  });
  return { points: out, worstKWErrorPct: worstKW, worstKVARErrorPct: worstKVAR };
}

/** Lowest and highest of the solved values (null when none solved). */
export function extent(values: readonly (number | null)[]): { lo: number; hi: number } | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v === null) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return lo <= hi ? { lo, hi } : null;
}

/**
 * Whether the bus stays in `band` at every point. A point with no steady state fails the band
 * (its reason is in the point); `shortBy` is how far outside the band the bus goes.
 */
export function judgeBand(quantity: 'frequency' | 'voltage', band: Band, check: PlanCheck): BandVerdict {
  const unit = quantity === 'frequency' ? 'Hz' : 'V';
  const digits = quantity === 'frequency' ? 3 : 1;
  const values = check.points.map((p) => (quantity === 'frequency' ? p.frequencyHz : p.voltageV));
  const ext = extent(values);
  const unsolved = check.points.filter((p) => p.error !== undefined);
  const base = { quantity, min: band.min, max: band.max, lowest: ext?.lo ?? null, highest: ext?.hi ?? null };
  const name = quantity === 'frequency' ? 'bus frequency' : 'bus voltage';
  if (ext === null) {
    return {
      ...base,
      met: false,
      shortBy: Number.POSITIVE_INFINITY,
      sentence: `The ${name} has no steady state at any checked load: ${unsolved[0]?.error ?? ''}`,
    };
  }
  // Rounding of the solver's last digits is not a miss.
  const eps = 1e-9 * Math.max(Math.abs(band.min), Math.abs(band.max));
  const below = band.min - ext.lo > eps ? band.min - ext.lo : 0;
  const above = ext.hi - band.max > eps ? ext.hi - band.max : 0;
  const shortBy = Math.max(below, above);
  const range = `${formatNumber(ext.lo, digits)}–${formatNumber(ext.hi, digits)} ${unit}`;
  const bandText = `${formatNumber(band.min, digits)}–${formatNumber(band.max, digits)} ${unit}`;
  if (unsolved.length > 0) {
    return {
      ...base,
      met: false,
      shortBy,
      sentence: `The ${name} cannot be checked at ${unsolved.map((p) => `${formatNumber(p.loadPct, 0)} %`).join(', ')} load: ${unsolved[0]!.error}`,
    };
  }
  if (shortBy <= 0) return { ...base, met: true, shortBy: 0, sentence: `The ${name} stays in ${bandText} (${range} across the load range).` };
  const parts: string[] = [];
  if (below > 0) parts.push(`${formatNumber(below, digits)} ${unit} below the band's lower edge`);
  if (above > 0) parts.push(`${formatNumber(above, digits)} ${unit} above its upper edge`);
  return { ...base, met: false, shortBy, sentence: `The ${name} spans ${range} across the load range: ${parts.join(' and ')} (${bandText}).` };
}
