/**
 * Active-power sharing on a common bus without feeders (closed forms).
 *
 * Droop: `P = ratedKW (f_nl − f) / (droop · f_rated)` (the speed-droop definition) clamped
 * to [−motoring power, overload limit] (`set-limits.ts`: zero fuel below, the fuel limit
 * above); base load: `baseKW`; the isochronous group holds its
 * setpoint and shares the remainder in proportion to `ratedKW` (a load-sharing link).
 * If the group cannot take the remainder it saturates at its limit and the droop
 * sets set the frequency. Σ P_i = P_load(f) is solved by bisection on the
 * monotone balance and finished by the exact linear solve of its final segment.
 */
import { NoSteadyState } from '../errors';
import { busLoadKW, busLoadKWLinear } from './bus-loads';
import * as codes from '../mode-codes';
import type { SharingModel } from './sharing-model';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const GOV_BASE = codes.GOV_BASE;
const GOV_DROOP = codes.GOV_DROOP;
const GOV_ISO = codes.GOV_ISO;

/** How the isochronous group ended up: holding frequency, saturated, or absent. */
export type IsoState = 'none' | 'holding' | 'at-max' | 'at-min';

/** Outcome of the active-power solve; per-set kW is written to the caller's array. */
export interface ActiveSolution {
  frequencyHz: number;
  isoState: IsoState;
  loadKW: number;
}

const MAX_BISECTIONS = 200;
const MAX_WALK = 30;

/** Output of a droop or base-load set at frequency `f`, kW. */
export function governorKW(m: SharingModel, i: number, f: number): number {
  if (m.gov[i] === GOV_BASE) return m.baseKW[i]!;
  const p = m.slopeKWPerHz[i]! * (m.noLoadHz[i]! - f);
  return p > m.maxKW[i]! ? m.maxKW[i]! : p < m.minKW[i]! ? m.minKW[i]! : p;
}

/** Output of an isochronous set at group loading `lambda` (pu of ratedKW), clamped to its limits. */
export function isoKW(m: SharingModel, i: number, lambda: number): number {
  const p = lambda * m.ratedKW[i]!;
  return p > m.maxKW[i]! ? m.maxKW[i]! : p < m.minKW[i]! ? m.minKW[i]! : p;
}

/** Lowest and highest group loading at which every isochronous set is at a limit. */
export function isoLambdaRange(m: SharingModel): { lo: number; hi: number } {
  let lo = Infinity;
  let hi = -Infinity;
  for (const i of m.isoGroup) {
    lo = Math.min(lo, m.minKW[i]! / m.ratedKW[i]!);
    hi = Math.max(hi, m.maxKW[i]! / m.ratedKW[i]!);
  }
  return { lo, hi };
}

/**
 * Group loading λ at which the isochronous group gives `needKW` in total, or null if
 * the need lies outside the group's range. Exact: bisection, then the linear solve of
 * the segment where it landed.
 */
export function solveIsoLambda(m: SharingModel, needKW: number): number | null {
  const { lo, hi } = isoLambdaRange(m);
  const total = (lambda: number) => {
    let s = 0;
    for (const i of m.isoGroup) s += isoKW(m, i, lambda);
    return s;
  };
  const tol = 1e-12 * Math.max(1, Math.abs(needKW));
  if (needKW > total(hi) + tol || needKW < total(lo) - tol) return null;
  let a = lo;
  let b = hi;
  for (let k = 0; k < MAX_BISECTIONS && b - a > 1e-15; k++) {
    const mid = 0.5 * (a + b);
    if (total(mid) < needKW) a = mid;
    else b = mid;
  }
  const mid = 0.5 * (a + b);
  let fixed = 0;
  let free = 0;
  for (const i of m.isoGroup) {
    const p = mid * m.ratedKW[i]!;
    if (p >= m.maxKW[i]! || p <= m.minKW[i]!) fixed += isoKW(m, i, mid);
    else free += m.ratedKW[i]!;
  }
  if (free > 0) {
    const exact = (needKW - fixed) / free;
    if (Math.abs(total(exact) - needKW) <= Math.abs(total(mid) - needKW)) return exact;
  }
  return mid;
}

