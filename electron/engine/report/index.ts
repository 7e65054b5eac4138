/** The plant report's data assembly (pure); the HTML and SVG rendering lives in `electron/report/`. */
export {
  DEFAULT_LOADS_PCT,
  DEFAULT_LOAD_PF,
  DEFAULT_BREAKER_MS,
  EDGE_FRACTION,
  FALLBACK_SYNC_LIMITS,
  cappedNote,
  defaultScenario,
  edgeCase,
  problemOf,
  reportData,
  reportLoads,
  reportMapGrid,
  reportRun,
  sharingPoint,
  syncPartFor,
  transientPartsFor,
} from './assemble-report';
export type { WantedLoad } from './assemble-report';
export type { ReportData, SharingPoint, SyncPart, TransientPart } from './report-data';
