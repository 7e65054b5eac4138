/**
 * Commissioning: a load-bank test record (time, measured frequency and voltage), the test it
 * records, the fit of chosen model parameters to it, and the commissioning record of a set.
 */
import type { Plant } from './plant';
import type { ClassCheck } from './simulation';
import type { SyncLimits } from './sync';

/** Units a record's columns may be in. */
export type RecordTimeUnit = 's' | 'ms';
/** Frequency in hertz, per unit or % of the plant's rated frequency. */
export type RecordFrequencyUnit = 'Hz' | 'pu' | '%';
/** Voltage line-to-line in volts or kilovolts, or per unit / % of the plant's rated voltage. */
export type RecordVoltageUnit = 'V' | 'kV' | 'pu' | '%';
export type RecordPowerUnit = 'kW' | 'MW';
export type RecordReactiveUnit = 'kVAR' | 'MVAR';
export type RecordCurrentUnit = 'A' | 'kA';

/**
 * Which column holds each quantity: the header's name (case and spaces ignored) or its
 * 1-based number. `time`, `frequency` and `voltage` are required; the others optional.
 */
export interface RecordColumns {
  time: string | number;
  frequency: string | number;
  voltage: string | number;
  kW?: string | number;
  kVAR?: string | number;
  current?: string | number;
}

export interface RecordUnits {
  time: RecordTimeUnit;
  frequency: RecordFrequencyUnit;
  voltage: RecordVoltageUnit;
  kW?: RecordPowerUnit;
  kVAR?: RecordReactiveUnit;
  current?: RecordCurrentUnit;
}

/** `inspectTestRecord`: the header of a record and a first guess at its columns and units. */
export interface InspectRecordRequest {
  text: string;
}

export interface RecordInspection {
  /** Column names of the header line (in order). */
  headers: string[];
  /** 1-based line number of the header. */
  headerLine: number;
  /** Data rows after the header (comment and blank lines not counted). */
  dataRows: number;
  /** The first few data rows as text, for a preview. */
  sample: string[][];
  /** The columns and units guessed from the header names (the dialog's starting choice). */
  guess: { columns: Partial<RecordColumns>; units: RecordUnits };
  /** Delimiter found on the header line. */
  delimiter: ',' | ';' | '\t';
}

/** `parseTestRecord`: the record, read with the caller's column and unit choice. */
export interface ParseRecordRequest {
  text: string;
  columns: RecordColumns;
  units: RecordUnits;
  /** Base of `pu` and `%` frequency, Hz. */
  ratedFrequencyHz: number;
  /** Base of `pu` and `%` voltage, V line-to-line. */
  ratedVoltageV: number;
}

/** A test record in the engine's units (s, Hz, V, kW, kVAR, A). Time increases strictly. */
export interface TestRecord {
  tS: number[];
  frequencyHz: number[];
  voltageV: number[];
  kW?: number[];
  kVAR?: number[];
  currentA?: number[];
}

export interface ParsedTestRecord {
  record: TestRecord;
  rows: number;
  /** Comment (`#`) and blank lines passed over. */
  skippedLines: number;
  /** Things said about the import (e.g. an uneven time base). */
  notes: string[];
}

/** The test the record was taken in. */
export interface TestDescription {
  /** The set whose parameters are fitted and whose record this is (or the bus's). */
  setId: string;
  /** Sets on line during the test (the fitted set among them). */
  onlineSetIds: string[];
  /** Load on the bus before the step, kW and kVAR (constant power). */
  startKW: number;
  startKVAR: number;
  /** The load step, kW and kVAR (negative: load off). */
  stepKW: number;
  stepKVAR: number;
  /** Time of the step in the record's time base, s. */
  stepAtS: number;
  /** Where the frequency and voltage were measured: the set's terminals (speed) or the bus. Default `set`. */
  measuredAt?: 'set' | 'bus';
}

/** A model parameter a fit may change (a field path inside the set). */
export type FitParameterKey =
  | 'governor.actuatorLagS'
  | 'governor.engineLagS'
  | 'governor.droopPct'
  | 'governor.isoResetS'
  | 'machine.inertiaS'
  | 'machine.dampingPU'
  | 'machine.tdopS'
  | 'regulator.gainPU'
  | 'regulator.exciterLagS'
  | 'regulator.ceilingPU'
  | 'regulator.vhzKneeBelowHz';

/** One parameter to fit, with its bounds and (optionally) its start value (else the set's own). */
export interface FitParameterChoice {
  key: FitParameterKey;
  min: number;
  max: number;
  start?: number;
}

export interface FitRequest {
  plant: Plant;
  record: TestRecord;
  test: TestDescription;
  params: FitParameterChoice[];
  /** Iteration cap of the optimiser (default 30). */
  maxIterations?: number;
  /** Integration step of the simulations, ms (default 2). */
  stepMs?: number;
}

/** How strongly the record pins a parameter down. */
export type FitConfidence = 'well determined' | 'weakly determined' | 'not determined';

export interface FittedParameter {
  key: FitParameterKey;
  unit: string;
  start: number;
  value: number;
  min: number;
  max: number;
  /** The fitted value sits on a bound (the record may want it beyond). */
  atBound: boolean;
  /**
   * Rise of the RMS error, % of the fitted RMS error, when this parameter alone moves 10 % of its
   * bound span away from the fitted value (the larger of the two directions).
   */
  sensitivityPct: number;
  confidence: FitConfidence;
}

/** RMS error between record and model, % of rated frequency / voltage, on deviations from the pre-step value. */
export interface FitResidual {
  frequencyPct: number;
  voltagePct: number;
  /** Both together (root mean square of the two). */
  totalPct: number;
}

