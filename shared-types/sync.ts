/** Synchronizing: sync-check case, verdict, closing surge and closing map. */
import type { Plant } from './plant';

export const SYNC_FORMAT = 'droopline.sync' as const;

/** Sync-check (device 25) limits. */
export interface SyncLimits {
  /** Largest |slip|, Hz. */
  slipHz: number;
  /** Largest |phase angle| at the close command, degrees (the window is ±angleDeg). */
  angleDeg: number;
  /** Largest |voltage difference|, % of the base voltage (plant rated voltage, else `ratedVoltageV`, else the bus voltage). */
  voltagePct: number;
  /** Incoming set must run faster than the bus (positive slip). */
  incomingFaster?: boolean;
  /** Incoming voltage must be at or above the bus. */
  incomingHigher?: boolean;
}

/** A limit preset and where it comes from. */
export interface SyncPreset {
  id: string;
  label: string;
  /** Standard and clause, or "common practice". */
  source: string;
  /** Note shown beside it, e.g. "verify against the standard you hold". */
  note: string;
  limits: SyncLimits;
  /**
   * How sure the values are: seen in a published copy of the standard, seen only in a
   * secondary copy (clauses not confirmed), recalled from memory, or a rule of the trade.
   */
  confidence?: 'confirmed' | 'secondary' | 'memory' | 'practice';
  /** For rating-banded presets (IEEE 1547): the aggregate rating band it applies to, kVA (`maxKVA` null = no upper bound). */
  ratingBandKVA?: { minKVA: number; maxKVA: number | null };
}

/** Dead-bus / dead-line permissives. */
export interface DeadPermissives {
  /** Allow closing the incoming set onto a dead bus. */
  deadBus: boolean;
  /** Allow closing a dead incoming onto a live bus. */
  deadLine: boolean;
  /** Above this % of rated the side is live. */
  livePct: number;
  /** Below this % of rated the side is dead. */
  deadPct: number;
}

/** A sync-check case (the `droopline.sync` file, `version: 1`). */
export interface SyncCase {
  format?: typeof SYNC_FORMAT;
  version?: 1;
  /** Free text shown with the result. */
  name?: string;
  /**
   * Running bus: frequency, line-to-line voltage and (optionally) its phase angle on the same reference as
   * `incoming.angleDeg` (default 0). A dead bus has voltage near 0.
   */
  bus: { frequencyHz: number; voltageV: number; angleDeg?: number };
  /**
   * Where the bus figures came from, in words ("given in the case", or the plant's solved operating point with the
   * incoming set off line). Filled by the case reader; not read from a file.
   */
  busFrom?: string;
  incoming: {
    frequencyHz: number;
    voltageV: number;
    /** Incoming phase angle relative to the bus, degrees. */
    angleDeg: number;
    ratedKVA: number;
    /** Subtransient reactance of the incoming set, pu on its own base. */
    xddpPU: number;
    /** R/X of the surge circuit for the peak factor (default from machine data). */
    rOverX?: number;
    /** Inertia constant of the incoming set, s. */
    inertiaS?: number;
    poles?: number;
  };
  /** The running bus's Thevenin equivalent; derived from `plant` when given. */
  busSource?: { ratedKVA: number; xPU: number; rPU?: number };
  /** Use a plant's online sets as the bus, and one of its sets as incoming. */
  plant?: Plant;
  incomingSetId?: string;
  /** Breaker closing time from close command to contact touch, ms. */
  breakerClosingMs: number;
  limits: SyncLimits;
  /** Id of the preset the limits came from (shown with the verdict). */
  presetId?: string;
  dead?: DeadPermissives;
  /** Base (rated) line-to-line voltage, V. Default: the plant's, else the bus voltage (the incoming's if the bus is dead). */
  ratedVoltageV?: number;
  /** Rated frequency for the torque base, Hz. Default: the plant's, else 50 or 60, whichever is nearer the bus frequency. */
  ratedFrequencyHz?: number;
}

/** One sync-check test and its outcome (the `reasons` list holds the failed ones' messages). */
export interface SyncCheck {
  id: 'slip' | 'angle' | 'voltage' | 'incoming-faster' | 'incoming-higher' | 'dead-bus' | 'dead-line' | 'live-state';
  /** Passed (true), failed (false) or not applicable to this case (null, e.g. slip on a dead-bus close). */
  ok: boolean | null;
  /** Measured value in `unit` (null when not applicable). */
  value: number | null;
  /** Limit in `unit` (null when the test has none). */
  limit: number | null;
  unit: string;
  /** A sentence: what was checked and the outcome. */
  message: string;
}

