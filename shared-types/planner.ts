/**
 * Droop planner, sensitivity matrix and setpoint-tolerance analysis: requests and results
 * (`planDroop`, `sharingSensitivity`, `toleranceAnalysis`).
 */
import type { SetCharacteristics } from './describe';
import type { Plant } from './plant';
import type { LoadOverride } from './sharing';

/** A closed interval, in the unit its field names. */
export interface Band {
  min: number;
  max: number;
}

/** A setting the planner may be told to keep as it is on one set. */
export const PLAN_FIELDS = ['droopPct', 'noLoadHz', 'reactiveDroopPct', 'noLoadV'] as const;
export type PlanField = (typeof PLAN_FIELDS)[number];

/** Limits the planner keeps each set's settings within. */
export interface PlanLimits {
  /** Speed droop, % (default 1–8 %). */
  speedDroopPct: Band;
  /** Reactive droop, % (default 1–10 %). */
  reactiveDroopPct: Band;
  /** No-load frequency, % of rated frequency (default 90–110 %). */
  noLoadHzPct: Band;
  /** No-load voltage, % of rated voltage (default 90–110 %). */
  noLoadVPct: Band;
}

/** Request of `planDroop`. */
export interface PlanRequest {
  plant: Plant;
  /** The band the bus frequency must stay in, Hz. */
  frequencyBandHz: Band;
  /** The band the bus voltage must stay in, V line-to-line. */
  voltageBandV: Band;
  /** Load range, % of the online sets' rated kW (default 0–100). */
  loadRangePct?: Band;
  /** Power factor of the load across the range (lagging, default 0.8). */
  pf?: number;
  /** Settings kept as they are on the named sets. */
  fixed?: { setId: string; fields: PlanField[] }[];
  /** Limits of the settings (defaults in `PLAN_LIMITS`). */
  limits?: Partial<PlanLimits>;
}

/** The proposed settings of one set. */
export interface PlanSetting {
  id: string;
  name: string;
  /** The planner chose this set's governor settings (droop mode, online). */
  governorPlanned: boolean;
  /** The planner chose this set's regulator settings (reactive-droop mode, online). */
  regulatorPlanned: boolean;
  droopPct: number;
  noLoadHz: number;
  reactiveDroopPct: number;
  noLoadV: number;
  /** The set's reactive slope seen at the bus, V per (kVAR per kVA): reactive droop plus feeder reactance. */
  busSlopeVPerKVARPerKVA: number | null;
}

/** One load point of the check through the sharing solver. */
export interface PlanPoint {
  loadPct: number;
  loadKW: number;
  loadKVAR: number;
  frequencyHz: number | null;
  voltageV: number | null;
  /** Largest |kW sharing error| of the online sets, % of rated kW. */
  worstKWErrorPct: number | null;
  /** Largest |kVAR sharing error| of the online sets, % of rated kVA. */
  worstKVARErrorPct: number | null;
  setKW: (number | null)[];
  setKVAR: (number | null)[];
  /** Why no steady state exists at this point. */
  error?: string;
  /** How the point was solved when not exactly as asked (e.g. no load checked at a trace of load). */
  note?: string;
}

/** The check of a plant (current or proposed) across the load range. */
export interface PlanCheck {
  points: PlanPoint[];
  /** Largest |kW sharing error| over every point, % of rated kW (null: no point solved). */
  worstKWErrorPct: number | null;
  worstKVARErrorPct: number | null;
}

/** Whether one band is held across the load range. */
export interface BandVerdict {
  quantity: 'frequency' | 'voltage';
  min: number;
  max: number;
  /** Lowest and highest bus value over the points that solved. */
  lowest: number | null;
  highest: number | null;
  met: boolean;
  /** How far outside the band the bus goes (Hz or V; 0 when met). */
  shortBy: number;
  sentence: string;
}

/** Result of `planDroop`. */
export interface PlanResult {
  /** Every band is met at every checked load point. */
  feasible: boolean;
  /** The proposed plant: the input with the planned settings (a complete, valid plant). */
  plant: Plant;
  settings: PlanSetting[];
  current: PlanCheck;
  proposal: PlanCheck;
  bands: BandVerdict[];
  /** Why a band or a limit cannot be met, with the amount (empty when feasible). */
  reasons: string[];
  /** One sentence per choice: what it buys and what it costs. */
  tradeoffs: string[];
  /** Sets left as they were, and why. */
  notes: string[];
  /** Set ids in the order of `setKW` / `setKVAR` of the points. */
  setIds: string[];
  /** Each set's characteristics (in `setIds` order), now and as proposed, for the droop-line charts. */
  characteristics: { current: SetCharacteristics[]; proposal: SetCharacteristics[] };
}

