/**
 * Chart.js configurations of the Commissioning view: a record's frequency or voltage against
 * time (the import preview), the measured trace with the fitted model (and the start values)
 * overlaid, and the residual (measured − model, % of rated). Pure.
 */
import type { ChartConfiguration, ChartDataset } from 'chart.js';
import type { FitResult, TestRecord } from '../../../shared-types';
import type { XY } from '../charts/droop-lines';
import { seriesStyle, withAlpha } from '../charts/series-style';
import type { ChartTheme } from '../charts/theme';
import { bottomLegend, linearAxis, STILL_CHART } from '../charts/chart-frame';

function points(t: readonly number[], y: readonly number[]): XY[] {
  return t.map((x, k) => ({ x, y: y[k]! }));
}

function config(datasets: ChartDataset<'scatter', XY[]>[], yTitle: string, theme: ChartTheme): ChartConfiguration<'scatter', XY[]> {
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      ...STILL_CHART,
      parsing: false,
      normalized: true,
      scales: { x: linearAxis(theme, 'time, s'), y: linearAxis(theme, yTitle) },
      plugins: { legend: bottomLegend(theme) },
    },
  };
}

/** The record alone (the import dialog's preview). */
export function recordChart(record: TestRecord, quantity: 'frequency' | 'voltage', theme: ChartTheme): ChartConfiguration<'scatter', XY[]> {
  const st = seriesStyle(0, theme);
  const y = quantity === 'frequency' ? record.frequencyHz : record.voltageV;
  return config(
    [
      {
        label: `measured ${quantity}`,
        data: points(record.tS, y),
        showLine: true,
        borderColor: st.color,
        backgroundColor: st.color,
        borderWidth: 1.5,
        pointRadius: 0,
      },
    ],
    quantity === 'frequency' ? 'frequency, Hz' : 'voltage, V',
    theme,
  );
}

/** Measured (faint dots, drawn beneath), fitted model (line on top) and the model with the start values (thin dashed). */
export function overlayChart(fit: FitResult, quantity: 'frequency' | 'voltage', theme: ChartTheme): ChartConfiguration<'scatter', XY[]> {
  const pick = (tr: FitResult['fitted']) => (quantity === 'frequency' ? tr.frequencyHz : tr.voltageV);
  const measured = seriesStyle(0, theme);
  const model = seriesStyle(1, theme);
  const start = seriesStyle(2, theme);
  return config(
    [
      {
        label: 'measured',
        data: points(fit.measured.tS, pick(fit.measured)),
        showLine: false,
        borderColor: withAlpha(measured.color, 0.55),
        backgroundColor: withAlpha(measured.color, 0.35),
        pointRadius: 1.2,
        pointStyle: 'circle',
        order: 3,
      },
      {
        label: 'model, fitted',
        data: points(fit.fitted.tS, pick(fit.fitted)),
        showLine: true,
        borderColor: model.color,
        backgroundColor: model.color,
        borderWidth: 2,
        pointRadius: 0,
        pointStyle: 'line',
        order: 1,
      },
      {
        label: 'model, start values',
        data: points(fit.startTrace.tS, pick(fit.startTrace)),
        showLine: true,
        borderColor: withAlpha(start.color, 0.8),
        backgroundColor: start.color,
        borderDash: [5, 4],
        borderWidth: 1.2,
        pointRadius: 0,
        pointStyle: 'line',
        order: 2,
      },
    ],
    quantity === 'frequency' ? 'frequency, Hz' : 'voltage, V',
    theme,
  );
}

/** Measured − fitted model, % of rated frequency and voltage. */
export function residualChart(fit: FitResult, ratedFrequencyHz: number, ratedVoltageV: number, theme: ChartTheme): ChartConfiguration<'scatter', XY[]> {
  const f = seriesStyle(0, theme);
  const v = seriesStyle(1, theme);
  const rf = fit.measured.tS.map((t, k) => ({ x: t, y: ((fit.measured.frequencyHz[k]! - fit.fitted.frequencyHz[k]!) / ratedFrequencyHz) * 100 }));
  const rv = fit.measured.tS.map((t, k) => ({ x: t, y: ((fit.measured.voltageV[k]! - fit.fitted.voltageV[k]!) / ratedVoltageV) * 100 }));
  return config(
    [
      {
        label: 'frequency residual',
        data: rf,
        showLine: true,
        borderColor: f.color,
        backgroundColor: f.color,
        borderWidth: 1,
        pointRadius: 0,
        pointStyle: f.pointStyle,
      },
      {
        label: 'voltage residual',
        data: rv,
        showLine: true,
        borderColor: v.color,
        backgroundColor: v.color,
        borderDash: [4, 3],
        borderWidth: 1,
        pointRadius: 0,
        pointStyle: v.pointStyle,
      },
    ],
    'residual, % of rated',
    theme,
  );
}
