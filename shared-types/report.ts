/**
 * The plant report (`buildReport`): one HTML page with inline SVG charts, built by the
 * engine so the CLI and the app produce the same document, plus every table and chart
 * as data for CSV and PNG export.
 */
import type { Plant } from './plant';
import type { ProjectScenario, ProjectSyncSettings } from './project';

/** What a report is built from: a project's plant, scenarios and sync settings. */
export interface ReportProject {
  /** Project name shown in the title (defaults to the plant's name). */
  name?: string;
  plant: Plant;
  /** Transient scenarios whose metrics go into the report (each is simulated). */
  scenarios?: ProjectScenario[];
  /** Sync-check settings; without them the report uses the first preset and the first offline set. */
  sync?: ProjectSyncSettings | null;
}

/** Request of `buildReport`. */
export interface BuildReportRequest {
  project: ReportProject;
  /**
   * Date printed on the report, ISO 8601 (`2026-12-02` or a full timestamp). The engine has no
   * clock, so the caller supplies it.
   */
  date: string;
  /**
   * Total loads for the sharing table, % of the online sets' rated kW (default 25, 50, 75, 100); the
   * overload point (every online set at its overload limit) is always added.
   */
  loadsPct?: number[];
  /** Power factor of the load at those points, lagging (default 0.8). */
  loadPF?: number;
  /** Grid of the closing map (defaults 37 angles × 21 slips over ±0.5 Hz). */
  closingMap?: { angleSteps?: number; slipSteps?: number; slipRangeHz?: number };
}

/** A cell of a report table: text, a number (shown with the column's decimals) or blank. */
export type ReportCell = string | number | null;

/** One table of the report, as data (CSV export) and as shown (`decimals` per column). */
export interface ReportTable {
  id: string;
  title: string;
  /** Column headings with their units, e.g. `kW`, `Frequency (Hz)`. */
  columns: string[];
  /** Decimals shown per column for numbers (CSV keeps full precision). */
  decimals: number[];
  rows: ReportCell[][];
  /** False for tables too large to print (the closing-map grid): they are in the CSV export only. */
  printed?: boolean;
}

/** One chart of the report: its SVG (self-contained, inline styles) and size in px. */
export interface ReportChart {
  id: string;
  title: string;
  svg: string;
  widthPx: number;
  heightPx: number;
}

/** A report section's status: built, or why it is not there. */
export interface ReportSection {
  id: 'plant' | 'settings' | 'sharing' | 'droop-lines' | 'sync' | 'transients' | 'definitions' | 'cautions';
  title: string;
  /** Null when the section was built; else a sentence saying why not (e.g. the solver's message). */
  problem: string | null;
}

/** Result of `buildReport`. */
export interface ReportResult {
  /** The whole printable page (no scripts, no external resources). */
  html: string;
  /** Suggested file name without extension, e.g. `kestrel-ford-report-2026-12-02`. */
  fileStem: string;
  sections: ReportSection[];
  tables: ReportTable[];
  charts: ReportChart[];
}
