/**
 * The plant report's rendering: HTML with its CSS, SVG charts and the tables' words and numbers, from the data the
 * report handler assembles with the engine (`electron/engine/report/`); and the commissioning record's CSV and HTML
 * from the engine's rows. Pure string building; no engine calls.
 */
export { renderReport } from './build-report';
export { renderCommissioningRecord } from './commissioning-record';
export { characteristicSeries } from './report-charts';
export { lineChartSvg } from './svg-line-chart';
export { heatMapSvg } from './svg-heat-map';
export { niceTicks } from './svg-axes';
export { escapeHtml, formatNumber } from './format';
export { verdictWord } from './report-tables';
export { CAUTIONS, DEFINITIONS } from './report-text';
