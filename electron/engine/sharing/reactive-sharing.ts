/**
 * Reactive-power sharing on a common bus without feeders (closed forms).
 *
 * Reactive droop: `V = V_nl − droop · V_rated · Q / Qbase`, so
 * `Q = Qbase (V_nl − V) / (droop · V_rated)` (the reactive-droop definition of the README).
 * Power-factor control: `Q = P tan φ`. The voltage unit (one voltage-mode set, or the
 * cross-current group sharing in proportion to `ratedKVA`) holds its setpoint and takes
 * the remainder. Without a voltage unit the droop sets set the voltage: with loads of
 * constant power, constant current and constant impedance (ZIP, `bus-loads.ts`) the balance is
 * the quadratic `c V² + A V − B = 0` (the constant-current part joins A), solved in the
 * cancellation-free form `V = 2B / (A + √(A² + 4cB))`. The loads' kVAR is taken at the
 * frequency of the active solve (`frequencyHz`).
 *
 * Regulator limiters: a set in reactive droop or power-factor control is held inside its
 * field-heating limit (lagging kVAR at its kW, `capability.ts`) and its leading limit; a set
 * held at a limit gives that kVAR whatever the voltage, so the balance is walked over the
 * segments where sets are held (each step solves the quadratic exactly with the held sets as
 * constants), with bisection as the fallback.
 */
import { NoSteadyState } from '../errors';
import { busLoadKVAR, busLoadKVARQuadratic } from './bus-loads';
import * as codes from '../mode-codes';
import type { SharingModel } from './sharing-model';
import { fieldLimitKVAR } from '../capability';

// Module-local copies: hot loops compare against plain constants, not live import bindings.
const REG_DROOP = codes.REG_DROOP;
const REG_PF = codes.REG_PF;

/** kVAR of a reactive-droop set at terminal voltage `voltageV` (its droop line, limits not applied). */
export function droopKVAR(m: SharingModel, i: number, voltageV: number): number {
  return m.slopeKVARPerV[i]! * (m.noLoadV[i]! - voltageV);
}

/** Upper kVAR limit of set i at output `kW`: the field-heating limit for a limited regulator, else none. */
export function upperKVAR(m: SharingModel, i: number, kW: number): number {
  return m.limited[i] && m.holdField ? fieldLimitKVAR(m.sets[i]!, kW) : Infinity;
}

/** Lower kVAR limit of set i: the leading limit for a limited regulator, else none. */
export function lowerKVAR(m: SharingModel, i: number): number {
  return m.limited[i] ? m.leadKVAR[i]! : -Infinity;
}

/**
 * `q` held inside set i's regulator limits at output `kW`. Where the field circle and the
 * leading limit cross (far beyond rating) the field limit wins: the leading limit is a floor
 * the regulator cannot keep.
 */
export function limitKVAR(m: SharingModel, i: number, kW: number, q: number): number {
  const hi = upperKVAR(m, i, kW);
  const lo = lowerKVAR(m, i);
  if (q > hi) return hi;
  if (q < lo) return lo > hi ? hi : lo;
  return q;
}

const MAX_WALK = 40;
const MAX_BISECTIONS = 200;

/**
 * Bus voltage and each set's kVAR (written to `q`) given each set's kW in `p`.
 * @throws NoSteadyState when the droop sets cannot meet the reactive load at any positive voltage.
 */
