/**
 * The report's charts as SVG: the speed-droop and reactive-droop lines of every set with the
 * operating points of the sharing table, the closing map (surge and first-cycle peak torque), and each
 * scenario's frequency and voltage. The droop lines are the engine's characteristics of each set
 * (`describePlant`, the same lines the app's charts draw); nothing here computes a law.
 */
import { CLOSING_MAP_ANGLE_AXIS_LABEL } from '../../shared-types';
import type { Plant, ReportChart, SimulationResult, SpeedCharacteristic, VoltageCharacteristic } from '../../shared-types';
import { heatMapSvg } from './svg-heat-map';
import { lineChartSvg } from './svg-line-chart';
import type { ChartSeries } from './svg-line-chart';
import type { ReportData } from '../engine/report';
import { isSyncPart } from './report-tables';

/**
 * A set's characteristic as an SVG series (x, y lists): the engine's segment as given; a base-load set's vertical over
 * ±3 % of `ratedY` around it; none for a power-factor set (it holds kVAR = kW tan φ, no line in the V–kVAR plane).
 */
export function characteristicSeries(c: SpeedCharacteristic | VoltageCharacteristic, ratedY: number): { x: number[]; y: number[] } | null {
  if (c.kind === 'segment') return { x: c.points.map((p) => p.x), y: c.points.map((p) => p.y) };
  if (c.kind === 'vertical') return { x: [c.x, c.x], y: [ratedY * 0.97, ratedY * 1.03] };
  return null;
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
    const lines = d.description.sets[i]!.characteristics;
    const line = characteristicSeries(lines.speed, plant.ratedFrequencyHz);
    if (line) speed.push({ label: `${set.id} ${set.governor.mode}`, ...line, style: i });
    const ops = solved.flatMap((p) => {
      const s = p.result!.sets.find((x) => x.id === set.id);
      return s?.online ? [{ kW: s.kW, kVAR: s.kVAR, terminalV: s.terminalV, hz: p.result!.bus.frequencyHz }] : [];
    });
    speed.push({ label: `${set.id} operating points`, x: ops.map((o) => o.kW), y: ops.map((o) => o.hz), style: i, markersOnly: true });
    const rl = characteristicSeries(lines.voltage, plant.ratedVoltageV);
    if (rl) reactive.push({ label: `${set.id} ${set.regulator.mode}`, ...rl, style: i });
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
