import { describe, it, expect, beforeAll } from 'vitest';
import { dispatch } from '../../electron/handlers';
import { edgeCase } from '../../electron/engine/report';
import type { BuildReportRequest, ProjectScenario, ProjectSyncSettings, ReportResult, ReportTable } from '../../shared-types';
import { demoPlant } from '../helpers/plants';
import { expectClose } from '../helpers/expect-close';

const ctx = () => ({ progress: () => undefined, signal: new AbortController().signal });

async function call<T>(method: string, request: unknown): Promise<T> {
  const r = await dispatch(method, request, ctx());
  if (!r.ok) throw new Error(`${method}: ${r.error.message}`);
  return r.value as T;
}

const table = (r: ReportResult, id: string): ReportTable => {
  const t = r.tables.find((x) => x.id === id);
  if (!t) throw new Error(`no table ${id}`);
  return t;
};

// Demo data for the test (our own invention): a 200 kW block load on the demo plant.
const scenario: ProjectScenario = {
  id: 's1',
  name: 'Pump start block',
  durationS: 4,
  stepMs: 2,
  events: [{ atS: 0.5, type: 'load-step', kW: 200, kVAR: 150 }],
};
const sync: ProjectSyncSettings = {
  presetId: null,
  limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true },
  breakerClosingMs: 80,
  dead: { deadBus: true, deadLine: false, livePct: 80, deadPct: 20 },
  incomingSetId: 'G3',
};