/** Request of `sharingSensitivity`. */
export interface SensitivityRequest {
  plant: Plant;
  load?: LoadOverride;
}

/** One entry of the sensitivity matrix, ranked by size. */
export interface SensitivityEntry {
  /** 'speed': per 0.1 Hz of speed setpoint; 'voltage': per 1 % of voltage setpoint. */
  cause: 'speed' | 'voltage';
  /** The set whose setpoint is in error. */
  fromId: string;
  /** The set whose output moves. */
  toId: string;
  quantity: 'kW' | 'kVAR';
  value: number;
}

/** Result of `sharingSensitivity`: rows are the affected sets, columns the set whose setpoint moves. */
export interface SensitivityResult {
  setIds: string[];
  /** kW gained by row set per +0.1 Hz of column set's speed setpoint. */
  kWPerSpeed: number[][];
  /** kVAR gained by row set per +0.1 Hz of column set's speed setpoint. */
  kVARPerSpeed: number[][];
  /** kW gained by row set per +1 % (of rated voltage) of column set's voltage setpoint. */
  kWPerVoltage: number[][];
  kVARPerVoltage: number[][];
  /** Bus frequency (Hz) and voltage (V) change per column set's step. */
  busHzPerSpeed: number[];
  busVPerVoltage: number[];
  /** 'closed-form' (droop sets, no feeders, constant-power loads) or 'finite-difference' (central, of `solveSharing`). */
  method: 'closed-form' | 'finite-difference';
  /** The largest entries, biggest first (up to six). */
  largest: SensitivityEntry[];
}

/** How a tolerance is spread. */
export const TOLERANCE_DISTRIBUTIONS = ['uniform', 'normal'] as const;
export type ToleranceDistribution = (typeof TOLERANCE_DISTRIBUTIONS)[number];

/** Request of `toleranceAnalysis`. */
export interface ToleranceRequest {
  plant: Plant;
  /** Number of samples (default 10 000). */
  samples?: number;
  /** Seed of the random generator (default 1). */
  seed?: number;
  /** ± Hz on every set's speed setpoint (no-load frequency or isochronous setpoint). */
  speedTolHz?: number;
  /** ± % of rated voltage on every set's voltage setpoint. */
  voltageTolPct?: number;
  /** ± % of value on each set's speed and reactive droop. */
  droopTolPct?: number;
  /** uniform: the tolerance is the half-width; normal: it is 2 σ. Default uniform. */
  distribution?: ToleranceDistribution;
  /** One constant-power load instead of the plant's loads. */
  load?: LoadOverride;
  /** Instead of one point: each sample's load drawn uniformly in this range, % of online rated kW, at `pf`. */
  loadRangePct?: Band;
  /** Power factor of the load range (default 0.8). */
  pf?: number;
  /** Histogram bins (default 30). */
  bins?: number;
}

/** Mean, standard deviation and percentiles of one figure, with its histogram. */
export interface Distribution {
  mean: number;
  std: number;
  p5: number;
  p50: number;
  p95: number;
  min: number;
  max: number;
  /** Bin edges (bins + 1) and counts. */
  edges: number[];
  counts: number[];
}

/** One set's figures over the samples that solved. */
export interface SetTolerance {
  id: string;
  name: string;
  kW: Distribution;
  kVAR: Distribution;
  /** kW as % of rated kW. */
  loadingPct: Distribution;
  circulatingA: Distribution;
  /** Fraction of samples (of all samples) in which this set exceeds its rating / overload / trips. */
  pExceedsRating: number;
  pOverload: number;
  pReversePower: number;
}

/** Result of `toleranceAnalysis`. */
export interface ToleranceResult {
  samples: number;
  seed: number;
  /** Samples that had a steady state (the figures are over these). */
  solved: number;
  /** Samples with no steady state (counted against every probability below as "not known safe"). */
  noSteadyState: number;
  /** One example reason for a sample with no steady state. */
  noSteadyStateReason?: string;
  sets: SetTolerance[];
  bus: { frequencyHz: Distribution; voltageV: Distribution };
  /** Fractions of all samples (0..1). */
  probabilities: {
    /** Any online set's kW above rated kW or kVA above rated kVA. */
    exceedsRating: number;
    /** Any online set's kW above rated kW × overloadPct/100. */
    overload: number;
    /** Any online set's kW below −rated kW × reversePowerTripPct/100. */
    reversePower: number;
    /** No steady state. */
    noSteadyState: number;
  };
}
