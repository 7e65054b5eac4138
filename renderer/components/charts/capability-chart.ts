/**
 * The capability chart of one set (kW across, kVAR up, lagging up), drawn from the engine's
 * `SetCapability` curves, with the set's operating point from the sharing result. Each
 * limit is a line of its own look and is named in words on the chart (the stator-current
 * circle, the field-heating limit, the under-excitation limit, the engine's rating, overload
 * limit, zero fuel and the reverse-power setting). Pure: the same inputs give the same
 * configuration (tests read it back).
 */
import type { ChartConfiguration, ChartDataset } from 'chart.js';
import { formatNumber, formatSigned } from '../../../shared-types';
import type { SetCapability, SetResult } from '../../../shared-types';
import { hLine, SMALL_LABEL, vLine } from './annotations';
import type { XY } from './droop-lines';
import { bottomLegend } from './chart-frame';
import { withAlpha } from './series-style';
import type { ChartTheme } from './theme';

type Scatter = ChartDataset<'scatter', XY[]>;

/** The words of the curves and the point in the chart's legend. */
export const CAPABILITY_WORDS = {
  stator: 'stator current (rated kVA)',
  field: 'field heating (field at rated kVA and PF)',
  point: 'operating point',
} as const;

/**
 * The short words on the limit lines themselves: an upright label must fit the plot's height on a small chart (about
 * 150 px on an 18rem chart with its legend, so no more than about 24 characters at 10 px type). The words above the
 * charts and in the legend say each limit in full.
 */
export const CAPABILITY_LINE_WORDS = {
  leading: 'under-excitation',
  rated: 'rated',
  overload: 'overload',
  zeroFuel: 'zero fuel',
  reverse: 'reverse (32)',
} as const;

/** The kVAR range drawn: both halves of the stator circle, with a little room. */
export function capabilityKVARRange(c: SetCapability): [number, number] {
  const r = c.ratedKVA * 1.08;
  return [-r, r];
}

/**
 * The two limit curves of `c` (stator circle, field heating) as datasets, kept per capability
 * object and theme: an edit that moves only the operating point (the rated figures unchanged,
 * so the same `SetCapability` object) reuses them, and Chart.js finds the same data arrays.
 */
const curveCache = new WeakMap<SetCapability, { theme: ChartTheme; curves: [Scatter, Scatter] }>();

function limitCurves(c: SetCapability, theme: ChartTheme): [Scatter, Scatter] {
  const kept = curveCache.get(c);
  if (kept && kept.theme === theme) return kept.curves;
  const yHi = capabilityKVARRange(c)[1];
  const stator: Scatter = {
    label: CAPABILITY_WORDS.stator,
    data: c.stator.map((p) => ({ x: p.kW, y: p.kVAR })),
    showLine: true,
    borderColor: theme.fg,
    backgroundColor: theme.fg,
    borderWidth: 2,
    pointRadius: 0,
    pointStyle: 'line',
  };
  const field: Scatter = {
    label: CAPABILITY_WORDS.field,
    data: c.field.filter((p) => p.kVAR <= yHi).map((p) => ({ x: p.kW, y: p.kVAR })),
    showLine: true,
    borderColor: theme.bad,
    backgroundColor: theme.bad,
    borderWidth: 2,
    borderDash: [8, 4],
    pointRadius: 0,
    pointStyle: 'line',
  };
  const curves: [Scatter, Scatter] = [stator, field];
  curveCache.set(c, { theme, curves });
  return curves;
}

/** Chart.js configuration of `c` with the set's operating point (null when offline or unsolved). */
export function capabilityChart(c: SetCapability, point: Pick<SetResult, 'kW' | 'kVAR' | 'online'> | null, theme: ChartTheme): ChartConfiguration {
  const [yLo, yHi] = capabilityKVARRange(c);
  const xLo = Math.min(c.minChartKW, point && point.online ? point.kW * 1.1 : 0);
  const xHi = Math.max(c.maxChartKW, point && point.online ? point.kW * 1.05 : 0);
  const datasets: Scatter[] = [...limitCurves(c, theme)];
  if (point && point.online) {
    datasets.push({
      label: CAPABILITY_WORDS.point,
      data: [{ x: point.kW, y: point.kVAR }],
      showLine: false,
      borderColor: theme.accent,
      backgroundColor: withAlpha(theme.accent, 0.85),
      pointRadius: 7,
      pointHoverRadius: 8,
      pointStyle: 'rectRot',
    });
  }
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      animation: false,
      responsive: true,
      maintainAspectRatio: false,
      scales: {
        x: {
          type: 'linear',
          min: xLo,
          max: xHi,
          title: { display: true, text: 'kW (motoring ← → generating)', color: theme.fg },
          ticks: { color: theme.muted },
          grid: { color: theme.grid },
        },
        y: {
          type: 'linear',
          min: yLo,
          max: yHi,
          title: { display: true, text: 'kVAR (leading ↓ ↑ lagging)', color: theme.fg },
          ticks: { color: theme.muted },
          grid: { color: theme.grid },
        },
      },
      plugins: {
        legend: bottomLegend(theme),
        tooltip: { animation: false },
        annotation: {
          annotations: {
            leading: hLine(c.leadingKVAR, theme.warn, `${CAPABILITY_LINE_WORDS.leading} ${formatSigned(c.leadingKVAR, 0)} kVAR`, theme, {
              dash: [3, 3],
              size: SMALL_LABEL,
              // Mid-plot: the engine's upright labels sit at both ends.
              position: 'center',
            }),
            rated: vLine(c.ratedKW, theme.muted, `${CAPABILITY_LINE_WORDS.rated} ${formatNumber(c.ratedKW)} kW`, theme, [2, 4], 'end'),
            overload: vLine(c.overloadKW, theme.bad, `${CAPABILITY_LINE_WORDS.overload} ${formatNumber(c.overloadKW)} kW`, theme, [10, 3], 'start'),
            zeroFuel: vLine(-c.motoringKW, theme.muted, `${CAPABILITY_LINE_WORDS.zeroFuel} ${formatSigned(-c.motoringKW, 0)} kW`, theme, [4, 2], 'end'),
            reverse: vLine(-c.reverseTripKW, theme.warn, `${CAPABILITY_LINE_WORDS.reverse} ${formatSigned(-c.reverseTripKW, 0)} kW`, theme, [1, 3], 'start'),
          },
        },
      },
    },
  } as ChartConfiguration;
}
