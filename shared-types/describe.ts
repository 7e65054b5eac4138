/** Rated figures derived from a plant file (`describePlant`). */

/** One set's rated figures. */
export interface SetDescription {
  id: string;
  name: string;
  online: boolean;
  /** Rated speed `n = 120 f / poles`, rpm. */
  ratedSpeedRpm: number;
  /** Rated line current `I = S / (sqrt(3) V)`, A. */
  ratedCurrentA: number;
  ratedKW: number;
  ratedKVA: number;
  /** Reactive base `Qbase = ratedKVA * sqrt(1 - ratedPF^2)`, kVAR. */
  kVARBase: number;
  /** Field voltage at rated kVA and rated power factor, pu (the simulator's machine model). */
  ratedFieldPU: number;
  /** Field ceiling the simulator uses, pu, whether it was derived, why, and a low-margin warning. */
  fieldCeilingPU: number;
  fieldCeilingDerived: boolean;
  fieldCeilingReason: string;
  fieldCeilingWarning: string | null;
  /** The set's capability chart (limit curves in kW and kVAR). */
  capability: SetCapability;
}

/** A point of a capability curve, kW and kVAR (generator convention, kVAR > 0 lagging). */
export interface CapabilityPoint {
  kW: number;
  kVAR: number;
}

/**
 * A set's capability chart: stator-current circle (rated kVA), field-heating limit (the field
 * at rated kVA and rated PF), leading (under-excitation) limit, engine limits. Curves are
 * point lists; straight limits are single numbers.
 */
export interface SetCapability {
  id: string;
  ratedKW: number;
  ratedKVA: number;
  /** The governor's fuel limit (overload limit), kW. */
  overloadKW: number;
  /** Power absorbed at zero fuel (motoring power), kW, positive. */
  motoringKW: number;
  /** Reverse power at the 32 setting, kW, positive. */
  reverseTripKW: number;
  /** Leading (under-excitation) limit, kVAR, negative. */
  leadingKVAR: number;
  /** Field EMF at rated kVA and rated PF, pu (one-axis, round rotor, rated voltage). */
  fieldEmfPU: number;
  /** kVAR at rated kVA and rated PF (the rated point lies on both the stator and the field curve). */
  ratedKVAR: number;
  /** The chart's kW range. */
  minChartKW: number;
  maxChartKW: number;
  /** Stator-current limit: the rated-kVA half circle from full leading to full lagging. */
  stator: CapabilityPoint[];
  /** Field-heating limit over the chart's kW range. */
  field: CapabilityPoint[];
}

/** Plant totals and each set's rated figures. */
export interface PlantDescription {
  name: string;
  ratedFrequencyHz: number;
  ratedVoltageV: number;
  sets: SetDescription[];
  /** Sum over online sets, kW. */
  onlineKW: number;
  /** Sum over online sets, kVA. */
  onlineKVA: number;
  /** Sum over all sets, kW. */
  installedKW: number;
  /** Sum over all sets, kVA. */
  installedKVA: number;
  /** Connected load at rated voltage and frequency, kW and kVAR. */
  loadKW: number;
  loadKVAR: number;
  /** Set-points outside their usual range, one sentence each (warnings, not refusals). */
  settingWarnings: string[];
}
