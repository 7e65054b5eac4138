/**
 * Which field of a set is its speed setpoint and which its voltage setpoint, by control mode:
 * the one home of that mapping for the sensitivity matrix and the tolerance analysis.
 */
import type { GenSet } from '../../../shared-types';

/** Adds `dHz` to the set's speed setpoint (no-load frequency in droop, setpoint when isochronous); false for base load. */
export function nudgeSpeed(s: GenSet, dHz: number): boolean {
  if (s.governor.mode === 'droop') s.governor.noLoadHz += dHz;
  else if (s.governor.mode === 'isochronous') s.governor.setpointHz += dHz;
  else return false;
  return true;
}

/** Adds `dV` to the set's voltage setpoint (no-load voltage in reactive droop, setpoint in voltage or cross-current); false in power-factor mode. */
export function nudgeVoltage(s: GenSet, dV: number): boolean {
  if (s.regulator.mode === 'reactive-droop') s.regulator.noLoadV += dV;
  else if (s.regulator.mode === 'voltage' || s.regulator.mode === 'cross-current') s.regulator.setpointV += dV;
  else return false;
  return true;
}

/** A copy of `s` whose governor and regulator may be changed without touching `s`. */
export function workingSet(s: GenSet): GenSet {
  return { ...s, governor: { ...s.governor }, regulator: { ...s.regulator } };
}
