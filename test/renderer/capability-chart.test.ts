import { describe, it, expect } from 'vitest';
import { describePlant, solveSharing } from '../../electron/engine';
import { capabilityChart, CAPABILITY_WORDS } from '../../renderer/components/charts/capability-chart';
import { readChartTheme } from '../../renderer/components/charts/theme';
import { demoPlant } from '../helpers/plants';

const theme = readChartTheme();
type Ds = { label: string; data: { x: number; y: number }[] };

describe('capability chart', () => {
  it('draws the engine’s limit curves, names each limit in words, and puts the operating point where the solver put it', () => {
    const plant = demoPlant();
    const d = describePlant(plant).sets[0]!;
    const r = solveSharing(plant).sets[0]!;
    const c = capabilityChart(d.capability, r, theme);
    const ds = c.data.datasets as unknown as Ds[];
    expect(ds.map((x) => x.label)).toEqual([CAPABILITY_WORDS.stator, CAPABILITY_WORDS.field, CAPABILITY_WORDS.point]);
    // The stator curve is the engine's rated-kVA circle (1250 kVA for G1).
    for (const p of ds[0]!.data) expect(Math.abs(Math.hypot(p.x, p.y) - 1250)).toBeLessThan(1e-9);
    expect(ds[2]!.data).toEqual([{ x: r.kW, y: r.kVAR }]);
    const ann = (c.options?.plugins as { annotation: { annotations: Record<string, { xMin?: number; yMin?: number; label: { content: string } }> } }).annotation
      .annotations;
    expect(ann.overload!.xMin).toBeCloseTo(1100, 9); // 110 % of 1000 kW
    expect(ann.zeroFuel!.xMin).toBeCloseTo(-250, 9); // −25 % of 1000 kW
    expect(ann.reverse!.xMin).toBeCloseTo(-80, 9); // G1's 32 setting: 8 %
    expect(ann.leading!.yMin).toBeCloseTo(-375, 9); // 30 % of 1250 kVA
    expect(ann.overload!.label.content).toBe('overload 1100 kW');
    expect(ann.zeroFuel!.label.content).toBe('zero fuel −250 kW');
    expect(ann.leading!.label.content).toBe('under-excitation −375 kVAR');
    // Every upright label fits the plot of a small chart (CAPABILITY_LINE_WORDS: about 24 characters at most).
    for (const key of ['rated', 'overload', 'zeroFuel', 'reverse'] as const) expect(ann[key]!.label.content.length).toBeLessThanOrEqual(24);
    // An offline set: no point.
    expect((capabilityChart(d.capability, { ...r, online: false }, theme).data.datasets as unknown as Ds[]).map((x) => x.label)).not.toContain(
      CAPABILITY_WORDS.point,
    );
  });

  it('keeps the limit curves of one capability and theme from edit to edit, and redraws them for another theme', () => {
    const plant = demoPlant();
    const d = describePlant(plant).sets[0]!;
    const r = solveSharing(plant).sets[0]!;
    const a = capabilityChart(d.capability, r, theme).data.datasets as unknown as Ds[];
    const b = capabilityChart(d.capability, { ...r, kW: r.kW + 50 }, theme).data.datasets as unknown as Ds[];
    expect(b[0]).toBe(a[0]);
    expect(b[1]).toBe(a[1]);
    expect(b[2]!.data).toEqual([{ x: r.kW + 50, y: r.kVAR }]);
    const other = capabilityChart(d.capability, r, { ...theme }).data.datasets as unknown as Ds[];
    expect(other[0]).not.toBe(a[0]);
    expect(other[0]!.data).toEqual(a[0]!.data);
  });
});
