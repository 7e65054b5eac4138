/**
 * Chart.js configurations of the Planner view: each set's droop line now and as proposed, the
 * bus across the load range against the band, and a histogram of one tolerance figure. Pure.
 */
import type { ChartConfiguration, ChartDataset } from 'chart.js';
import type { Band, Distribution, PlanCheck, Plant, PlanResult } from '../../../shared-types';
import type { XY } from '../charts/droop-lines';
import { hLine } from '../charts/annotations';
import { seriesStyle, withAlpha } from '../charts/series-style';
import type { ChartTheme } from '../charts/theme';
import { bottomLegend, linearAxis, STILL_CHART } from '../charts/chart-frame';
import { formatNumber } from '../../../shared-types';

/** Droop lines of the online sets, now (thin, faded) and proposed (heavy): the plan's characteristics of each set. */
export function droopLinesChart(kind: 'speed' | 'reactive', now: Plant, plan: PlanResult, theme: ChartTheme): ChartConfiguration<'scatter', XY[]> {
  const datasets: ChartDataset<'scatter', XY[]>[] = [];
  now.sets.forEach((s, i) => {
    if (!s.online) return;
    const st = seriesStyle(i, theme);
    for (const [lines, when] of [
      [plan.characteristics.current, 'now'],
      [plan.characteristics.proposal, 'proposed'],
    ] as const) {
      const set = lines[i];
      const c = set && (kind === 'speed' ? set.speed : set.voltage);
      if (!c || c.kind !== 'segment') continue;
      datasets.push({
        label: `${s.id} ${when}`,
        data: c.points,
        showLine: true,
        borderColor: when === 'now' ? withAlpha(st.color, 0.45) : st.color,
        backgroundColor: st.color,
        borderDash: when === 'now' ? [3, 3] : st.dash,
        borderWidth: when === 'now' ? 1.2 : 2.5,
        pointRadius: 0,
        pointStyle: st.pointStyle,
      });
    }
  });
  const x = kind === 'speed' ? 'output, kW' : 'reactive output, kVAR';
  const y = kind === 'speed' ? 'frequency, Hz' : 'terminal voltage, V';
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      ...STILL_CHART,
      scales: { x: linearAxis(theme, x), y: linearAxis(theme, y) },
      plugins: { legend: bottomLegend(theme) },
    },
  };
}

/** The bus across the load range, now and proposed, with the band drawn as two lines. */
export function busAcrossChart(
  quantity: 'frequency' | 'voltage',
  now: PlanCheck,
  proposed: PlanCheck,
  band: Band,
  theme: ChartTheme,
): ChartConfiguration<'scatter', XY[]> {
  const pick = (c: PlanCheck): XY[] =>
    c.points.flatMap((p) => {
      const y = quantity === 'frequency' ? p.frequencyHz : p.voltageV;
      return y === null ? [] : [{ x: p.loadPct, y }];
    });
  const edge = (y: number, text: string) => hLine(y, theme.bad, text, theme, { position: 'end' });
  const unit = quantity === 'frequency' ? 'Hz' : 'V';
  return {
    type: 'scatter',
    data: {
      datasets: [
        {
          label: 'now',
          data: pick(now),
          showLine: true,
          borderColor: theme.muted,
          backgroundColor: theme.muted,
          borderDash: [3, 3],
          borderWidth: 1.5,
          pointStyle: 'rect',
          pointRadius: 4,
        },
        {
          label: 'proposed',
          data: pick(proposed),
          showLine: true,
          borderColor: theme.accent,
          backgroundColor: theme.accent,
          borderWidth: 2.5,
          pointStyle: 'circle',
          pointRadius: 4,
        },
      ],
    },
    options: {
      ...STILL_CHART,
      scales: { x: linearAxis(theme, 'load, % of online rated kW'), y: linearAxis(theme, `bus ${quantity}, ${unit}`) },
      plugins: {
        legend: bottomLegend(theme),
        annotation: {
          annotations: {
            lo: edge(band.min, `band min ${formatNumber(band.min, quantity === 'frequency' ? 2 : 1)} ${unit}`),
            hi: edge(band.max, `band max ${formatNumber(band.max, quantity === 'frequency' ? 2 : 1)} ${unit}`),
          },
        },
      },
    },
  };
}

/** A histogram of one tolerance figure, with its 5th and 95th percentiles marked. */
export function histogramChart(d: Distribution, title: string, digits: number, theme: ChartTheme): ChartConfiguration<'bar', number[], string> {
  const labels = d.counts.map((_, k) => formatNumber((d.edges[k]! + d.edges[k + 1]!) / 2, digits));
  return {
    type: 'bar',
    data: {
      labels,
      datasets: [{ label: 'samples', data: d.counts, backgroundColor: withAlpha(theme.accent, 0.7), borderColor: theme.accent, borderWidth: 1 }],
    },
    options: {
      ...STILL_CHART,
      scales: {
        x: { title: { display: true, text: title, color: theme.fg }, ticks: { color: theme.muted, maxRotation: 0, autoSkip: true }, grid: { display: false } },
        y: { title: { display: true, text: 'samples', color: theme.fg }, ticks: { color: theme.muted }, grid: { color: theme.grid } },
      },
      plugins: { legend: { display: false } },
    },
  };
}