describe('buildReport on the demo plant', () => {
  const plant = demoPlant();
  const request: BuildReportRequest = {
    project: { name: 'Kestrel <Ford> & works', plant, scenarios: [scenario], sync },
    date: '2026-12-02',
    loadsPct: [25, 50, 75, 100],
    closingMap: { angleSteps: 13, slipSteps: 5, slipRangeHz: 0.4 },
  };
  let report: ReportResult;
  beforeAll(async () => {
    report = await call<ReportResult>('buildReport', request);
  });

  it('carries every section, the date, the project name (escaped), definitions and cautions', () => {
    for (const id of ['plant', 'settings', 'sharing', 'droop-lines', 'sync', 'transients', 'definitions', 'cautions']) {
      expect(report.html).toContain(`<section id="${id}">`);
      expect(report.sections.map((s) => s.id)).toContain(id);
    }
    expect(report.html).toContain('datetime="2026-12-02"');
    expect(report.html).toContain('Kestrel &lt;Ford&gt; &amp; works');
    expect(report.html).not.toContain('<Ford>');
    expect(report.html).toContain('Speed droop');
    expect(report.html).toContain('Q_base = S_r × √(1 − cos²φ_r)');
    expect(report.html).toContain('planning and training only');
    expect(report.html).toContain('Closing out of phase can damage machines and injure people');
    expect(report.html).toContain("makers' data, protection studies, local codes and licensed practice");
    expect(report.html).not.toMatch(/NaN|undefined|\[object Object\]/);
    expect(report.html).not.toMatch(/<script/i);
    expect(report.fileStem).toBe('kestrel-ford-works-report-2026-12-02');
  });

  it('sharing table numbers equal solveSharing at each chosen load', async () => {
    const onlineKW = plant.sets.filter((s) => s.online).reduce((a, s) => a + s.ratedKW, 0);
    const bus = table(report, 'sharing-bus');
    const sets = table(report, 'sharing-sets');
    let solved = 0;
    for (const pct of [25, 50, 75, 100]) {
      const kW = (onlineKW * pct) / 100;
      const row = bus.rows.find((r) => r[0] === `${pct} %`)!;
      expect(row[1]).toBe(kW);
      // Load power factor 0.8 lagging (the report's default): kVAR = kW · tan(acos 0.8) = 0.75 kW (closed form).
      expectClose(row[2] as number, kW * 0.75, { rel: 1e-12 }, 'load kVAR');
      const r = await dispatch('solveSharing', { plant, load: { kW, kVAR: row[2] }, atMost: true }, ctx());
      expect(r.ok, `${pct} % computed`).toBe(true);
      if (!r.ok) continue;
      const expected = r.value;
      solved++;
      expect(row[3]).toBe(expected.bus.frequencyHz);
      expect(row[4]).toBe(expected.bus.voltageV);
      expect(report.html).toContain(`<td class="num">${expected.bus.frequencyHz.toFixed(3)}</td>`);
      for (const s of expected.sets) {
        const r = sets.rows.find((x) => x[0] === `${pct} %` && x[1] === s.id)!;
        expect([r[2], r[3], r[8]]).toEqual([s.kW, s.kVAR, s.currentA]);
      }
    }
    // Every point has an answer, full load included: no "Not computed" in the section.
    expect(solved).toBe(4);
    expect(report.html).not.toContain('Not computed');
    expect(report.sections.find((x) => x.id === 'sharing')!.problem).toBeNull();
    // The overload point: 110 % of the rating (every set's overload limit). With feeder losses on top the
    // demo plant cannot carry all of it; the row shows the most it can carry and says so.
    const over = bus.rows.find((r) => r[0] === 'overload limit (110 %)')!;
    expect(over[1]).toBeCloseTo(onlineKW * 1.1, 9);
    expect(over[3]).not.toBeNull();
    expect(String(over[5])).toMatch(/^2244 kW cannot be carried \(\d+ kW short\); shown: the most the sets carry, \d+ kW \(10\d(\.\d)? % of rating\)\./);
    const connected = await call<{ bus: { frequencyHz: number } }>('solveSharing', { plant });
    expect(bus.rows[0]![3]).toBe(connected.bus.frequencyHz);
  });

  it('sync-check settings and closing map equal evaluateSync and closingMap', async () => {
    const c = edgeCase(plant, sync, 'G3');
    const edge = await call<{
      advanceAngleDeg: number;
      closeNow: { surgeCurrentA: number; peakCurrentA: number; peakTorqueKNm: number; torqueStepKNm: number };
    }>('evaluateSync', c);
    const t = table(report, 'sync-settings');
    const value = (label: string) => t.rows.find((r) => r[0] === label)![1];
    // At the slip limit itself, not the edge case just inside it (closed form): advance 360 × 0.2 Hz × 0.08 s = 5.76°,
    // slip period 1 / 0.2 Hz = 5.00 s.
    expectClose(value('Advance angle at the slip limit') as number, 360 * 0.2 * 0.08, { rel: 1e-12 }, 'advance angle');
    expectClose(value('Slip period at the slip limit') as number, 5, { rel: 1e-12 }, 'slip period');
    expect(value('Torque step at the window edge')).toBe(edge.closeNow.torqueStepKNm);
    expect(value('Peak air-gap torque at the window edge')).toBe(edge.closeNow.peakTorqueKNm);
    expect(value('Surge closing at the window edge')).toBe(edge.closeNow.surgeCurrentA);
    expect(value('Peak with DC offset')).toBe(edge.closeNow.peakCurrentA);
    expect(value('Breaker closing time')).toBe(80);
    const map = await call<{ surgeCurrentPU: number[]; anglesDeg: number[]; slipsHz: number[] }>('closingMap', {
      case: c,
      angleSteps: 13,
      slipSteps: 5,
      slipRangeHz: 0.4,
    });
    const grid = table(report, 'closing-map');
    expect(grid.printed).toBe(false);
    expect(grid.rows.map((r) => r[2])).toEqual(map.surgeCurrentPU);
    expect(report.charts.map((x) => x.id)).toContain('closing-map');
  });

  it('transient metrics equal simulate (or carry its exact message)', async () => {
    const r = await dispatch('simulate', { name: scenario.name, plant, durationS: 4, stepMs: 2, outputPoints: 800, events: scenario.events }, ctx());
    const row = table(report, 'transient-metrics').rows[0]!;
    if (r.ok) {
      const m = r.value.metrics;
      expect(row.slice(1, 10)).toEqual([
        m.frequencyNadirHz,
        m.frequencyPeakHz,
        m.frequencyDeviationPct,
        m.frequencyRecoveryS,
        m.voltageDipPct,
        m.voltagePeakPct,
        m.voltageRecoveryS,
        m.final.frequencyHz,
        m.final.voltageV,
      ]);
      const classes = table(report, 'transient-classes-1');
      expect(classes.rows.length).toBe(m.classes.length);
      expect(classes.rows[0]![9]).toBe(m.classes[0]!.source);
      expect(report.html).toMatch(/meets|fails|not judged/);
      expect(report.charts.map((x) => x.id)).toEqual(expect.arrayContaining(['transient-1-frequency', 'transient-1-voltage']));
    } else {
      expect(row[10]).toBe(r.error.message);
      expect(report.sections.find((s) => s.id === 'transients')!.problem).toBe(r.error.message);
    }
  });

  it('draws the droop-line charts as SVG with the operating points', () => {
    const speed = report.charts.find((c) => c.id === 'droop-speed')!;
    expect(speed.svg.startsWith('<svg')).toBe(true);
    expect(speed.svg).toContain('G1 operating points');
    expect(report.html).toContain('id="chart-droop-reactive"');
  });
});

