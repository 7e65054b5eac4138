/**
 * A set's capability chart (generator convention, kW across, kVAR up, Q > 0 lagging):
 * the region bounded by
 * - stator current: the circle P² + Q² = ratedKVA²;
 * - field heating: the field current at rated kVA and rated power factor is the limit. With
 *   the one-axis round-rotor model at rated terminal voltage (V = 1 pu), the field EMF is
 *   `E = |V + j Xd I|`, `I = (P − jQ) / V`, so `E_rated = √((1 + Xd sin φ)² + (Xd cos φ)²)`
 *   and the limit is the circle `(1 + Xd Q)² + (Xd P)² = E_rated²` (pu on ratedKVA): centre
 *   (0, −1/Xd), radius `E_rated / Xd` (closed form; the construction of every generator
 *   capability chart, e.g. Kundur, Power System Stability and Control, §5.4, section number from memory);
 * - under-excitation: the leading limit `−leadingKVARLimitPct / 100 · ratedKVA`;
 * - the engine: the overload (fuel) limit, with `ratedKW` the continuous rating, and on the
 *   left zero fuel (−motoring power) and the reverse-power (32) setting.
 * Pure; the renderer draws these curves.
 */
import type { GenSet, SetCapability, CapabilityPoint } from '../../shared-types';
import { kVARBase } from '../../shared-types';
import { motoringKW, overloadLimitKW, reverseTripKW } from './sharing/set-limits';

/** Field EMF at rated kVA and rated power factor, pu (one-axis, round rotor, V = 1 pu). */
export function ratedFieldEmfPU(xdPU: number, ratedPF: number): number {
  const sin = Math.sqrt(Math.max(0, 1 - ratedPF * ratedPF));
  // sqrt of the sum of squares rather than Math.hypot (several times slower in V8); the terms are of order 1,
  // so nothing overflows or underflows.
  const a = 1 + xdPU * sin;
  const b = xdPU * ratedPF;
  return Math.sqrt(a * a + b * b);
}

/**
 * Lagging kVAR on the field-heating limit at output `kW` (rated voltage): from
 * `(1 + Xd q)² + (Xd p)² = E_rated²`, `q = (√(E_rated² − (Xd p)²) − 1) / Xd` (pu on ratedKVA).
 * −Infinity where `kW` lies beyond the field circle.
 */
export function fieldLimitKVAR(set: GenSet, kW: number): number {
  const xd = set.machine.xdPU;
  const e = ratedFieldEmfPU(xd, set.ratedPF);
  const xp = (xd * kW) / set.ratedKVA;
  const r = e * e - xp * xp;
  if (!(r >= 0)) return -Infinity;
  return (set.ratedKVA * (Math.sqrt(r) - 1)) / xd;
}

/** d(fieldLimitKVAR)/d(kW) at `kW` (0 beyond the circle). */
export function fieldLimitSlope(set: GenSet, kW: number): number {
  const xd = set.machine.xdPU;
  const e = ratedFieldEmfPU(xd, set.ratedPF);
  const xp = (xd * kW) / set.ratedKVA;
  const r = e * e - xp * xp;
  if (!(r > 0)) return 0;
  return -xp / Math.sqrt(r);
}

/** Leading (under-excitation) limit, kVAR (negative): `−leadingKVARLimitPct / 100 · ratedKVA`. */
export function leadingLimitKVAR(set: GenSet): number {
  return (-set.leadingKVARLimitPct / 100) * set.ratedKVA;
}

/** Points per curve. */
const CURVE_POINTS = 73;

/**
 * The capability chart of `set`: the limit curves as point lists over the chart's kW range
 * (from a little left of the larger of motoring power and the 32 setting to the stator circle).
 */
export function setCapability(set: GenSet): SetCapability {
  const s = set.ratedKVA;
  const overKW = overloadLimitKW(set);
  const motKW = motoringKW(set);
  const tripKW = reverseTripKW(set);
  const leadKVAR = leadingLimitKVAR(set);
  const minChartKW = -1.25 * Math.max(motKW, tripKW, 0.05 * set.ratedKW);
  const maxChartKW = Math.max(s, overKW) * 1.05;
  const stator: CapabilityPoint[] = [];
  for (let k = 0; k < CURVE_POINTS; k++) {
    // From straight down (leading) round through full kW to straight up (lagging).
    const th = -Math.PI / 2 + (Math.PI * k) / (CURVE_POINTS - 1);
    stator.push({ kW: s * Math.cos(th), kVAR: s * Math.sin(th) });
  }
  const field: CapabilityPoint[] = [];
  const xd = set.machine.xdPU;
  const e = ratedFieldEmfPU(xd, set.ratedPF);
  const fieldMaxKW = Math.min(maxChartKW, (e * s) / xd);
  for (let k = 0; k < CURVE_POINTS; k++) {
    const kW = minChartKW + ((fieldMaxKW - minChartKW) * k) / (CURVE_POINTS - 1);
    const q = fieldLimitKVAR(set, kW);
    if (Number.isFinite(q)) field.push({ kW, kVAR: q });
  }
  return {
    id: set.id,
    ratedKW: set.ratedKW,
    ratedKVA: s,
    overloadKW: overKW,
    motoringKW: motKW,
    reverseTripKW: tripKW,
    leadingKVAR: leadKVAR,
    fieldEmfPU: e,
    ratedKVAR: kVARBase(s, set.ratedPF),
    minChartKW,
    maxChartKW,
    stator,
    field,
  };
}