/** The running bus's Thevenin equivalent used for the surge, on the incoming set's kVA base. */
export interface BusEquivalent {
  /**
   * Where it came from: the plant's online sets and feeders, the case's `busSource`, an infinite (stiff) bus
   * when neither is given, or none (the bus is not live).
   */
  from: 'plant' | 'bus-source' | 'infinite' | 'none';
  /** Resistance and reactance, pu on the incoming set's kVA base and the base voltage. */
  rPU: number;
  xPU: number;
  /** Short-circuit level of the bus at the base voltage, kVA (null for an infinite bus). */
  shortCircuitKVA: number | null;
  /** Set ids that form it (plant only). */
  setIds: string[];
}

/** The surge and shaft kick for one closing instant. */
export interface ClosingSurge {
  angleAtContactDeg: number;
  /** |ΔV| across the breaker, pu of the base voltage. */
  deltaVPU: number;
  /** Symmetrical subtransient current |ΔV| / (X''d incoming + X bus equivalent), pu of the incoming set's rated current. */
  surgeCurrentPU: number;
  surgeCurrentA: number;
  /** IEC 60909 peak factor κ = 1.02 + 0.98 e^(−3R/X). */
  peakFactor: number;
  /** R/X of the loop used for κ. */
  rOverX: number;
  /** Peak asymmetrical current κ √2 I'', pu of the incoming set's rated (rms) current. */
  peakCurrentPU: number;
  peakCurrentA: number;
  /**
   * Synchronizing power step (E1 E2 / X) sin θ, pu on the incoming set's kVA base. Positive when the incoming
   * set leads the bus: it delivers power and is braked.
   */
  powerStepPU: number;
  powerStepKW: number;
  /** Electrical torque step on the incoming shaft, pu of its torque base (rated kVA at rated speed); positive brakes it. */
  torqueStepPU: number;
  torqueStepKNm: number;
  /**
   * First-cycle peak of the air-gap torque with the stator's DC offset (R neglected),
   * (E1 E2 / X)(sin θ + 2 sin(θ/2)) / speed, pu of the torque base; same sign as the step. Twice the step at small
   * angles, three times at 120°, 2 E1 E2 / X at 180° where the step is zero.
   */
  peakTorquePU: number;
  peakTorqueKNm: number;
}

/** Sync-check verdict for a case. */
export interface SyncResult {
  /** Slip f_incoming − f_bus, Hz (positive: incoming faster). */
  slipHz: number;
  /** 1 / |slip|, s (null at zero slip). */
  slipPeriodS: number | null;
  /** Angle the incoming set gains during the breaker closing time, 360 |s| t, degrees. */
  advanceAngleDeg: number;
  /** Phase angle at which to issue the close command so contact lands at 0°, −360 s t wrapped to ±180°, degrees. */
  closeCommandAngleDeg: number;
  /** How long the ±angle window stays open each slip cycle, 2A / (360 |s|), s (null at zero slip). */
  windowOpenS: number | null;
  /** (V_incoming − V_bus) / V_base × 100. */
  voltageDifferencePct: number;
  voltageDifferenceV: number;
  /** Phasor voltage difference now, pu of the base voltage. */
  deltaVPU: number;
  /** Angle of the phasor difference V_incoming − V_bus, degrees from the bus phasor. */
  deltaVAngleDeg: number;
  /** Phase angle of the incoming set relative to the bus now, wrapped to (−180°, 180°]. */
  angleNowDeg: number;
  /** The angle is inside the ±window now. */
  windowOpenNow: boolean;
  /** Seconds until the window next opens (0 when open now) / next closes (null when it never does). */
  windowOpensInS: number | null;
  windowClosesInS: number | null;
  /** Seconds until the close command should be issued so contact lands at 0°. */
  closeCommandInS: number | null;
  /** All checks pass: closing is permitted now. */
  permissive: boolean;
  /** A sentence for every check that fails (empty when permissive). */
  reasons: string[];
  /** Every check, passed or failed. */
  checks: SyncCheck[];
  /** Things worth knowing that do not block the close (e.g. the contact angle lands outside the window). */
  warnings: string[];
  /** Surge if the close command is issued now (contact at angle now + 360 s t). */
  closeNow: ClosingSurge;
  /** Closing onto a dead bus (or a dead incoming onto a live bus) under a dead permissive: no synchronizing surge. */
  deadBusClose?: boolean;
  deadLineClose?: boolean;
  /** The limits used and where they came from. */
  limits: SyncLimits;
  limitsSource: string;
  /** The bus the verdict was evaluated against, and where it came from (`SyncCase.busFrom`). */
  bus: { frequencyHz: number; voltageV: number; from: string };
  /** Bus equivalent used for the surge. */
  busEquivalent: BusEquivalent;
  /** Bases: voltage (V, line-to-line), incoming rated current (A), torque base (kN·m), rated frequency (Hz). */
  base: { voltageV: number; currentA: number; torqueKNm: number; ratedFrequencyHz: number; ratedSpeedRpm: number };
}

