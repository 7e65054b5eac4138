/**
 * The engine calls the report needs, injected by the caller (the handler layer passes its own
 * validated handlers), so this folder stays pure and each section can fail on its own.
 */
import type {
  ClosingMap,
  ClosingMapRequest,
  Scenario,
  SharingResult,
  SimulationResult,
  SolveSharingRequest,
  SyncCase,
  SyncPreset,
  SyncResult,
} from '../../../shared-types';

/** Progress of one long sub-job, 0..1. */
export type SubProgress = (fraction: number) => void;

/** The engine methods a report is built from, plus progress and cancellation. */
export interface ReportEngine {
  solveSharing(request: SolveSharingRequest): Promise<SharingResult>;
  listSyncPresets(): Promise<SyncPreset[]>;
  evaluateSync(syncCase: SyncCase): Promise<SyncResult>;
  closingMap(request: ClosingMapRequest, progress: SubProgress): Promise<ClosingMap>;
  simulate(scenario: Scenario, progress: SubProgress): Promise<SimulationResult>;
  /** Overall progress of the report, 0..1, with what is being computed. */
  progress(fraction: number, label: string): void;
  /** True once the caller has cancelled. */
  isCancelled(): boolean;
}