/** Frequency range over which the droop sets move between their limits (widened a little). */
function droopBracket(m: SharingModel): { lo: number; hi: number } {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < m.n; i++) {
    if (m.gov[i] !== GOV_DROOP) continue;
    const k = m.slopeKWPerHz[i]!;
    lo = Math.min(lo, m.noLoadHz[i]! - m.maxKW[i]! / k);
    hi = Math.max(hi, m.noLoadHz[i]! - m.minKW[i]! / k);
  }
  const pad = 1e-9 * Math.max(1, Math.abs(hi));
  return { lo: lo - pad, hi: hi + pad };
}

function fmtKW(v: number): string {
  return `${Math.round(v)} kW`;
}

/** The sentence for a load beyond every set's fuel limit, with the shortfall in kW. */
export function overCapabilityMessage(loadKW: number, capabilityKW: number, afterFeederLosses = false): string {
  return `The load (${fmtKW(loadKW)}) is more than the online sets can supply at their overload limits (${fmtKW(capabilityKW)}${afterFeederLosses ? ' into the bus, after feeder losses' : ''}): ${fmtKW(loadKW - capabilityKW)} short, so there is no steady state. Bring another set online or shed load.`;
}

/** The sentence for a load below every set's lowest output, with the excess in kW. */
export function underMinimumMessage(loadKW: number, minimumKW: number): string {
  return `The load (${fmtKW(loadKW)}) is less than the sets' lowest output (${fmtKW(minimumKW)}, ${fmtKW(minimumKW - loadKW)} too much): frequency would rise until a set trips. Take a set off line or lower the base-load or minimum-output settings.`;
}

/**
 * The exact balance frequency on the segment containing `f`: with the sets clamped as they
 * are at `f`, Σ k_i (f_nl,i − f) + C = a_L + b_L (f − f_r). NaN if the segment is flat.
 */
function segmentSolve(m: SharingModel, voltageV: number, isoLambda: number | null, f: number): number {
  let sumK = 0;
  let sumKf = 0;
  let fixed = 0;
  for (let i = 0; i < m.n; i++) {
    if (m.gov[i] === GOV_DROOP) {
      const raw = m.slopeKWPerHz[i]! * (m.noLoadHz[i]! - f);
      if (raw < m.maxKW[i]! && raw > m.minKW[i]!) {
        sumK += m.slopeKWPerHz[i]!;
        sumKf += m.slopeKWPerHz[i]! * m.noLoadHz[i]!;
        continue;
      }
    }
    fixed += m.gov[i] === GOV_ISO ? isoKW(m, i, isoLambda ?? 0) : governorKW(m, i, f);
  }
  const lin = busLoadKWLinear(m.loads, voltageV, f, m.ratedVoltageV, m.ratedFrequencyHz);
  const den = sumK + lin.b;
  return den > 0 ? (sumKf + fixed - lin.a + lin.b * m.ratedFrequencyHz) / den : NaN;
}

/**
 * Solves the frequency where droop (and base-load, and saturated isochronous) sets
 * meet the load at bus voltage `voltageV`. `isoKWFixed` is the isochronous group's
 * fixed output when saturated. Writes per-set kW into `p`.
 */
