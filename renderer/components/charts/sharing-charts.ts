/**
 * Chart.js configurations of the Sharing view, built from the plant, the engine's result
 * and the chart theme. Pure: the same inputs give the same configuration (tests read the
 * datasets back). Every set keeps its colour, dash and point shape in every chart.
 */
import type { ChartConfiguration, ChartDataset, LegendItem, TooltipItem } from 'chart.js';
import type { LoadSweep, Plant, PlantDescription, SharingResult } from '../../../shared-types';
import { formatNumber } from '../../../shared-types';
import { hLine } from './annotations';
import { linearAxis } from './chart-frame';
import { characteristicPoints, characteristicsOf, niceRange, paddedRange } from './droop-lines';
import type { Characteristic, XY } from './droop-lines';
import { niceBounds, roundTicks } from './nice-scale';
import { hatch, seriesStyle, withAlpha } from './series-style';
import type { ChartTheme } from './theme';

type Scatter = ChartDataset<'scatter', XY[]>;

const fix = formatNumber;

function basePlugins(theme: ChartTheme) {
  return {
    legend: {
      position: 'bottom' as const,
      labels: {
        color: theme.fg,
        usePointStyle: true,
        boxHeight: 8,
        filter: (item: LegendItem) => !String(item.text).endsWith('operating point'),
      },
    },
    tooltip: { animation: false as const },
  };
}

function setDatasets(
  setId: string,
  what: string,
  styleIndex: number,
  c: Characteristic,
  yLo: number,
  yHi: number,
  point: XY | null,
  theme: ChartTheme,
  kW = 0,
): Scatter[] {
  const st = seriesStyle(styleIndex, theme);
  const datasets: Scatter[] = [
    {
      label: `${setId} ${what}`,
      data: characteristicPoints(c, yLo, yHi, kW),
      showLine: true,
      borderColor: st.color,
      backgroundColor: st.color,
      borderDash: st.dash,
      borderWidth: 2,
      pointRadius: 0,
      pointStyle: st.pointStyle,
    },
  ];
  if (point) {
    datasets.push({
      label: `${setId} operating point`,
      data: [point],
      borderColor: st.color,
      backgroundColor: st.color,
      pointStyle: st.pointStyle,
      pointRadius: 6,
      pointHoverRadius: 8,
    });
  }
  return datasets;
}

/**
 * A droop chart: the datasets on linear axes titled `xTitle` and `yTitle` (y fixed to
 * `yLo`–`yHi`), tooltips from `tooltipLabel`, and the bus line when `bus` is given.
 */
function droopScatter(
  theme: ChartTheme,
  datasets: Scatter[],
  axes: { xTitle: string; yTitle: string; yLo: number; yHi: number },
  tooltipLabel: (ctx: TooltipItem<'scatter'>) => string,
  bus: { y: number; text: string } | undefined,
): ChartConfiguration {
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        x: linearAxis(theme, axes.xTitle),
        y: linearAxis(theme, axes.yTitle, { min: axes.yLo, max: axes.yHi }),
      },
      plugins: {
        ...basePlugins(theme),
        tooltip: {
          animation: false,
          callbacks: { label: tooltipLabel },
        },
        annotation: {
          annotations: bus === undefined ? {} : { bus: hLine(bus.y, theme.fg, bus.text, theme) },
        },
      },
    },
  } as ChartConfiguration;
}

/**
 * Speed-droop lines: frequency against kW for each online set (the engine's characteristics in `description`), its
 * operating point on the line, and the common bus frequency drawn across.
 */
