/** Synchronizing: sync-check case, verdict, closing surge and closing map. */
import type { Plant } from './plant';

export const SYNC_FORMAT = 'droopline.sync' as const;

/** Sync-check (device 25) limits. */
export interface SyncLimits {
  /** Largest |slip|, Hz. */
  slipHz: number;
  /** Largest |phase angle|, degrees. */
  angleDeg: number;
  /** Largest |voltage difference|, % of bus voltage. */
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
  bus: { frequencyHz: number; voltageV: number; angleDeg?: number };
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
  breakerClosingMs: number;
  limits: SyncLimits;
  dead?: DeadPermissives;
}

/** The surge and shaft kick for one closing instant. */
export interface ClosingSurge {
  angleAtContactDeg: number;
  /** |ΔV| across the breaker, pu of bus voltage. */
  deltaVPU: number;
  surgeCurrentPU: number;
  surgeCurrentA: number;
  /** IEC 60909 peak factor κ = 1.02 + 0.98 e^(−3R/X). */
  peakFactor: number;
  peakCurrentA: number;
  /** Synchronizing power step, pu on the incoming set's base. */
  powerStepPU: number;
  torqueStepPU: number;
  torqueStepKNm: number;
}

/** Sync-check verdict for a case. */
export interface SyncResult {
  slipHz: number;
  slipPeriodS: number | null;
  advanceAngleDeg: number;
  windowOpenS: number | null;
  voltageDifferencePct: number;
  /** Phasor voltage difference now, pu of bus voltage. */
  deltaVPU: number;
  angleNowDeg: number;
  /** Seconds until the window next opens / closes (null when it never does). */
  windowOpensInS: number | null;
  windowClosesInS: number | null;
  /** Seconds until the close command should be issued so contact lands at 0°. */
  closeCommandInS: number | null;
  permissive: boolean;
  reasons: string[];
  closeNow: ClosingSurge;
  deadBusClose?: boolean;
}

/** Request of `closingMap`. */
export interface ClosingMapRequest {
  case: SyncCase;
  angleSteps: number;
  slipSteps: number;
  slipRangeHz: number;
  method?: 'closed-form' | 'time-domain';
}

/** Surge current and torque step over angle × slip (row-major: slip rows, angle columns). */
export interface ClosingMap {
  anglesDeg: number[];
  slipsHz: number[];
  surgeCurrentPU: number[];
  torqueStepPU: number[];
  window: { angleDeg: number; slipHz: number };
  method: 'closed-form' | 'time-domain';
}
