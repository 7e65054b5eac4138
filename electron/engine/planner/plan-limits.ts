/** Default limits of the planner's settings and the fields a user may fix. */
import type { PlanLimits } from '../../../shared-types';
import { formatNumber } from '../../../shared-types';

/**
 * Default setting limits. Speed droop 1–8 %: ISO 8528-5 allows up to 8 % frequency droop in
 * class G1 (value from memory); below about 1 % a droop set hunts against its neighbours
 * (common practice). Reactive droop 1–10 % (common practice: 3–5 % at rated current and
 * 0.8 PF). No-load frequency and voltage within ±10 % of rated: the usual adjustment range of a
 * speed-setting and a voltage-setting input (common practice; verify with the maker).
 */
export const PLAN_LIMITS: PlanLimits = {
  speedDroopPct: { min: 1, max: 8 },
  reactiveDroopPct: { min: 1, max: 10 },
  noLoadHzPct: { min: 90, max: 110 },
  noLoadVPct: { min: 90, max: 110 },
};

/** The request's limits over the defaults. */
export function planLimits(over: Partial<PlanLimits> | undefined): PlanLimits {
  return { ...PLAN_LIMITS, ...over };
}

/** `v` limited to [lo, hi]. */
export function clamp(v: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, v));
}

/** Rounds for display in sentences (the shared number format). */
export function fmt(v: number, digits: number): string {
  return formatNumber(v, digits);
}
