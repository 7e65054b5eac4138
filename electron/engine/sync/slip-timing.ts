/**
 * Slip timing: slip period, advance angle, how long the ±window stays open, when it next opens and closes,
 * and when to issue the close command so the contacts touch at 0°. Closed forms: advance angle 360 s t, window 2A / (360 |s|).
 *
 * The incoming set's phase angle relative to the bus moves at `360 s` degrees per second, `s = f_in − f_bus`.
 */
import { wrapAngleDeg } from './phasor';

// The advance-angle law has one home, shared with the renderer (shared-types/laws.ts); the engine re-exports it here.
export { advanceAngleDeg } from '../../../shared-types/laws';
export { angleAtContactDeg, closeCommandAngleDeg } from '../../../shared-types/angle';

/** Slip period `1 / |s|`, s; null at zero slip (the angle never moves). */
export function slipPeriodS(slipHz: number): number | null {
  return slipHz === 0 ? null : 1 / Math.abs(slipHz);
}

/** Time a ±`windowDeg` window stays open each slip cycle, `2A / (360 |s|)`, s; null at zero slip. Capped at the slip period. */
export function windowOpenS(windowDeg: number, slipHz: number): number | null {
  if (slipHz === 0) return null;
  return Math.min(2 * windowDeg, 360) / (360 * Math.abs(slipHz));
}

/** Seconds until the angle, moving at `360 s` °/s from `angleNowDeg`, first reaches `targetDeg` (≥ 0; null at zero slip unless already there). */
export function timeToAngleS(angleNowDeg: number, targetDeg: number, slipHz: number): number | null {
  const gap = wrapAngleDeg(targetDeg - angleNowDeg);
  if (slipHz === 0) return Math.abs(gap) < 1e-12 ? 0 : null;
  // Going forward (s > 0) the distance is gap mod 360 in [0, 360); backward, the mirror.
  const forward = slipHz > 0 ? gap : -gap;
  const dist = forward < 0 ? forward + 360 : forward;
  return dist / (360 * Math.abs(slipHz));
}

/** Where the ±window stands now and when it next opens and closes. */
export interface WindowTiming {
  openNow: boolean;
  /** 0 when open now; null when it never opens (zero slip outside the window). */
  opensInS: number | null;
  /** Time until it next closes; null when it never does (zero slip inside, or a window of ±180°). */
  closesInS: number | null;
}

/** Window timing for a ±`windowDeg` window at angle `angleNowDeg` and slip `slipHz`. */
export function windowTiming(angleNowDeg: number, windowDeg: number, slipHz: number): WindowTiming {
  const a = wrapAngleDeg(angleNowDeg);
  const openNow = Math.abs(a) <= windowDeg;
  if (windowDeg >= 180) return { openNow: true, opensInS: 0, closesInS: null };
  if (slipHz === 0) return { openNow, opensInS: openNow ? 0 : null, closesInS: null };
  // Moving forward the angle enters at −A and leaves at +A; backward, the other way round.
  const entry = slipHz > 0 ? -windowDeg : windowDeg;
  const exit = -entry;
  const closesAfterEntry = windowOpenS(windowDeg, slipHz)!;
  if (openNow) return { openNow, opensInS: 0, closesInS: timeToAngleS(a, exit, slipHz) };
  const opensInS = timeToAngleS(a, entry, slipHz)!;
  return { openNow, opensInS, closesInS: opensInS + closesAfterEntry };
}
