/**
 * The load points a plan is checked at: 0, 25, 50, 75 and 100 % of the requested load range,
 * the range being a share of the online sets' rated kW at one power factor (lagging).
 */
import type { Band, LoadOverride, Plant } from '../../../shared-types';

/** Fractions of the load range the plan is checked at. */
export const PLAN_CHECK_FRACTIONS = [0, 0.25, 0.5, 0.75, 1] as const;

/** One load point: its % of the online rated kW and the load itself. */
export interface LoadPoint {
  loadPct: number;
  load: LoadOverride;
}

/** Sum of `ratedKW` over the online sets, kW. */
export function onlineRatedKW(plant: Plant): number {
  let kw = 0;
  for (const s of plant.sets) if (s.online) kw += s.ratedKW;
  return kw;
}

/** kVAR of `kW` at lagging power factor `pf`. */
export function kVARAtPF(kW: number, pf: number): number {
  return (kW * Math.sqrt(Math.max(0, 1 - pf * pf))) / pf;
}

/** A load of `pct` % of the online rated kW at `pf`. */
export function loadAtPct(plant: Plant, pct: number, pf: number): LoadPoint {
  const kW = (onlineRatedKW(plant) * pct) / 100;
  return { loadPct: pct, load: { kW, kVAR: kVARAtPF(kW, pf) } };
}

/** The check points across `rangePct` (0, 25, 50, 75, 100 % of the way from min to max). */
export function planLoadPoints(plant: Plant, rangePct: Band, pf: number): LoadPoint[] {
  return PLAN_CHECK_FRACTIONS.map((f) => loadAtPct(plant, rangePct.min + f * (rangePct.max - rangePct.min), pf));
}
