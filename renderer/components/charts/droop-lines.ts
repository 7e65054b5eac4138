/**
 * The droop characteristics of each set, as line segments to draw; the laws are computed by the one home of the
 * generating-set laws, shared-types/laws.ts:
 * - speed droop: `f = noLoadHz − P · (droopPct/100) · f_rated / ratedKW` (the inverse of
 *   `P = ratedKW (noLoadHz − f) / (droopPct/100 · f_rated)`); isochronous: `f = setpointHz`;
 *   base load: `P = baseKW` at any frequency;
 * - reactive droop: `V = noLoadV − (droopPct/100) · V_rated · Q / Qbase` with
 *   `Qbase = ratedKVA √(1 − ratedPF²)`; cross-current and voltage control: `V = setpointV`;
 *   power-factor control: `Q = P tan(acos pf)` at the set's operating kW.
 */
import type { GenSet, Plant } from '../../../shared-types';
import { kVARBase as qBaseOf, reactiveDroopV, speedDroopHz, tanPhi } from '../../../shared-types';

/** A point of a characteristic: x in kW or kVAR, y in Hz or V. */
export interface XY {
  x: number;
  y: number;
}

/** A set's characteristic: a straight segment, or a vertical line at `x` spanning the plot. */
export type Characteristic = { kind: 'segment'; points: [XY, XY] } | { kind: 'vertical'; x: number };

/** The speed characteristic of `set` (frequency, Hz, against output, kW). */
export function speedDroopLine(set: GenSet, plant: Plant): Characteristic {
  const g = set.governor;
  // Drawn between the governor's limits as the engine applies them: up to the overload (fuel)
  // limit; down to zero fuel (−motoring power) in droop, to minKW otherwise.
  const highKW = (set.ratedKW * set.overloadPct) / 100;
  const zeroFuelKW = (-set.ratedKW * set.motoringPct) / 100;
  const lowKW = g.mode === 'droop' ? zeroFuelKW : Math.min(0, Math.max(zeroFuelKW, set.minKW));
  if (g.mode === 'baseload') return { kind: 'vertical', x: g.baseKW };
  if (g.mode === 'isochronous') {
    return {
      kind: 'segment',
      points: [
        { x: lowKW, y: g.setpointHz },
        { x: highKW, y: g.setpointHz },
      ],
    };
  }
  const f = (kW: number) => speedDroopHz(g.noLoadHz, g.droopPct, plant.ratedFrequencyHz, set.ratedKW, kW);
  return {
    kind: 'segment',
    points: [
      { x: lowKW, y: f(lowKW) },
      { x: highKW, y: f(highKW) },
    ],
  };
}

/** Reactive base of `set` (the law in shared-types/laws.ts), kVAR. */
export function kVARBase(set: GenSet): number {
  return qBaseOf(set.ratedKVA, set.ratedPF);
}

/**
 * The voltage characteristic of `set` (terminal voltage, V, against kVAR), drawn from a
 * leading `fromKVAR` to a lagging `toKVAR`. A power-factor set needs its operating `kW`.
 */
export function reactiveDroopLine(set: GenSet, plant: Plant, fromKVAR: number, toKVAR: number, kW = 0): Characteristic {
  const r = set.regulator;
  if (r.mode === 'power-factor') return { kind: 'vertical', x: kW * tanPhi(r.pf) };
  if (r.mode !== 'reactive-droop') {
    return {
      kind: 'segment',
      points: [
        { x: fromKVAR, y: r.setpointV },
        { x: toKVAR, y: r.setpointV },
      ],
    };
  }
  const qBase = kVARBase(set);
  const v = (q: number) => reactiveDroopV(r.noLoadV, r.droopPct, plant.ratedVoltageV, qBase, q);
  return {
    kind: 'segment',
    points: [
      { x: fromKVAR, y: v(fromKVAR) },
      { x: toKVAR, y: v(toKVAR) },
    ],
  };
}

/** The [min, max] of `values` widened by `pad` of the span (or by `minSpan` / 2 when flat). */
export function paddedRange(values: readonly number[], pad = 0.06, minSpan = 1): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, minSpan];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  if (hi - lo < minSpan) {
    const mid = (hi + lo) / 2;
    lo = mid - minSpan / 2;
    hi = mid + minSpan / 2;
  }
  const p = (hi - lo) * pad;
  return [lo - p, hi + p];
}

/** `[lo, hi]` widened outward to multiples of half a power of ten of its span (48.5–51.5 Hz, 390–420 V). */
export function niceRange([lo, hi]: [number, number]): [number, number] {
  const span = hi - lo;
  if (!(span > 0) || !Number.isFinite(span)) return [lo, hi];
  const step = 10 ** Math.floor(Math.log10(span)) / 2;
  return [Math.floor(lo / step) * step, Math.ceil(hi / step) * step];
}

/** Points of a characteristic for a line dataset, with verticals spanning `[yLo, yHi]`. */
export function characteristicPoints(c: Characteristic, yLo: number, yHi: number): XY[] {
  return c.kind === 'segment'
    ? c.points
    : [
        { x: c.x, y: yLo },
        { x: c.x, y: yHi },
      ];
}
