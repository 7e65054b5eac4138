/**
 * The beat: the envelope of the voltage across the open breaker, |ΔV|(t) = |V_inc − V_bus| as
 * phasors (law of cosines), over a few slip cycles; the stretches where the phase angle is
 * inside the window; the moments the close command is due; and a few mains cycles of both
 * waveforms around one close command, where the individual cycles are readable. Pure functions
 * of the case; the angle at time t is the case's angle run on at the slip (`angleAfterDeg`).
 */
import { angleAfterDeg } from '../../../shared-types';

/** The two sources, per unit peak; angle of the incoming relative to the bus at t = 0, degrees. */
export interface BeatCase {
  busFrequencyHz: number;
  incomingFrequencyHz: number;
  busPU: number;
  incomingPU: number;
  angleDeg: number;
}

/** Time span covering `cycles` slip cycles (1 s at zero slip, at most `maxS`). */
export function beatSpanS(slipHz: number, cycles = 3, maxS = 60): number {
  const s = Math.abs(slipHz);
  return s < 1e-6 ? 1 : Math.min(maxS, cycles / s);
}

const slipOf = (c: BeatCase): number => c.incomingFrequencyHz - c.busFrequencyHz;

/** |ΔV| at time `tS`, pu: sqrt(Vb² + Vi² − 2 Vb Vi cos θ(t)) (law of cosines, closed form). */
export function envelopeAt(c: BeatCase, tS: number): number {
  const th = (angleAfterDeg(c.angleDeg, slipOf(c), tS) * Math.PI) / 180;
  return Math.sqrt(Math.max(0, c.busPU ** 2 + c.incomingPU ** 2 - 2 * c.busPU * c.incomingPU * Math.cos(th)));
}

/** The envelope at `n` evenly spaced times over [0, spanS] (both ends included). */
export function beatEnvelope(c: BeatCase, spanS: number, n: number): { tS: Float64Array; dvPU: Float64Array } {
  const tS = new Float64Array(n);
  const dvPU = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    tS[k] = (spanS * k) / Math.max(1, n - 1);
    dvPU[k] = envelopeAt(c, tS[k]!);
  }
  return { tS, dvPU };
}

/**
 * The stretches of [0, spanS] where the phase angle is inside ±windowDeg (closed form: the unwrapped angle
 * a0 + 360 s t within k·360° ± W), in time order. At zero slip: all of it or none.
 */
export function windowOpenSpans(c: BeatCase, spanS: number, windowDeg: number): [number, number][] {
  const s = slipOf(c);
  const w = Math.min(Math.max(windowDeg, 0), 180);
  if (!Number.isFinite(s) || !Number.isFinite(c.angleDeg) || !(spanS > 0)) return [];
  if (Math.abs(s) < 1e-9) return Math.abs(angleAfterDeg(c.angleDeg, 0, 0)) <= w ? [[0, spanS]] : [];
  const a0 = c.angleDeg;
  const a1 = a0 + 360 * s * spanS;
  const lo = Math.min(a0, a1);
  const hi = Math.max(a0, a1);
  const out: [number, number][] = [];
  for (let k = Math.floor((lo - w) / 360); k * 360 - w <= hi; k++) {
    const t0 = (k * 360 - w - a0) / (360 * s);
    const t1 = (k * 360 + w - a0) / (360 * s);
    const from = Math.max(0, Math.min(t0, t1));
    const to = Math.min(spanS, Math.max(t0, t1));
    if (to > from) out.push([from, to]);
  }
  return out.sort((x, y) => x[0] - y[0]);
}

/** The times in [0, spanS] when the angle reaches `commandAngleDeg` (the close command is due), in order. */
export function commandTimes(c: BeatCase, spanS: number, commandAngleDeg: number): number[] {
  const s = slipOf(c);
  if (!Number.isFinite(s) || Math.abs(s) < 1e-9 || !Number.isFinite(commandAngleDeg)) return [];
  const period = 1 / Math.abs(s);
  // First time the wrapped angle difference closes: (cmd − a0) / (360 s), taken modulo the slip period.
  let t = ((commandAngleDeg - c.angleDeg) / (360 * s)) % period;
  if (t < 0) t += period;
  const out: number[] = [];
  for (; t <= spanS + 1e-12; t += period) out.push(t);
  return out;
}

/** Both phase-A waveforms and their difference over `cycles` mains cycles centred on `centreS`, `n` points. */
export function waveformsAround(
  c: BeatCase,
  centreS: number,
  cycles: number,
  n: number,
): { tS: Float64Array; bus: Float64Array; incoming: Float64Array; difference: Float64Array } {
  const half = cycles / (2 * Math.max(1e-6, c.busFrequencyHz));
  const tS = new Float64Array(n);
  const bus = new Float64Array(n);
  const incoming = new Float64Array(n);
  const difference = new Float64Array(n);
  const phi = (c.angleDeg * Math.PI) / 180;
  for (let k = 0; k < n; k++) {
    const t = centreS - half + (2 * half * k) / Math.max(1, n - 1);
    tS[k] = t;
    bus[k] = c.busPU * Math.sin(2 * Math.PI * c.busFrequencyHz * t);
    incoming[k] = c.incomingPU * Math.sin(2 * Math.PI * c.incomingFrequencyHz * t + phi);
    difference[k] = incoming[k]! - bus[k]!;
  }
  return { tS, bus, incoming, difference };
}