describe('buildReport input and control', () => {
  it('runs its own block-load scenario when the project has none, and says so', async () => {
    const r = await call<ReportResult>('buildReport', { project: { plant: demoPlant() }, date: '2026-12-02', closingMap: { angleSteps: 5, slipSteps: 3 } });
    // 25 % of the online 2040 kW = 510 kW; kVAR at PF 0.8 = 382.5 → 382 (closed form, rounded for the label).
    expect(r.html).toContain('Block load 510 kW, 382 kVAR at 1 s');
    expect(r.html).toContain('the report runs its own block-load step');
    expect(r.html).toContain('common-practice limit preset');
  });

  it('refuses bad input naming the field and the rule', async () => {
    const r = await dispatch('buildReport', { project: { plant: demoPlant() }, date: '', loadsPct: [50, 0], loadPF: 1.2 }, ctx());
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('INVALID_INPUT');
    expect(r.error.message).toContain('date: must not be empty');
    expect(r.error.message).toContain('loadsPct[1]: must be greater than 0');
    expect(r.error.message).toContain('loadPF: must be at most 1');
  });

  it('stops with CANCELLED when the caller cancels', async () => {
    const ctl = new AbortController();
    ctl.abort();
    const r = await dispatch('buildReport', { project: { plant: demoPlant() }, date: '2026-12-02' }, { progress: () => undefined, signal: ctl.signal });
    expect(r.ok ? 'ok' : r.error.code).toBe('CANCELLED');
  });

  it('prints a failing section in its place and still builds the rest', async () => {
    const bad: ProjectSyncSettings = { ...sync, incomingSetId: 'G9' };
    const r = await call<ReportResult>('buildReport', { project: { plant: demoPlant(), scenarios: [], sync: bad }, date: '2026-12-02' });
    expect(r.sections.find((s) => s.id === 'sync')!.problem).toBe('sync.incomingSetId: "G9" is not a set of the plant.');
    expect(r.html).toContain('Not computed:</strong> sync.incomingSetId');
    expect(r.sections.find((s) => s.id === 'transients')!.problem).toBe('The project has no transient scenarios.');
    expect(r.sections.find((s) => s.id === 'sharing')!.problem).toBeNull();
  });
});

describe('report: the loads in the plant description', () => {
  it("shows each load's voltage-law shares, frequency sensitivities and shedding stage", async () => {
    const plant = demoPlant();
    plant.loads[0] = {
      ...plant.loads[0]!,
      model: 'zip',
      kWImpedancePct: 30,
      kWCurrentPct: 20,
      kVARImpedancePct: 100,
      kVARFrequencySensitivity: -2,
      shedFrequencyPct: 97,
      shedDelayS: 0.3,
    };
    const r = await call<ReportResult>('buildReport', { project: { plant }, date: '2026-12-02', loadsPct: [50] });
    const t = table(r, 'loads');
    expect(t.title).toContain('below 70 % voltage');
    const row = t.rows[0]!;
    const col = (name: string) => row[t.columns.indexOf(name)];
    expect(col('kW shares Z / I / P (%)')).toBe('30 / 20 / 50');
    expect(col('kVAR shares Z / I / P (%)')).toBe('100 / 0 / 0');
    expect(col('kVAR f-sensitivity (%/%)')).toBe(-2);
    // 97 % of the demo plant's rated frequency (closed form).
    expectClose(col('Shed below (Hz)') as number, 0.97 * plant.ratedFrequencyHz, { rel: 1e-12 }, 'shedding frequency, Hz');
    expect(col('Shed delay (s)')).toBe(0.3);
    // A constant-power load without a stage: 0 / 0 / 100, never shed.
    const other = t.rows.find((x) => x[5] === 'constant-power')!;
    expect(other[6]).toBe('0 / 0 / 100');
    expect(other[10]).toBeNull();
  });
});