export function speedDroopChart(plant: Plant, result: SharingResult | null, theme: ChartTheme, description: PlantDescription | null): ChartConfiguration {
  const busHz = result?.bus.frequencyHz;
  const online = plant.sets.map((s, i) => ({ s, i })).filter(({ s }) => s.online);
  const lines = online.map(({ s }) => characteristicsOf(description, s.id)?.speed);
  const ys: number[] = [plant.ratedFrequencyHz];
  for (const c of lines) if (c?.kind === 'segment') ys.push(c.points[0].y, c.points[1].y);
  if (busHz !== undefined) ys.push(busHz);
  const [yLo, yHi] = niceRange(paddedRange(ys, 0.04, 0.5));
  const datasets: Scatter[] = [];
  online.forEach(({ s, i }, k) => {
    const c = lines[k];
    if (!c) return;
    const what = s.governor.mode === 'droop' ? `droop ${s.governor.droopPct} %` : s.governor.mode === 'isochronous' ? 'isochronous' : 'base load';
    const r = result?.sets.find((x) => x.id === s.id);
    datasets.push(...setDatasets(s.id, what, i, c, yLo, yHi, r && busHz !== undefined ? { x: r.kW, y: busHz } : null, theme));
  });
  return droopScatter(
    theme,
    datasets,
    { xTitle: 'Output (kW)', yTitle: 'Frequency (Hz)', yLo, yHi },
    (ctx) => `${ctx.dataset.label ?? ''}: ${fix(ctx.parsed.x ?? NaN, 0)} kW at ${fix(ctx.parsed.y ?? NaN, 3)} Hz`,
    busHz === undefined ? undefined : { y: busHz, text: `bus ${fix(busHz, 3)} Hz` },
  );
}

/**
 * Reactive-droop lines: terminal voltage against kVAR for each online set (the engine's characteristics in
 * `description`), its operating point (kVAR, terminal V), and the bus voltage drawn across.
 */
export function reactiveDroopChart(plant: Plant, result: SharingResult | null, theme: ChartTheme, description: PlantDescription | null): ChartConfiguration {
  const busV = result?.bus.voltageV;
  const online = plant.sets.map((s, i) => ({ s, i })).filter(({ s }) => s.online);
  const prepared = online.flatMap(({ s, i }) => {
    const c = characteristicsOf(description, s.id)?.voltage;
    return c ? [{ s, i, r: result?.sets.find((x) => x.id === s.id), c }] : [];
  });
  const ys: number[] = [plant.ratedVoltageV];
  for (const p of prepared) {
    if (p.c.kind === 'segment') ys.push(p.c.points[0].y, p.c.points[1].y);
    if (p.r) ys.push(p.r.terminalV);
  }
  if (busV !== undefined) ys.push(busV);
  const [yLo, yHi] = niceRange(paddedRange(ys, 0.04, 4));
  const datasets: Scatter[] = [];
  for (const { s, i, r, c } of prepared) {
    const mode = s.regulator.mode;
    const what =
      mode === 'reactive-droop'
        ? `reactive droop ${s.regulator.droopPct} %`
        : mode === 'cross-current'
          ? 'cross-current'
          : mode === 'voltage'
            ? 'voltage control'
            : `PF ${s.regulator.pf}`;
    datasets.push(...setDatasets(s.id, what, i, c, yLo, yHi, r ? { x: r.kVAR, y: r.terminalV } : null, theme, r?.kW ?? 0));
  }
  return droopScatter(
    theme,
    datasets,
    { xTitle: 'Reactive output (kVAR, + lagging)', yTitle: 'Terminal voltage (V, line-to-line)', yLo, yHi },
    (ctx) => `${ctx.dataset.label ?? ''}: ${fix(ctx.parsed.x ?? NaN, 0)} kVAR at ${fix(ctx.parsed.y ?? NaN, 1)} V`,
    busV === undefined ? undefined : { y: busV, text: `bus ${fix(busV, 1)} V` },
  );
}

/**
 * Each online set's output against its rating: a kW bar (solid) and a kVA bar (hatched),
 * each as output + spare up to the rating, with anything above the rating cross-hatched
 * in the warning colour. Bar length = rating when within it.
 */
