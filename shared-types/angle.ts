/**
 * The one home of the phase-angle laws, shared by the engine and the renderer (pure functions, no state): the wrap
 * to (−180°, 180°], the angle a slip carries a phasor to after a time, and the close-command and contact angles
 * of a breaker that takes its closing time (one sign convention: the incoming phasor gains `360 s` degrees a second). The engine imports them (sync, trainer,
 * simulator); the renderer uses `angleAfterDeg` to run the scope on at 60 frames a second from the engine's last
 * angle and slip, between two engine results, so that it computes nothing of its own.
 */

/** Wraps an angle to (−180°, 180°]: 180 stays 180, −180 becomes 180, 190 becomes −170. */
export function wrapAngleDeg(angleDeg: number): number {
  let a = angleDeg % 360;
  if (a > 180) a -= 360;
  else if (a <= -180) a += 360;
  return a;
}

/** The angle `dtS` seconds on at slip `slipHz` (the incoming phasor gains 360 s degrees a second), wrapped. */
export function angleAfterDeg(angleDeg: number, slipHz: number, dtS: number): number {
  return wrapAngleDeg(angleDeg + 360 * slipHz * dtS);
}

/** Phase angle at which to issue the close command so contact lands at 0°: `−360 s t` (t the breaker closing time), wrapped, degrees. */
export function closeCommandAngleDeg(slipHz: number, breakerClosingMs: number): number {
  return wrapAngleDeg(-360 * slipHz * (breakerClosingMs / 1000));
}

/** Angle at contact for a close command issued at `angleDeg`: `angle + 360 s t`, wrapped, degrees. */
export function angleAtContactDeg(angleDeg: number, slipHz: number, breakerClosingMs: number): number {
  return angleAfterDeg(angleDeg, slipHz, breakerClosingMs / 1000);
}
