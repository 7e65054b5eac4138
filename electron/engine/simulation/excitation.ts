/**
 * Excitation figures derived from a set's machine data: the field needed at rated load and
 * rated power factor, and the field ceiling (the plant's own, or one derived from that field).
 *
 * The field at rated load is worked out in the simulator's own machine model (one-axis model,
 * Sauer & Pai, *Power System Dynamics and Stability* (1998), §6.6, with X_q = X'd as in
 * `machine.ts`): with the terminal voltage V = 1 pu and rated current I = 1 pu at rated power
 * factor (lagging),
 *
 *   E' = V + j X'd I,  δ = ∠E',  I_d = component of I on the d-axis,
 *   E_fd = |E'| + (X d − X'd) I_d − E_res
 *
 * (the steady state of the field equation T'd0 dE'q/dt = E_fd + E_res − E'q − (X d − X'd) I_d).
 * With X d 2.5, X'd 0.25, 0.8 PF and E_res 0.03 this is 2.78 pu.
 */
import { formatNumber, formatPU, SET_DEFAULTS } from '../../../shared-types';
import type { GenSet } from '../../../shared-types';

/** Where a set's field ceiling comes from, with the figures behind it. */
export interface FieldCeiling {
  /** Ceiling the simulator uses, pu. */
  ceilingPU: number;
  /** Field voltage at rated kVA and rated power factor, rated voltage, pu. */
  ratedFieldPU: number;
  /** True when the plant file gives no ceiling and it was derived. */
  derived: boolean;
  /** Margin of the ceiling over the rated-load field, % of that field. */
  marginPct: number;
  /** One sentence: where the ceiling comes from. */
  reason: string;
  /** A sentence when the margin is below `SET_DEFAULTS.fieldCeilingMarginPct`, else null. */
  warning: string | null;
}

/** Field voltage at rated load and rated power factor, pu (see the file header). */
export function ratedLoadFieldPU(set: Pick<GenSet, 'ratedPF' | 'machine' | 'regulator'>): number {
  const { xdPU, xdpPU } = set.machine;
  const x1 = Math.min(xdpPU, xdPU);
  const pf = set.ratedPF;
  const sin = Math.sqrt(Math.max(0, 1 - pf * pf));
  // I = pf − j sin φ; E' = 1 + j X'd I.
  const eRe = 1 + x1 * sin;
  const eIm = x1 * pf;
  const e = Math.hypot(eRe, eIm);
  const s = eIm / e;
  const c = eRe / e;
  // I_d = Re(I) sin δ − Im(I) cos δ (rotor frame of machine.ts).
  const id = pf * s + sin * c;
  return e + (xdPU - x1) * id - set.regulator.residualPU;
}

/** The set's field ceiling: its own, or `fieldCeilingFactor` × the rated-load field. */
export function fieldCeiling(set: Pick<GenSet, 'ratedPF' | 'machine' | 'regulator'>): FieldCeiling {
  const ratedFieldPU = ratedLoadFieldPU(set);
  const own = set.regulator.ceilingPU;
  const derived = own === undefined;
  const ceilingPU = own ?? SET_DEFAULTS.fieldCeilingFactor * ratedFieldPU;
  const marginPct = (ceilingPU / ratedFieldPU - 1) * 100;
  const reason = derived
    ? `${SET_DEFAULTS.fieldCeilingFactor} × the field at rated load and ${set.ratedPF} power factor (${formatPU(ratedFieldPU)} from X d and X'd), so the set accepts a rated load step`
    : `set in the plant file; the field at rated load and ${set.ratedPF} power factor is ${formatNumber(ratedFieldPU, 2)} pu`;
  const warning =
    marginPct < SET_DEFAULTS.fieldCeilingMarginPct
      ? `The field ceiling ${formatNumber(ceilingPU, 2)} pu is only ${formatNumber(marginPct, 0)} % above the ${formatNumber(ratedFieldPU, 2)} pu field at rated load (less than ${SET_DEFAULTS.fieldCeilingMarginPct} %): a large load step may pull the voltage down and hold it there.`
      : null;
  return { ceilingPU, ratedFieldPU, derived, marginPct, reason, warning };
}
