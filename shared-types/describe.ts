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
  /** The set's speed and voltage characteristics as its droop charts draw them. */
  characteristics: SetCharacteristics;
}

/** A point of a droop characteristic: x in kW (speed) or kVAR (voltage), y in Hz or V. */
export interface CharacteristicPoint {
  x: number;
  y: number;
}

/** A straight characteristic between the set's limits (a droop line, or flat at an isochronous or voltage setpoint). */
export interface CharacteristicSegment {
  kind: 'segment';
  points: [CharacteristicPoint, CharacteristicPoint];
}

/** A characteristic that holds x whatever y is (a base-load set's kW): a vertical line spanning the chart. */
export interface CharacteristicVertical {
  kind: 'vertical';
  x: number;
}

/**
 * A power-factor regulator's characteristic: it holds `kVAR = kVARPerKW · kW` (tan φ of its setpoint) whatever the
 * voltage, i.e. a vertical line at its operating kW times `kVARPerKW`.
 */
export interface CharacteristicPowerFactor {
  kind: 'power-factor';
  pf: number;
  kVARPerKW: number;
}

/** The speed characteristic: frequency (Hz) against output (kW). */
export type SpeedCharacteristic = CharacteristicSegment | CharacteristicVertical;
/** The voltage characteristic: terminal voltage (V) against reactive output (kVAR, + lagging). */
export type VoltageCharacteristic = CharacteristicSegment | CharacteristicPowerFactor;

/**
 * A set's characteristics, computed by the engine (`electron/engine/characteristics.ts`) so that every chart — the
 * Sharing and Planner views' and the report's — draws the same lines without computing a law:
 * - speed: droop `f = f_nl − (R/100) f_r P / P_r` from zero fuel (−motoring power) to the overload (fuel) limit;
 *   isochronous flat at `setpointHz` from the lower of 0 and `minKW` to the overload limit; base load vertical at
 *   `baseKW`;
 * - voltage: reactive droop `V = V_nl − (R_Q/100) V_r Q / Qbase` from the leading (under-excitation) limit to the
 *   field-heating limit at zero kW; cross-current and voltage control flat at `setpointV` over the same span;
 *   power-factor control `Q = P tan φ`.
 */
export interface SetCharacteristics {
  speed: SpeedCharacteristic;
  voltage: VoltageCharacteristic;
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
