import { describe, it, expect } from 'vitest';
import { reactiveDroopChart, shareBarChart, speedDroopChart, sweepChart } from '../../renderer/components/charts/sharing-charts';
import { niceRange } from '../../renderer/components/charts/droop-lines';
import { kVARBase } from '../../shared-types';
import { DASHES, POINT_STYLES, seriesStyle } from '../../renderer/components/charts/series-style';
import { readChartTheme } from '../../renderer/components/charts/theme';
import { describePlant, solveSharing, speedDroopLine, sweepLoad } from '../../electron/engine';
import { demoPlant, makePlant, rawSet } from '../helpers/plants';
import { expectClose } from '../helpers/expect-close';

type Pt = { x: number; y: number };
interface DS {
  label: string;
  data: Pt[];
  borderDash?: number[];
  pointStyle?: string;
}
const datasets = (c: { data: { datasets: unknown[] } }) => c.data.datasets as DS[];
/** y of the straight line through a and b at x. */
const lineAt = (a: Pt, b: Pt, x: number) => a.y + ((b.y - a.y) * (x - a.x)) / (b.x - a.x);

const theme = readChartTheme();

describe('speed-droop chart', () => {
  it('draws each droop line by the closed form and puts every operating point on its line at the bus frequency', () => {
    const plant = demoPlant();
    const r = solveSharing(plant);
    const c = speedDroopChart(plant, r, theme, describePlant(plant));
    for (const s of plant.sets) {
      const line = datasets(c).find((d) => d.label.startsWith(`${s.id} droop`))!;
      const op = datasets(c).find((d) => d.label === `${s.id} operating point`)!;
      const [a, b] = line.data as [Pt, Pt];
      // The line ends at the overload (fuel) limit, 110 % of rated kW: f there = noLoadHz − 1.1 × droop/100 × f_rated
      // (the speed-droop definition, closed form); it starts at zero fuel, −25 % (motoring power).
      expectClose(b.y, s.governor.noLoadHz - 1.1 * (s.governor.droopPct / 100) * 50, { abs: 1e-12 }, `${s.id} f at the overload limit`);
      expectClose(b.x, 1.1 * s.ratedKW, { abs: 1e-9 }, 'overload limit kW');
      expectClose(a.x, -0.25 * s.ratedKW, { abs: 1e-9 }, 'zero fuel kW');
      expectClose(op.data[0]!.y, r.bus.frequencyHz, { abs: 1e-12 }, 'operating frequency');
      expectClose(lineAt(a, b, op.data[0]!.x), r.bus.frequencyHz, { abs: 1e-6 }, `${s.id} point on its line`);
    }
    const ann = (c.options?.plugins as { annotation: { annotations: { bus: { yMin: number } } } }).annotation.annotations.bus;
    expect(ann.yMin).toBe(r.bus.frequencyHz);
  });

  it('draws isochronous sets flat at their setpoint and base-load sets upright at their kW', () => {
    const plant = makePlant([
      rawSet('A', { governor: { mode: 'isochronous', setpointHz: 50 } }),
      rawSet('B', { governor: { mode: 'baseload', baseKW: 300 } }),
      rawSet('C'),
    ]);
    // From minKW (0) to the overload limit (110 % of 1000 kW).
    const iso = speedDroopLine(plant.sets[0]!, plant);
    expect(iso.kind === 'segment' && iso.points.map((p) => [+p.x.toFixed(9), p.y])).toEqual([
      [0, 50],
      [1100, 50],
    ]);
    expect(speedDroopLine(plant.sets[1]!, plant)).toEqual({ kind: 'vertical', x: 300 });
  });

  it('gives each set its own dash and point shape as well as colour', () => {
    const styles = [0, 1, 2, 3].map((i) => seriesStyle(i, theme));
    expect(new Set(styles.map((s) => s.dash.join(','))).size).toBe(4);
    expect(new Set(styles.map((s) => s.pointStyle)).size).toBe(4);
    expect(DASHES.length).toBeGreaterThanOrEqual(5);
    expect(POINT_STYLES.length).toBeGreaterThanOrEqual(5);
    const c = speedDroopChart(demoPlant(), null, theme, describePlant(demoPlant()));
    expect(datasets(c).map((d) => d.borderDash?.join(','))).toEqual(styles.slice(0, 3).map((s) => s.dash.join(',')));
  });
});

