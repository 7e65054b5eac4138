/** Registers Chart.js's pieces and the annotation plugin once, for every chart of the app. */
import { Chart, registerables } from 'chart.js';
import annotationPlugin from 'chartjs-plugin-annotation';

let done = false;

/** Idempotent: call before creating a chart. */
export function setupCharts(): void {
  if (done) return;
  Chart.register(...registerables, annotationPlugin);
  done = true;
}