export function shareBarChart(plant: Plant, result: SharingResult | null, theme: ChartTheme): ChartConfiguration {
  const online = plant.sets.map((s, i) => ({ s, i })).filter(({ s }) => s.online);
  const rows = online.map(({ s, i }) => ({ s, i, r: result?.sets.find((x) => x.id === s.id) }));
  const colors = rows.map(({ i }) => seriesStyle(i, theme).color);
  const over = hatch(theme.bad, withAlpha(theme.bad, 0.25), 5);
  const kw = rows.map(({ r }) => r?.kW ?? 0);
  const kva = rows.map(({ r }) => r?.kVA ?? 0);
  const ratedKW = rows.map(({ s }) => s.ratedKW);
  const ratedKVA = rows.map(({ s }) => s.ratedKVA);
  const bar = (
    label: string,
    stack: string,
    data: number[],
    bg: (CanvasPattern | string)[] | CanvasPattern | string,
    border: string[] | string,
    borderWidth = 0,
  ) => ({
    label,
    stack,
    data,
    backgroundColor: bg,
    borderColor: border,
    borderWidth,
    borderSkipped: false,
    barPercentage: 0.9,
    categoryPercentage: 0.8,
  });
  const datasets = [
    bar(
      'kW output',
      'kW',
      kw.map((v, k) => Math.min(v, ratedKW[k] ?? 0)),
      colors,
      colors,
    ),
    bar(
      'kW above rating',
      'kW',
      kw.map((v, k) => Math.max(0, v - (ratedKW[k] ?? 0))),
      over,
      theme.bad,
      1,
    ),
    bar(
      'kW spare to rating',
      'kW',
      kw.map((v, k) => Math.max(0, (ratedKW[k] ?? 0) - Math.max(0, v))),
      colors.map((c) => withAlpha(c, 0.12)),
      colors,
      1,
    ),
    bar(
      'kVA output',
      'kVA',
      kva.map((v, k) => Math.min(v, ratedKVA[k] ?? 0)),
      colors.map((c) => hatch(c, withAlpha(c, 0.35))),
      colors,
      1,
    ),
    bar(
      'kVA above rating',
      'kVA',
      kva.map((v, k) => Math.max(0, v - (ratedKVA[k] ?? 0))),
      over,
      theme.bad,
      1,
    ),
    bar(
      'kVA spare to rating',
      'kVA',
      kva.map((v, k) => Math.max(0, (ratedKVA[k] ?? 0) - v)),
      colors.map((c) => withAlpha(c, 0.12)),
      colors,
      1,
    ),
  ];
  const legendItems: LegendItem[] = [
    { text: 'kW output (solid)', fillStyle: theme.muted, strokeStyle: theme.muted, lineWidth: 1, fontColor: theme.fg },
    { text: 'kVA output (hatched)', fillStyle: hatch(theme.muted, withAlpha(theme.muted, 0.35)), strokeStyle: theme.muted, lineWidth: 1, fontColor: theme.fg },
    { text: 'spare to rating (faint)', fillStyle: withAlpha(theme.muted, 0.12), strokeStyle: theme.muted, lineWidth: 1, fontColor: theme.fg },
    { text: 'above rating (cross-hatched)', fillStyle: over, strokeStyle: theme.bad, lineWidth: 1, fontColor: theme.fg },
  ] as LegendItem[];
  return {
    type: 'bar',
    data: { labels: rows.map(({ s }) => `${s.id}`), datasets },
    options: {
      indexAxis: 'y',
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        x: { ...linearAxis(theme, 'Output against rating (kW solid, kVA hatched)'), stacked: true },
        y: { type: 'category', stacked: true, ticks: { color: theme.fg }, grid: { display: false }, border: { color: theme.grid } },
      },
      plugins: {
        legend: { position: 'bottom', onClick: () => undefined, labels: { color: theme.fg, generateLabels: () => legendItems } },
        tooltip: {
          animation: false,
          callbacks: { label: (ctx) => `${ctx.dataset.label ?? ''}: ${fix(ctx.parsed.x ?? NaN, 0)} ${ctx.dataset.stack === 'kVA' ? 'kVA' : 'kW'}` },
        },
      },
    },
  } as ChartConfiguration;
}

/**
 * The load sweep: bus frequency (left axis) and each set's kW (right axis) against the
 * total load, with the load being shown marked. Points without a steady state are gaps,
 * hatched and labelled.
 */