/** Model traces at the record's times. */
export interface FitTrace {
  tS: number[];
  frequencyHz: number[];
  voltageV: number[];
}

/** The ISO 8528-5 verdict of a measured record (the record's own figures, not the model's). */
export interface RecordVerdict {
  initialFrequencyHz: number;
  initialVoltageV: number;
  frequencyNadirHz: number;
  frequencyPeakHz: number;
  voltageMinV: number;
  voltageMaxV: number;
  /** Mean of the last tenth of the record: the steady state recovery is measured into. */
  settledFrequencyHz: number;
  settledVoltageV: number;
  frequencyRecoveryS: number | null;
  voltageRecoveryS: number | null;
  classes: ClassCheck[];
  notes: string[];
}

export interface FitResult {
  setId: string;
  parameters: FittedParameter[];
  residual: FitResidual;
  startResidual: FitResidual;
  iterations: number;
  maxIterations: number;
  /** Simulations run (each one the whole record). */
  simulations: number;
  /** Stopped by the iteration cap rather than by no further improvement. */
  stoppedAtCap: boolean;
  fitted: FitTrace;
  /** The model with the start values. */
  startTrace: FitTrace;
  /** The record as used (same times). */
  measured: FitTrace;
  measuredVerdict: RecordVerdict;
  /** The model's own ISO 8528-5 figures with the fitted values (the same test simulated). */
  modelVerdict: RecordVerdict;
  /** The plant with the fitted values in the set. */
  fittedPlant: Plant;
  /** How the comparison is made, and anything clamped or left out. */
  notes: string[];
  warnings: string[];
}

/** Sign-off of a commissioning record. */
export interface SignOff {
  by: string;
  /** Date (and time) as the technician writes it. */
  date: string;
  remarks: string;
}

/** `buildCommissioningRecord`: the printable record of what was set and measured on one set. */
export interface CommissioningRecordRequest {
  plant: Plant;
  setId: string;
  /** The fit and its measured verdict, when a record was fitted. */
  fit?: FitResult;
  /** The test, when a record was fitted. */
  test?: TestDescription;
  /** Sync-check window dialled in (the project's sync-check settings) and the breaker closing time, ms. */
  syncCheck?: { limits: SyncLimits; breakerClosingMs: number };
  signOff: SignOff;
  /** Date printed on the record (the engine has no clock). */
  date: string;
}

/** One row of a commissioning record's table. */
export interface CommissioningRow {
  section: string;
  item: string;
  unit: string;
  /** The setting to dial in, or the model's figure. */
  model: string;
  /** The measured figure from the record ("" where none). */
  measured: string;
}

export interface CommissioningRecord {
  rows: CommissioningRow[];
  csv: string;
  html: string;
}

/** A parameter a fit may change: unit, the bounds no fit may pass, and a default search range. */
export interface FitParameterInfo {
  key: FitParameterKey;
  /** The parameter in words, as the screens and the commissioning record name it. */
  label: string;
  unit: string;
  /** Bounds no fit may pass (physical sense, within the plant schema). */
  lowest: number;
  highest: number;
  /** A default search range (typical engine sets; common practice, values from memory). */
  defaultMin: number;
  defaultMax: number;
}

/** Every fittable parameter, in a fixed order (the order the screens list them). */
export const FIT_PARAMETERS: readonly FitParameterInfo[] = [
  { key: 'governor.actuatorLagS', label: 'governor actuator lag', unit: 's', lowest: 0.005, highest: 5, defaultMin: 0.01, defaultMax: 0.5 },
  { key: 'governor.engineLagS', label: 'engine lag', unit: 's', lowest: 0.005, highest: 10, defaultMin: 0.05, defaultMax: 2 },
  { key: 'governor.droopPct', label: 'speed droop (governor gain 1/droop)', unit: '%', lowest: 0.1, highest: 20, defaultMin: 1, defaultMax: 8 },
  { key: 'governor.isoResetS', label: 'isochronous reset time (1 / integral gain)', unit: 's', lowest: 0.05, highest: 60, defaultMin: 0.2, defaultMax: 10 },
  { key: 'machine.inertiaS', label: 'inertia constant H', unit: 's', lowest: 0.05, highest: 30, defaultMin: 0.3, defaultMax: 5 },
  { key: 'machine.dampingPU', label: 'damping', unit: 'pu', lowest: 0, highest: 50, defaultMin: 0, defaultMax: 10 },
  { key: 'machine.tdopS', label: "open-circuit time constant T'd0", unit: 's', lowest: 0.1, highest: 20, defaultMin: 0.5, defaultMax: 8 },
  { key: 'regulator.gainPU', label: 'regulator gain', unit: 'pu', lowest: 0.5, highest: 1000, defaultMin: 5, defaultMax: 200 },
  { key: 'regulator.exciterLagS', label: 'exciter lag', unit: 's', lowest: 0.001, highest: 5, defaultMin: 0.01, defaultMax: 1 },
  { key: 'regulator.ceilingPU', label: 'exciter ceiling', unit: 'pu', lowest: 0.5, highest: 20, defaultMin: 1.2, defaultMax: 6 },
  { key: 'regulator.vhzKneeBelowHz', label: 'V/Hz knee below rated', unit: 'Hz', lowest: 0, highest: 10, defaultMin: 0, defaultMax: 5 },
];

/** A fit parameter in words ("inertia constant H"). */
export function fitParameterLabel(key: FitParameterKey): string {
  return FIT_PARAMETERS.find((p) => p.key === key)?.label ?? key;
}
