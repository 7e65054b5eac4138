/** The report page from its data: the tables, the charts and the HTML, with the file name's stem. */
import type { BuildReportRequest, ReportResult } from '../../shared-types';
import type { ReportData } from '../engine/report';
import { slug } from './format';
import { reportCharts } from './report-charts';
import { reportTables } from './report-tables';
import { renderReportHtml, reportSections } from './render-report';

/**
 * Writes the plant report (sets and settings, sharing at the chosen loads, droop lines, sync-check settings with the
 * closing map, transient metrics with ISO 8528-5 verdicts, definitions and cautions) from the data the report
 * handler assembled. A section whose engine call failed shows that failure's sentence.
 */
export function renderReport(request: BuildReportRequest, data: ReportData): ReportResult {
  const tables = reportTables(data);
  const charts = reportCharts(data);
  return {
    html: renderReportHtml(data, tables, charts),
    fileStem: `${slug(data.title)}-report-${slug(request.date.slice(0, 10))}`,
    sections: reportSections(data),
    tables,
    charts,
  };
}
