/**
 * Samples for the beat display: one phase of bus and incoming voltage and their
 * difference, reduced to a min/max band per pixel column so 50 Hz over tens of seconds
 * draws honestly (the band is the waveform's extent in that column).
 */

/** The two sources, per unit peak; angle of the incoming relative to the bus at t = 0, degrees. */
export interface BeatCase {
  busFrequencyHz: number;
  incomingFrequencyHz: number;
  busPU: number;
  incomingPU: number;
  angleDeg: number;
}

/** Min/max per column for bus, incoming and difference, and the difference's envelope. */
export interface BeatBands {
  spanS: number;
  busMin: Float64Array;
  busMax: Float64Array;
  incMin: Float64Array;
  incMax: Float64Array;
  diffMin: Float64Array;
  diffMax: Float64Array;
  /** Peak of the difference, |V_inc − V_bus| as phasors, at each column's centre. */
  envelope: Float64Array;
}

/** Time span covering `cycles` slip cycles (1 s at zero slip, at most `maxS`). */
export function beatSpanS(slipHz: number, cycles = 3, maxS = 60): number {
  const s = Math.abs(slipHz);
  return s < 1e-6 ? 1 : Math.min(maxS, cycles / s);
}

/** Bands over [0, spanS] in `columns` columns, `perColumn` samples in each. */
export function beatBands(c: BeatCase, spanS: number, columns: number, perColumn = 24): BeatBands {
  const mk = (): Float64Array => new Float64Array(columns);
  const b: BeatBands = { spanS, busMin: mk(), busMax: mk(), incMin: mk(), incMax: mk(), diffMin: mk(), diffMax: mk(), envelope: mk() };
  const wb = 2 * Math.PI * c.busFrequencyHz;
  const wi = 2 * Math.PI * c.incomingFrequencyHz;
  const phi = (c.angleDeg * Math.PI) / 180;
  const dt = spanS / columns;
  const env = (t: number): number => Math.sqrt(Math.max(0, c.busPU ** 2 + c.incomingPU ** 2 - 2 * c.busPU * c.incomingPU * Math.cos(phi + (wi - wb) * t)));
  // A column spanning a whole mains cycle or more holds every value of the sinusoid: its band is ± the
  // amplitude (for the difference, ± the largest envelope in the column). Sampling there would alias.
  const wholeCycles = dt * Math.min(c.busFrequencyHz, c.incomingFrequencyHz) >= 1;
  for (let k = 0; k < columns; k++) {
    if (wholeCycles) {
      const e = Math.max(env(k * dt), env((k + 0.5) * dt), env((k + 1) * dt));
      b.busMin[k] = -c.busPU;
      b.busMax[k] = c.busPU;
      b.incMin[k] = -c.incomingPU;
      b.incMax[k] = c.incomingPU;
      b.diffMin[k] = -e;
      b.diffMax[k] = e;
      b.envelope[k] = env((k + 0.5) * dt);
      continue;
    }
    let bMin = Infinity, bMax = -Infinity, iMin = Infinity, iMax = -Infinity, dMin = Infinity, dMax = -Infinity;
    for (let n = 0; n < perColumn; n++) {
      // Jitter-free, evenly spread samples; a column covers many mains cycles when the span is long.
      const t = (k + n / perColumn) * dt;
      const vb = c.busPU * Math.sin(wb * t);
      const vi = c.incomingPU * Math.sin(wi * t + phi);
      const d = vi - vb;
      if (vb < bMin) bMin = vb;
      if (vb > bMax) bMax = vb;
      if (vi < iMin) iMin = vi;
      if (vi > iMax) iMax = vi;
      if (d < dMin) dMin = d;
      if (d > dMax) dMax = d;
    }
    b.busMin[k] = bMin;
    b.busMax[k] = bMax;
    b.incMin[k] = iMin;
    b.incMax[k] = iMax;
    b.diffMin[k] = dMin;
    b.diffMax[k] = dMax;
    b.envelope[k] = env((k + 0.5) * dt);
  }
  return b;
}