export function solveReactive(m: SharingModel, p: Float64Array, q: Float64Array, frequencyHz: number): { voltageV: number; loadKVAR: number } {
  const vr = m.ratedVoltageV;
  const fr = m.ratedFrequencyHz;
  const f = frequencyHz;
  let qPF = 0;
  for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_PF) qPF += q[i] = limitKVAR(m, i, p[i]!, p[i]! * m.tanPhi[i]!);

  if (m.voltageUnit.length > 0) {
    const v = m.voltageSetpointV;
    const loadKVAR = busLoadKVAR(m.loads, v, f, vr, fr);
    let others = qPF;
    for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_DROOP) others += q[i] = limitKVAR(m, i, p[i]!, droopKVAR(m, i, v));
    const unitKVAR = loadKVAR - others;
    let kva = 0;
    for (const i of m.voltageUnit) kva += m.ratedKVA[i]!;
    for (const i of m.voltageUnit) q[i] = (unitKVAR * m.ratedKVA[i]!) / kva;
    return { voltageV: v, loadKVAR };
  }

  const { constant, perV, perV2 } = busLoadKVARQuadratic(m.loads, f, vr, fr);
  // The exact balance voltage with the droop sets held as they are at `vAt` (NaN: none, or
  // no positive root). vAt = NaN: no set held (the plain droop lines).
  const segment = (vAt: number): number => {
    let a = perV;
    let b = qPF - constant;
    for (let i = 0; i < m.n; i++) {
      if (m.reg[i] !== REG_DROOP) continue;
      // vAt = NaN: the plain droop lines (comparing NaN with itself would say "held" for every set).
      const raw = Number.isNaN(vAt) ? 0 : droopKVAR(m, i, vAt);
      const held = Number.isNaN(vAt) ? raw : limitKVAR(m, i, p[i]!, raw);
      if (held !== raw) b += held;
      else {
        a += m.slopeKVARPerV[i]!;
        b += m.slopeKVARPerV[i]! * m.noLoadV[i]!;
      }
    }
    if (a === 0 && perV2 === 0) return NaN;
    const disc = a * a + 4 * perV2 * b;
    return disc >= 0 ? (2 * b) / (a + Math.sqrt(disc)) : NaN;
  };
  const balance = (v: number): number => {
    let s = qPF;
    for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_DROOP) s += limitKVAR(m, i, p[i]!, droopKVAR(m, i, v));
    return s - busLoadKVAR(m.loads, v, f, vr, fr);
  };
  const tol = 1e-12 * (busLoadKVAR(m.loads, vr, f, vr, fr) + m.ratedVoltageV + 1);
  let v = segment(NaN);
  for (let k = 0; k < MAX_WALK && v > 0 && Number.isFinite(v); k++) {
    const next = segment(v);
    if (!(next > 0) || !Number.isFinite(next) || next === v) break;
    v = next;
  }
  if (!(v > 0 && Number.isFinite(v) && Math.abs(balance(v)) <= tol)) {
    // Bisection on the balance, which falls as the voltage rises (droop and held sets give
    // less or the same, the load takes more or the same).
    let lo = 1e-6 * vr;
    let hi = 4 * vr;
    if (balance(lo) < 0 || balance(hi) > 0) v = NaN;
    else {
      for (let k = 0; k < MAX_BISECTIONS && hi - lo > 1e-13 * vr; k++) {
        const mid = 0.5 * (lo + hi);
        if (balance(mid) >= 0) lo = mid;
        else hi = mid;
      }
      v = 0.5 * (lo + hi);
      const exact = segment(v);
      if (exact > 0 && Number.isFinite(exact) && Math.abs(balance(exact)) <= Math.abs(balance(v))) v = exact;
    }
  }
  if (!(v > 0) || !Number.isFinite(v)) {
    throw new NoSteadyState(
      `The reactive load (${Math.round(busLoadKVAR(m.loads, vr, f, vr, fr))} kVAR at rated voltage) is more than the sets in reactive droop can supply at any voltage within their field limits: the voltage would collapse. Raise the no-load voltages, add a set, or compensate the load.`,
    );
  }
  for (let i = 0; i < m.n; i++) if (m.reg[i] === REG_DROOP) q[i] = limitKVAR(m, i, p[i]!, droopKVAR(m, i, v));
  return { voltageV: v, loadKVAR: busLoadKVAR(m.loads, v, f, vr, fr) };
}
