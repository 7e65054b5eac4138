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
}