export function sweepChart(plant: Plant, sweep: LoadSweep | null, theme: ChartTheme, markKW: number | null): ChartConfiguration {
  const points = sweep?.points ?? [];
  const datasets: ChartDataset<'scatter', { x: number; y: number | null }[]>[] = [
    {
      label: 'Bus frequency (Hz, left)',
      yAxisID: 'f',
      data: points.map((p) => ({ x: p.loadKW, y: p.frequencyHz })),
      showLine: true,
      borderColor: theme.fg,
      backgroundColor: theme.fg,
      borderWidth: 2.5,
      pointRadius: 0,
      pointStyle: 'line',
      spanGaps: false,
    },
  ];
  (sweep?.setIds ?? []).forEach((id, j) => {
    const i = plant.sets.findIndex((s) => s.id === id);
    const st = seriesStyle(i < 0 ? j : i, theme);
    datasets.push({
      label: `${id} kW (right)`,
      yAxisID: 'p',
      data: points.map((p) => ({ x: p.loadKW, y: p.setKW[j] ?? null })),
      showLine: true,
      borderColor: st.color,
      backgroundColor: st.color,
      borderDash: st.dash,
      borderWidth: 2,
      pointRadius: 2.5,
      pointStyle: st.pointStyle,
      spanGaps: false,
    });
  });
  const fs = points.map((p) => p.frequencyHz).filter((v): v is number => v !== null);
  // Each run of points without an operating point (beyond capacity, or below a base load
  // the others cannot absorb) is hatched, from midway to its neighbours.
  const gaps: { from: number; to: number }[] = [];
  for (let k = 0; k < points.length; k++) {
    if (points[k]!.frequencyHz !== null) continue;
    let e = k;
    while (e + 1 < points.length && points[e + 1]!.frequencyHz === null) e++;
    const from = k > 0 ? (points[k - 1]!.loadKW + points[k]!.loadKW) / 2 : points[k]!.loadKW;
    const to = e + 1 < points.length ? (points[e]!.loadKW + points[e + 1]!.loadKW) / 2 : points[e]!.loadKW;
    gaps.push({ from, to });
    k = e;
  }
  const [fLo, fHi] = niceRange(paddedRange([...fs, plant.ratedFrequencyHz], 0.04, 0.5));
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        // The load axis ends on a round value (2500 kW, not 2244) so the last tick and the "no steady state" label fit.
        x: linearAxis(theme, 'Total load (kW)', {
          min: 0,
          max: points.length ? niceBounds(0, points[points.length - 1]!.loadKW)[1] : undefined,
          afterBuildTicks: roundTicks(6),
        }),
        f: linearAxis(theme, 'Bus frequency (Hz)', { position: 'left', min: fLo, max: fHi }),
        p: linearAxis(theme, 'Set output (kW)', { position: 'right', grid: { drawOnChartArea: false } }),
      },
      plugins: {
        ...basePlugins(theme),
        tooltip: {
          animation: false,
          callbacks: {
            label: (ctx) =>
              ctx.dataset.yAxisID === 'f'
                ? `${fix(ctx.parsed.x ?? NaN, 0)} kW load: ${fix(ctx.parsed.y ?? NaN, 3)} Hz`
                : `${ctx.dataset.label ?? ''}: ${fix(ctx.parsed.y ?? NaN, 0)} kW`,
          },
        },
        annotation: {
          annotations: {
            ...Object.fromEntries(
              gaps.map((g, k) => [
                `none${k}`,
                {
                  type: 'box',
                  xMin: g.from,
                  xMax: g.to,
                  xScaleID: 'x',
                  yScaleID: 'f',
                  backgroundColor: hatch(withAlpha(theme.bad, 0.45), 'transparent', 8),
                  borderWidth: 0,
                  label: { display: true, content: ['no steady', 'state'], position: { x: 'center', y: 'start' }, color: theme.bad, font: { size: 11 } },
                },
              ]),
            ),
            ...(markKW === null
              ? {}
              : {
                  now: {
                    type: 'line',
                    xMin: markKW,
                    xMax: markKW,
                    xScaleID: 'x',
                    borderColor: theme.accent,
                    borderWidth: 1.5,
                    borderDash: [4, 3],
                    label: {
                      display: true,
                      content: `shown load ${fix(markKW, 0)} kW`,
                      position: 'start',
                      backgroundColor: theme.panel,
                      color: theme.fg,
                      font: { size: 11 },
                      padding: 3,
                    },
                  },
                }),
          },
        },
      },
    },
  } as ChartConfiguration;
}
