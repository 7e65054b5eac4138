/** Steady-state sharing: requests and results (`solveSharing`, `sweepLoad`). */
import type { PlantDescription } from './describe';
import type { Plant } from './plant';

/** Per-set conditions, as words (shown with icons and text, never colour alone). */
export type SetFlag =
  /** Above rated kW (inside the overload allowance). */
  | 'overload-kW'
  /** Above rated kVA (stator current). */
  | 'overload-kVA'
  /** Absorbing kW from the bus (any amount). */
  | 'motoring'
  /** Absorbing more kW than the reverse-power (32) setting: the relay would trip the set. */
  | 'reverse-power'
  /** At the governor's fuel limit (the overload limit). */
  | 'at-max-kW'
  /** At the lowest output: zero fuel in droop, `minKW` in isochronous or base load. */
  | 'at-min-kW'
  /** At (held) or beyond the field-heating limit. */
  | 'field-limit'
  /** At (held) or beyond the leading (under-excitation) limit. */
  | 'under-excited'
  | 'offline';

/** Optional overrides of the plant's loads: one aggregate load replaces them. */
export interface LoadOverride {
  kW: number;
  kVAR: number;
}

/** Request of `solveSharing`. */
export interface SolveSharingRequest {
  plant: Plant;
  /** Replace the plant's loads by one constant-power load. */
  load?: LoadOverride;
  /**
   * With `load`: when it is more than the sets can carry, solve at the most they can carry
   * (same kVAR/kW) and say so in `capped`, instead of failing. Default false.
   */
  atMost?: boolean;
}

/**
 * Request of `checkPlant`: a plant as edited (checked like `validatePlant`) and, when the load
 * slider is away from the plant's own loads, its position (% of the online sets' kW rating).
 */
export interface CheckPlantRequest {
  plant: unknown;
  loadPct?: number;
  /** Also describe the plant (`describePlant`'s rated figures in `description`): an edit's one answer. */
  describe?: boolean;
}

/**
 * Answer of `checkPlant`: the plant with defaults filled in and, from the same request, its
 * operating point (as `solveSharing` gives it, at most what the sets can carry when `loadPct`
 * is given) or the sentence saying why it has none, and, when asked, its rated figures (as
 * `describePlant` gives them). An invalid plant is refused as `validatePlant` refuses it (field issues), with
 * no operating point.
 */
export interface CheckedPlant {
  plant: Plant;
  /** The load solved for (null: the plant's own loads). */
  load: LoadOverride | null;
  sharing: SharingResult | null;
  sharingError: string | null;
  /** Rated figures and capability curves (`describePlant`) when asked for, or null (with `descriptionError` if describing failed). */
  description: PlantDescription | null;
  descriptionError: string | null;
}

/** A load the sets could not carry, and what was solved instead (`SolveSharingRequest.atMost`). */
export interface CappedLoad {
  requestedKW: number;
  requestedKVAR: number;
  /** The most the sets can carry at the same kVAR/kW, kW and kVAR (the result is for this load). */
  carriedKW: number;
  carriedKVAR: number;
  /** requestedKW − carriedKW. */
  shortKW: number;
  /** Why the requested load has no steady state (the engine's sentence). */
  reason: string;
}

/** One set at the operating point. Generator convention: Q > 0 lagging. */
export interface SetResult {
  id: string;
  name: string;
  online: boolean;
  kW: number;
  kVAR: number;
  kVA: number;
  /** Power factor magnitude (0..1); `pfLagging` tells the sense. */
  pf: number;
  pfLagging: boolean;
  currentA: number;
  /** Terminal voltage, V line-to-line. */
  terminalV: number;
  /** Terminal voltage angle ahead of the bus, degrees (0 without a feeder). */
  terminalAngleDeg?: number;
  /** kW as % of ratedKW. */
  loadingPct: number;
  /** kVA as % of ratedKVA. */
  loadingKVAPct: number;
  /** kW minus the proportional (ratedKW-weighted) share, % of ratedKW. */
  sharingErrorKWPct: number;
  /** kVAR minus the proportional (ratedKVA-weighted) share, % of ratedKVA. */
  sharingErrorKVARPct: number;
  /** Reactive current minus its proportional share, A (sums to zero). */
  circulatingA: number;
  /** Circulating current, % of rated current. */
  circulatingPct: number;
  /** Feeder losses, kW. */
  feederLossKW: number;
  /** Reactive power absorbed by the feeder (X·I²), kVAR. */
  feederLossKVAR?: number;
  flags: SetFlag[];
  /** One sentence per flag that needs attention (the set's limits and what follows), in words. */
  notes: string[];
}

/** Where the plant settles. */
export interface SharingResult {
  bus: { frequencyHz: number; voltageV: number };
  sets: SetResult[];
  totals: {
    kW: number;
    kVAR: number;
    kVA: number;
    loadKW: number;
    loadKVAR: number;
    feederLossKW: number;
    feederLossKVAR: number;
  };
  /** Plain-language notes (e.g. isochronous set saturated, frequency outside band). */
  warnings: string[];
  /** Set when the requested load could not be carried and the most the sets can carry was solved instead. */
  capped?: CappedLoad;
  /** Which method solved it: closed forms or the network Newton–Raphson. */
  method: 'closed-form' | 'newton-raphson';
  iterations: number;
}

/** Request of `sweepLoad`: total load from `fromPct` to `toPct` of online kW rating. */
export interface SweepLoadRequest {
  plant: Plant;
  /** Number of points (≥ 2). */
  steps: number;
  fromPct?: number;
  toPct?: number;
  /** Load power factor for the swept load (lagging). Defaults to the plant loads' PF. */
  pf?: number;
}

/** One point of a load sweep; `error` is set where no steady state exists. */
export interface SweepPoint {
  loadPct: number;
  loadKW: number;
  loadKVAR: number;
  frequencyHz: number | null;
  voltageV: number | null;
  setKW: (number | null)[];
  setKVAR: (number | null)[];
  error?: string;
}

/** Result of `sweepLoad`. */
export interface LoadSweep {
  setIds: string[];
  points: SweepPoint[];
}
