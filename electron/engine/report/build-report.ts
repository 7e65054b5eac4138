/** `buildReport`: computes the report's results through the injected engine and writes the page. */
import type { BuildReportRequest, ReportResult } from '../../../shared-types';
import { assembleReport } from './assemble-report';
import { slug } from './format';
import { reportCharts } from './report-charts';
import type { ReportEngine } from './report-engine';
import { reportTables } from './report-tables';
import { renderReportHtml, reportSections } from './render-report';

/**
 * Builds the plant report: sets and settings, sharing at the chosen loads, droop lines,
 * sync-check settings with the closing map, transient metrics with ISO 8528-5 verdicts,
 * definitions and cautions. A section whose engine call fails shows that failure's sentence.
 * @throws Cancelled when `engine.isCancelled()` turns true.
 */
export async function buildReport(request: BuildReportRequest, engine: ReportEngine): Promise<ReportResult> {
  const data = await assembleReport(request, engine);
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