describe('reactive-droop chart', () => {
  it('puts each reactive-droop set’s operating point (kVAR, terminal V) on its line', () => {
    const plant = demoPlant();
    const r = solveSharing(plant);
    const c = reactiveDroopChart(plant, r, theme, describePlant(plant));
    for (const s of plant.sets) {
      const line = datasets(c).find((d) => d.label.startsWith(`${s.id} reactive droop`))!;
      const [a, b] = line.data as [Pt, Pt];
      // Slope: droop/100 × V_rated / Qbase, Qbase = kVA √(1 − PF²) (the reactive-droop definition, closed form).
      expectClose((a.y - b.y) / (b.x - a.x), ((s.regulator.droopPct / 100) * 400) / kVARBase(s.ratedKVA, s.ratedPF), { rel: 1e-12 }, 'slope');
      const set = r.sets.find((x) => x.id === s.id)!;
      expectClose(lineAt(a, b, set.kVAR), set.terminalV, { abs: 1e-3 }, `${s.id} on its line`);
    }
  });
});

describe('share and sweep charts', () => {
  it('stacks output and spare to the rating, and shows what is above the rating', () => {
    const plant = demoPlant();
    const r = solveSharing(plant);
    const c = shareBarChart(plant, r, theme);
    const d = datasets(c) as unknown as { label: string; data: number[] }[];
    const get = (l: string) => d.find((x) => x.label === l)!.data;
    plant.sets.forEach((s, i) => {
      expectClose(get('kW output')[i]! + get('kW spare to rating')[i]!, s.ratedKW, { rel: 1e-12 }, `${s.id} kW stack`);
      expectClose(get('kVA output')[i]! + get('kVA spare to rating')[i]!, s.ratedKVA, { rel: 1e-12 }, `${s.id} kVA stack`);
      expect(get('kW above rating')[i]).toBe(0);
    });
    // A set 100 kW above its 1000 kW rating (figures set by hand for the geometry).
    const over = { ...r, sets: r.sets.map((s, i) => (i === 0 ? { ...s, kW: 1100 } : s)) };
    const d2 = datasets(shareBarChart(plant, over, theme)) as unknown as { label: string; data: number[] }[];
    const get2 = (l: string) => d2.find((x) => x.label === l)!.data;
    expect([get2('kW output')[0], get2('kW above rating')[0], get2('kW spare to rating')[0]]).toEqual([1000, 100, 0]);
  });

  it('plots the sweep’s bus frequency and each set’s kW against total load', () => {
    const plant = demoPlant();
    const sweep = sweepLoad({ plant, steps: 12, fromPct: 0, toPct: 100 });
    const c = sweepChart(plant, sweep, theme, 1170);
    const d = datasets(c) as unknown as { label: string; data: { x: number; y: number | null }[] }[];
    expect(d).toHaveLength(1 + plant.sets.length);
    expect(d[0]!.data.map((p) => p.y)).toEqual(sweep.points.map((p) => p.frequencyHz));
    expect(d[2]!.data.map((p) => p.x)).toEqual(sweep.points.map((p) => p.loadKW));
    expect(d[2]!.data.map((p) => p.y)).toEqual(sweep.points.map((p) => p.setKW[1] ?? null));
  });

  it('hatches each run of sweep points without an operating point', () => {
    const plant = demoPlant();
    const sweep = sweepLoad({ plant, steps: 12, fromPct: 0, toPct: 100 });
    // Points blanked by hand: the first two and the last one.
    const blank = (k: number) => k < 2 || k === 11;
    const gappy = { ...sweep, points: sweep.points.map((p, k) => (blank(k) ? { ...p, frequencyHz: null } : p)) };
    const c = sweepChart(plant, gappy, theme, null);
    const boxes = (c.options?.plugins as { annotation: { annotations: Record<string, { xMin: number; xMax: number }> } }).annotation.annotations;
    const x = sweep.points.map((p) => p.loadKW);
    expect(boxes.none0).toMatchObject({ xMin: x[0], xMax: (x[1]! + x[2]!) / 2 });
    expect(boxes.none1).toMatchObject({ xMin: (x[10]! + x[11]!) / 2, xMax: x[11] });
    expect(Object.keys(boxes)).toHaveLength(2);
  });

  it('rounds axis ranges outward to half powers of ten', () => {
    expect(niceRange([48.93, 51.38])).toEqual([48.5, 51.5]);
    expect(niceRange([391.2, 416.6])).toEqual([390, 420]);
  });
});
