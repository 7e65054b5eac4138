/** Time-domain simulation: scenarios, events and results (`simulate`). */
import type { Plant } from './plant';

export const SCENARIO_FORMAT = 'droopline.scenario' as const;

/** Events on a scenario's time line. `atS` is seconds from the start. */
export type ScenarioEvent =
  | { atS: number; type: 'load-step'; kW: number; kVAR: number; model?: 'constant-power' | 'constant-impedance' }
  | { atS: number; type: 'trip'; setId: string }
  | { atS: number; type: 'close'; setId: string; frequencyHz?: number; voltageV?: number; angleDeg?: number }
  | { atS: number; type: 'setpoint'; setId: string; frequencyHz?: number; voltageV?: number }
  | { atS: number; type: 'ramp'; setId: string; toKW: number; durationS: number }
  | { atS: number; type: 'motor-start'; kVA: number; pf: number; durationS: number };

/** A scenario file (`droopline.scenario`, `version: 1`). */
export interface Scenario {
  format?: typeof SCENARIO_FORMAT;
  version?: 1;
  name?: string;
  plant: Plant;
  durationS: number;
  /** Integration step, ms (default 1). */
  stepMs?: number;
  /** Output points kept for plotting (decimation target, default 2000). */
  outputPoints?: number;
  events: ScenarioEvent[];
}

/** ISO 8528-5 performance class. */
export type PerformanceClass = 'G1' | 'G2' | 'G3';

/** One row of the class verdict table. */
export interface ClassCheck {
  quantity: string;
  unit: string;
  measured: number | null;
  limits: Record<PerformanceClass, number>;
  pass: Record<PerformanceClass, boolean | null>;
  source: string;
}

/** Figures read off the run. */
export interface SimulationMetrics {
  frequencyNadirHz: number;
  frequencyPeakHz: number;
  frequencyDeviationPct: number;
  frequencyRecoveryS: number | null;
  voltageDipPct: number;
  voltagePeakPct: number;
  voltageRecoveryS: number | null;
  final: {
    frequencyHz: number;
    voltageV: number;
    sets: { id: string; kW: number; kVAR: number }[];
  };
  classes: ClassCheck[];
}

/** Decimated time series for plotting. Per-set arrays follow `setIds`. */
export interface SimulationSeries {
  t: number[];
  frequencyHz: number[];
  voltageV: number[];
  setIds: string[];
  setKW: number[][];
  setKVAR: number[][];
  setCurrentA: number[][];
  setSpeedHz: number[][];
}

/** Result of `simulate`. */
export interface SimulationResult {
  metrics: SimulationMetrics;
  series: SimulationSeries;
  warnings: string[];
  steps: number;
}
