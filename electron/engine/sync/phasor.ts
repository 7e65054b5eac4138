/** Phase-angle arithmetic and the voltage phasor across an open breaker. */

// The angle wrap has one home, shared with the renderer (shared-types/angle.ts); the engine re-exports it here.
export { wrapAngleDeg, angleAfterDeg } from '../../../shared-types/angle';

/** The voltage difference across the open breaker as a phasor. */
export interface PhasorDifference {
  /** |ΔV|, in the unit of the inputs. */
  magnitude: number;
  /** Angle of V_incoming − V_bus from the bus phasor, degrees. */
  angleDeg: number;
}

/**
 * Phasor difference `V2∠θ − V1∠0` between the incoming voltage `v2` leading the bus voltage `v1` by `thetaDeg`.
 * Magnitude `√(V1² + V2² − 2 V1 V2 cos θ)` (law of cosines on the two phasors).
 * Any consistent unit (V or pu); returns the magnitude in that unit.
 */
export function phasorDifference(v1: number, v2: number, thetaDeg: number): PhasorDifference {
  const th = (thetaDeg * Math.PI) / 180;
  const re = v2 * Math.cos(th) - v1;
  const im = v2 * Math.sin(th);
  return { magnitude: Math.hypot(re, im), angleDeg: re === 0 && im === 0 ? 0 : (Math.atan2(im, re) * 180) / Math.PI };
}

/** |ΔV| alone, `√(V1² + V2² − 2 V1 V2 cos θ)`; allocation-free for hot loops. Never negative. */
export function deltaVMagnitude(v1: number, v2: number, thetaDeg: number): number {
  const sq = v1 * v1 + v2 * v2 - 2 * v1 * v2 * Math.cos((thetaDeg * Math.PI) / 180);
  return sq > 0 ? Math.sqrt(sq) : 0;
}
