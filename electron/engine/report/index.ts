/** The plant report: pure HTML and SVG building over engine results. */
export { buildReport } from './build-report';
export type { ReportEngine, SubProgress } from './report-engine';
export { DEFAULT_LOADS_PCT, DEFAULT_LOAD_PF, DEFAULT_BREAKER_MS, FALLBACK_SYNC_LIMITS, defaultScenario, edgeCase } from './assemble-report';
export { speedDroopLine, reactiveDroopLine } from './report-charts';
export { lineChartSvg } from './svg-line-chart';
export { heatMapSvg } from './svg-heat-map';
export { niceTicks } from './svg-axes';
export { escapeHtml, formatNumber } from './format';
export { verdictWord } from './report-tables';
export { CAUTIONS, DEFINITIONS } from './report-text';
