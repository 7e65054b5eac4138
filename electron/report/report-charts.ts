/**
 * The report's charts as SVG: the speed-droop and reactive-droop lines of every set with the
 * operating points of the sharing table, the closing map (surge and first-cycle peak torque), and each
 * scenario's frequency and voltage. The droop laws themselves live in shared-types/laws.ts.
 */
import { CLOSING_MAP_ANGLE_AXIS_LABEL } from '../../shared-types';
import type { GenSet, Plant, ReportChart, SimulationResult } from '../../shared-types';
import { kVARBase, reactiveDroopV, speedDroopHz } from '../../shared-types';
import { heatMapSvg } from './svg-heat-map';
import { lineChartSvg } from './svg-line-chart';
import type { ChartSeries } from './svg-line-chart';
import type { ReportData } from '../engine/report';
import { isSyncPart } from './report-tables';

/**
 * A set's speed-droop line, frequency (Hz) against output (kW), from no load to rated kW:
 * droop `f = noLoadHz − droopPct/100 · fr · P / ratedKW`; isochronous holds `setpointHz`;
 * base load is a vertical line at `baseKW` (it holds kW, whatever the frequency).
 */
export function speedDroopLine(set: GenSet, ratedHz: number): { kW: number[]; hz: number[] } {
  const g = set.governor;
  if (g.mode === 'baseload') return { kW: [g.baseKW, g.baseKW], hz: [ratedHz * 0.97, ratedHz * 1.03] };
  if (g.mode === 'isochronous') return { kW: [0, set.ratedKW], hz: [g.setpointHz, g.setpointHz] };
  const at = (kW: number) => speedDroopHz(g.noLoadHz, g.droopPct, ratedHz, set.ratedKW, kW);
  return { kW: [0, set.ratedKW], hz: [at(0), at(set.ratedKW)] };
}

/**
 * A set's reactive-droop line, terminal voltage (V) against kVAR, from 30 % of `Qbase` leading
 * to `Qbase` lagging: `V = noLoadV − droopPct/100 · Vr · Q / Qbase`, `Qbase = kVA·√(1 − PF²)`.
 * Voltage and cross-current regulators hold `setpointV`; power-factor control has no such line.
 */
export function reactiveDroopLine(set: GenSet, ratedV: number): { kVAR: number[]; v: number[] } | null {
  const r = set.regulator;
  const qBase = kVARBase(set.ratedKVA, set.ratedPF);
  const q = [-0.3 * qBase, qBase];
  if (r.mode === 'power-factor') return null;
  if (r.mode !== 'reactive-droop') return { kVAR: q, v: [r.setpointV, r.setpointV] };
  return { kVAR: q, v: q.map((x) => reactiveDroopV(r.noLoadV, r.droopPct, ratedV, qBase, x)) };
}

function chart(id: string, built: { svg: string; widthPx: number; heightPx: number }, title: string): ReportChart {
  return { id, title, ...built };
}

function droopCharts(d: ReportData): ReportChart[] {
  const plant: Plant = d.plant;
  const solved = d.sharing.filter((p) => p.result);
  const speed: ChartSeries[] = [];
  const reactive: ChartSeries[] = [];
  plant.sets.forEach((set, i) => {
    const line = speedDroopLine(set, plant.ratedFrequencyHz);
    speed.push({ label: `${set.id} ${set.governor.mode}`, x: line.kW, y: line.hz, style: i });
    const ops = solved.flatMap((p) => {
      const s = p.result!.sets.find((x) => x.id === set.id);
      return s?.online ? [{ kW: s.kW, kVAR: s.kVAR, terminalV: s.terminalV, hz: p.result!.bus.frequencyHz }] : [];
    });
    speed.push({ label: `${set.id} operating points`, x: ops.map((o) => o.kW), y: ops.map((o) => o.hz), style: i, markersOnly: true });
    const rl = reactiveDroopLine(set, plant.ratedVoltageV);
    if (rl) reactive.push({ label: `${set.id} ${set.regulator.mode}`, x: rl.kVAR, y: rl.v, style: i });
    reactive.push({ label: `${set.id} operating points`, x: ops.map((o) => o.kVAR), y: ops.map((o) => o.terminalV), style: i, markersOnly: true });
  });
  return [
    chart(
      'droop-speed',
      lineChartSvg({
        title: 'Speed droop lines and operating points',
        xLabel: 'Output (kW)',
        yLabel: 'Frequency (Hz)',
        series: speed,
        references: [{ axis: 'y', value: plant.ratedFrequencyHz, label: `rated ${plant.ratedFrequencyHz} Hz` }],
      }),
      'Speed droop lines and operating points',
    ),
    chart(
      'droop-reactive',
      lineChartSvg({
        title: 'Reactive droop lines and operating points',
        xLabel: 'Reactive output (kVAR, + lagging)',
        yLabel: 'Terminal voltage (V)',
        series: reactive,
        references: [{ axis: 'y', value: plant.ratedVoltageV, label: `rated ${plant.ratedVoltageV} V` }],
      }),
      'Reactive droop lines and operating points',
    ),
  ];
}

