import { describe, it, expect } from 'vitest';
import { characteristicSeries, formatNumber, heatMapSvg, lineChartSvg, niceTicks } from '../../electron/report';
import { setCharacteristics } from '../../electron/engine';
import { demoPlant } from '../helpers/plants';
import { expectClose } from '../helpers/expect-close';

describe('niceTicks', () => {
  it('covers the range with 1-2-2.5-5 steps', () => {
    expect(niceTicks(49.1, 50.68, 5)).toMatchObject({ step: 0.5, min: 49, max: 51 });
    expect(niceTicks(0, 1000, 6).ticks).toEqual([0, 200, 400, 600, 800, 1000]);
    expect(niceTicks(5, 5).ticks.length).toBeGreaterThan(1);
  });
});

describe('formatNumber', () => {
  it('never prints NaN or a negative zero', () => {
    expect(formatNumber(Number.NaN, 2)).toBe('—');
    expect(formatNumber(null, 2)).toBe('—');
    expect(formatNumber(-0.0004, 2)).toBe('0.00');
    expect(formatNumber(1804.2235, 1)).toBe('1804.2');
  });
});

describe('droop lines', () => {
  // The report draws the engine's characteristics (the same lines as the app's charts), from limit to limit.
  it('speed droop line falls by droopPct of rated frequency per rated kW, to the overload limit', () => {
    const plant = demoPlant();
    const g1 = plant.sets[0]!;
    const line = characteristicSeries(setCharacteristics(g1, plant).speed, 50)!;
    // 4 % droop on 50 Hz, no-load 51.2 Hz → 51.2 − 0.04 × 50 × 1.1 = 49.0 Hz at the 1100 kW overload limit (README "Definitions", closed form).
    expect(line.x).toEqual([-250, 1100]);
    expectClose(line.y[1]!, 49.0, { abs: 1e-12 }, 'frequency at the overload limit');
    // At rated kW on the same line: 51.2 − 0.04 × 50 = 49.2 Hz (closed form).
    expectClose(line.y[0]! + ((line.y[1]! - line.y[0]!) * (1000 - line.x[0]!)) / (line.x[1]! - line.x[0]!), 49.2, { abs: 1e-12 }, 'full-load frequency');
  });
  it('reactive droop line drops droopPct of rated voltage at Qbase', () => {
    const plant = demoPlant();
    const g1 = plant.sets[0]!;
    const line = characteristicSeries(setCharacteristics(g1, plant).voltage, 400)!;
    // Qbase = 1250 × √(1 − 0.8²) = 750 kVAR; 410 − 0.04 × 400 = 394 V at 750 kVAR (README "Definitions", closed form).
    const at750 = line.y[0]! + ((line.y[1]! - line.y[0]!) * (750 - line.x[0]!)) / (line.x[1]! - line.x[0]!);
    expectClose(at750, 394, { abs: 1e-9 }, 'voltage at Qbase');
  });
});

describe('SVG charts', () => {
  it('line chart breaks the line at blanks and escapes labels', () => {
    const { svg } = lineChartSvg({
      title: 'a<b',
      xLabel: 't (s)',
      yLabel: 'f (Hz)',
      series: [{ label: 'x&y', x: [0, 1, 2, 3], y: [1, null, 2, Number.NaN], style: 0 }],
    });
    expect(svg).toContain('a&lt;b');
    expect(svg).toContain('x&amp;y');
    expect(svg).not.toContain('NaN');
    // Two separate pieces: "M… " only, never "L" from a blank.
    expect(svg).toMatch(/<path d="M[\d. ]+M[\d. ]+"/);
  });
  it('heat map shades every cell and outlines the window', () => {
    const { svg } = heatMapSvg({
      title: 'm',
      xLabel: 'a',
      yLabel: 's',
      valueLabel: 'pu',
      x: [-10, 0, 10],
      y: [-0.1, 0.1],
      values: [3, 1, 3, 3, 1, 3],
      box: { x0: -5, x1: 5, y0: 0, y1: 0.1, label: 'window' },
    });
    expect(svg.match(/<rect [^>]*fill="#[0-9a-f]{6}"/g)!.length).toBeGreaterThanOrEqual(6);
    expect(svg).toContain('stroke-dasharray="6 3"');
    expect(svg).toContain('window');
  });
});
