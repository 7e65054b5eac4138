/** What the report is made of once every engine result is in (the input of the HTML builder). */
import type {
  ClosingMap,
  Plant,
  PlantDescription,
  ProjectScenario,
  ProjectSyncSettings,
  SharingResult,
  SimulationResult,
  SyncPreset,
  SyncResult,
} from '../../../shared-types';

/** One load point of the sharing table. */
export interface SharingPoint {
  /** Label of the point, e.g. "50 %" or "connected load". */
  label: string;
  /** % of the online sets' rated kW, or null for the plant's own connected load. */
  loadPct: number | null;
  loadKW: number;
  loadKVAR: number;
  result: SharingResult | null;
  /** Why this point has no result (the solver's sentence). */
  problem: string | null;
  /**
   * When the load asked for is more than the sets can carry, the result is for the most they
   * can carry (`result.capped`) and this says so in words; else null.
   */
  note: string | null;
}

/** The sync-check part: settings, the verdict at the window's edge and the closing map. */
export interface SyncPart {
  settings: ProjectSyncSettings;
  /** The preset the limits came from, when known. */
  preset: SyncPreset | null;
  /** True when the project had no sync settings and defaults were used. */
  defaulted: boolean;
  incomingSetId: string;
  /** Evaluation of a close at the window's edge (slip, angle and voltage at their limits). */
  edge: SyncResult | null;
  map: ClosingMap | null;
  problem: string | null;
}

/** One transient scenario and its run. */
export interface TransientPart {
  scenario: ProjectScenario;
  /** True for the report's own default scenario (the project had none). */
  defaulted: boolean;
  result: SimulationResult | null;
  problem: string | null;
}

/** Everything the report shows. */
export interface ReportData {
  title: string;
  date: string;
  plant: Plant;
  description: PlantDescription;
  loadPF: number;
  sharing: SharingPoint[];
  sync: SyncPart | { problem: string };
  transients: TransientPart[];
}