function closingMapChart(d: ReportData): ReportChart[] {
  if (!isSyncPart(d.sync) || !d.sync.map) return [];
  const m = d.sync.map;
  const l = d.sync.settings.limits;
  const axis = CLOSING_MAP_ANGLE_AXIS_LABEL[m.angleAxis];
  const xLabel = `${axis[0]!.toUpperCase()}${axis.slice(1)} (°)`;
  const box = { x0: -l.angleDeg, x1: l.angleDeg, y0: l.incomingFaster ? 0 : -l.slipHz, y1: l.slipHz, label: 'sync-check window' };
  const layers = [
    {
      id: 'closing-map',
      title: `Closing map: surge current (pu of the incoming set) — ${d.sync.incomingSetId}`,
      valueLabel: 'surge (pu)',
      values: m.surgeCurrentPU,
    },
    {
      id: 'closing-map-peak-torque',
      title: `Closing map: first-cycle peak air-gap torque, |pu| of the torque base — ${d.sync.incomingSetId}`,
      valueLabel: 'peak torque (|pu|)',
      values: m.peakTorquePU.map(Math.abs),
    },
  ];
  return layers.map((k) =>
    chart(
      k.id,
      heatMapSvg({
        title: k.title,
        xLabel,
        yLabel: 'Slip (Hz, + incoming faster)',
        valueLabel: k.valueLabel,
        x: m.anglesDeg,
        y: m.slipsHz,
        values: k.values,
        box,
      }),
      k.title,
    ),
  );
}

function transientCharts(d: ReportData): ReportChart[] {
  const out: ReportChart[] = [];
  d.transients.forEach((t, i) => {
    const r: SimulationResult | null = t.result;
    if (!r) return;
    const n = i + 1;
    const fTitle = `Frequency — ${t.scenario.name}`;
    const vTitle = `Bus voltage — ${t.scenario.name}`;
    out.push(
      chart(
        `transient-${n}-frequency`,
        lineChartSvg({
          title: fTitle,
          xLabel: 'Time (s)',
          yLabel: 'Frequency (Hz)',
          series: [{ label: 'bus frequency', x: r.series.t, y: r.series.frequencyHz, style: 0 }],
          references: [{ axis: 'y', value: d.plant.ratedFrequencyHz, label: `rated ${d.plant.ratedFrequencyHz} Hz` }],
          heightPx: 240,
        }),
        fTitle,
      ),
      chart(
        `transient-${n}-voltage`,
        lineChartSvg({
          title: vTitle,
          xLabel: 'Time (s)',
          yLabel: 'Voltage (V, line-to-line)',
          series: [{ label: 'bus voltage', x: r.series.t, y: r.series.voltageV, style: 1 }],
          references: [{ axis: 'y', value: d.plant.ratedVoltageV, label: `rated ${d.plant.ratedVoltageV} V` }],
          heightPx: 240,
        }),
        vTitle,
      ),
    );
  });
  return out;
}

/** Every chart of the report, in the order printed. */
export function reportCharts(d: ReportData): ReportChart[] {
  return [...droopCharts(d), ...closingMapChart(d), ...transientCharts(d)];
}