/** How the closing map is computed: closed forms, or a time-domain run per cell. */
export const CLOSING_MAP_METHODS = ['closed-form', 'time-domain'] as const;
export type ClosingMapMethod = (typeof CLOSING_MAP_METHODS)[number];
/** What the closing map's angle axis means: the angle at the close command or at contact. */
export const CLOSING_MAP_ANGLE_AXES = ['command', 'contact'] as const;
export type ClosingMapAngleAxis = (typeof CLOSING_MAP_ANGLE_AXES)[number];

/**
 * The closing map's angle axis in words, one wording for the view, the report and the CLI: the phase angle when
 * the close command is given (contact lands one breaker time later) or at contact.
 */
export const CLOSING_MAP_ANGLE_AXIS_LABEL = {
  command: 'phase angle at the close command',
  contact: 'phase angle at contact',
} as const satisfies Record<ClosingMapAngleAxis, string>;

/** Request of `closingMap`. */
export interface ClosingMapRequest {
  case: SyncCase;
  /** Columns over −180°…180° (181 gives 2° steps). */
  angleSteps: number;
  /** Rows over −slipRangeHz…+slipRangeHz. */
  slipSteps: number;
  slipRangeHz: number;
  method?: ClosingMapMethod;
  /**
   * What the angle axis means: the phase angle when the close command is issued (default; contact lands
   * 360 s t later, so slip matters) or the angle at contact.
   */
  angleAxis?: ClosingMapAngleAxis;
  /** Voltage difference for the whole map, % of base (default: the case's own). */
  voltageDifferencePct?: number;
}

/** Surge current and torque step over angle × slip (row-major: slip rows, angle columns). */
export interface ClosingMap {
  anglesDeg: number[];
  slipsHz: number[];
  surgeCurrentPU: number[];
  /** Peak asymmetrical current κ √2 I'', pu of the incoming set's rated current. */
  peakCurrentPU: number[];
  torqueStepPU: number[];
  /** First-cycle peak air-gap torque (closed form, with the DC offset), pu of the torque base, signed. */
  peakTorquePU: number[];
  /** The sync-check window: ±angleDeg × ±slipHz (half-widths), with its actual edges (one-sided when the incoming must run faster). */
  window: { angleDeg: number; slipHz: number; slipMinHz: number; slipMaxHz: number };
  method: ClosingMapMethod;
  angleAxis: ClosingMapAngleAxis;
  voltageDifferencePct: number;
  /** Multiply pu current by this for amperes; pu torque by `torqueBaseKNm` for kN·m. */
  baseCurrentA: number;
  torqueBaseKNm: number;
  /** Largest values on the map and inside the window. */
  maxSurgeCurrentPU: number;
  maxSurgeInWindowPU: number;
  /** How the map was made, in a sentence (time-domain maps say which bus state and window of time they use). */
  note?: string;
  /** Time-domain maps: how long the cells ran (each stops once its surge and torque peaks are past). */
  cellRun?: ClosingMapCellRun;
}

/** How long the cells of a time-domain closing map were simulated after contact. */
export interface ClosingMapCellRun {
  /** The stopping rule in a sentence. */
  rule: string;
  /** The longest a cell may run, ms (one cycle of the running bus). */
  capMs: number;
  /** Mean and longest run of the map's cells, ms after contact. */
  meanMs: number;
  longestMs: number;
  /** Cells that ran to the cap (their peaks were still rising, or level, at its end). */
  cellsAtCap: number;
}