function solveDroopFrequency(m: SharingModel, voltageV: number, isoLambda: number | null, p: Float64Array): number {
  const vr = m.ratedVoltageV;
  const fr = m.ratedFrequencyHz;
  const gen = (f: number) => {
    let s = 0;
    for (let i = 0; i < m.n; i++) s += m.gov[i] === GOV_ISO ? isoKW(m, i, isoLambda ?? 0) : governorKW(m, i, f);
    return s;
  };
  const h = (f: number) => gen(f) - busLoadKW(m.loads, voltageV, f, vr, fr);
  const { lo, hi } = droopBracket(m);
  const hLo = h(lo);
  if (hLo < 0) {
    throw new NoSteadyState(overCapabilityMessage(busLoadKW(m.loads, voltageV, lo, vr, fr), gen(lo)));
  }
  const hHi = h(hi);
  if (hHi > 0) {
    throw new NoSteadyState(underMinimumMessage(busLoadKW(m.loads, voltageV, hi, vr, fr), gen(hi)));
  }
  // Fast path: walk the droop segments (each step solves the balance exactly with the
  // sets clamped where they are); usually settles in two or three steps.
  const tolKW = 1e-12 * (Math.abs(gen(lo)) + busLoadKW(m.loads, voltageV, lo, vr, fr) + 1);
  let f = 0.5 * (lo + hi);
  for (let k = 0; k < MAX_WALK; k++) {
    const next = segmentSolve(m, voltageV, isoLambda, f);
    if (!Number.isFinite(next)) break;
    const clamped = next < lo ? lo : next > hi ? hi : next;
    if (clamped === f) break;
    f = clamped;
  }
  if (!(Math.abs(h(f)) <= tolKW)) {
    // Bisection, then the exact solve of the segment where it landed.
    let a = lo;
    let b = hi;
    for (let k = 0; k < MAX_BISECTIONS; k++) {
      const mid = 0.5 * (a + b);
      if (mid <= a || mid >= b) break;
      // ≥: on a flat stretch of exact balance (every set at a limit) take its high-frequency
      // end, where the droop lines actually meet the load.
      if (h(mid) >= 0) a = mid;
      else b = mid;
    }
    f = 0.5 * (a + b);
    const exact = segmentSolve(m, voltageV, isoLambda, f);
    if (Number.isFinite(exact) && Math.abs(h(exact)) <= Math.abs(h(f))) f = exact;
  }
  for (let i = 0; i < m.n; i++) p[i] = m.gov[i] === GOV_ISO ? isoKW(m, i, isoLambda ?? 0) : governorKW(m, i, f);
  return f;
}

/**
 * Active-power operating point at bus voltage `voltageV` (V line-to-line) for a bus
 * without feeders. Writes each online set's kW into `p` (length `m.n`).
 * @throws NoSteadyState when the load is beyond the sets' capability or below their minimum.
 */
export function solveActive(m: SharingModel, voltageV: number, p: Float64Array): ActiveSolution {
  const vr = m.ratedVoltageV;
  const fr = m.ratedFrequencyHz;
  if (m.isoGroup.length > 0) {
    const f = m.isoSetpointHz;
    const loadKW = busLoadKW(m.loads, voltageV, f, vr, fr);
    let others = 0;
    for (let i = 0; i < m.n; i++) if (m.gov[i] !== GOV_ISO) others += governorKW(m, i, f);
    const lambda = solveIsoLambda(m, loadKW - others);
    if (lambda !== null) {
      for (let i = 0; i < m.n; i++) p[i] = m.gov[i] === GOV_ISO ? isoKW(m, i, lambda) : governorKW(m, i, f);
      return { frequencyHz: f, isoState: 'holding', loadKW };
    }
    const { lo, hi } = isoLambdaRange(m);
    const high = loadKW - others > 0 && isoTotal(m, hi) < loadKW - others;
    let anyDroop = false;
    for (let i = 0; i < m.n; i++) if (m.gov[i] === GOV_DROOP) anyDroop = true;
    if (!anyDroop) {
      throw new NoSteadyState(high ? overCapabilityMessage(loadKW, others + isoTotal(m, hi)) : underMinimumMessage(loadKW, others + isoTotal(m, lo)));
    }
    const lambdaFixed = high ? hi : lo;
    const fd = solveDroopFrequency(m, voltageV, lambdaFixed, p);
    return { frequencyHz: fd, isoState: high ? 'at-max' : 'at-min', loadKW: busLoadKW(m.loads, voltageV, fd, vr, fr) };
  }
  const f = solveDroopFrequency(m, voltageV, null, p);
  return { frequencyHz: f, isoState: 'none', loadKW: busLoadKW(m.loads, voltageV, f, vr, fr) };
}

function isoTotal(m: SharingModel, lambda: number): number {
  let s = 0;
  for (const i of m.isoGroup) s += isoKW(m, i, lambda);
  return s;
}
