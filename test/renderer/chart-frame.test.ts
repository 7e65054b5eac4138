import { describe, expect, it } from 'vitest';
import { bottomLegend, linearAxis, STILL_CHART } from '../../renderer/components/charts/chart-frame';
import type { ChartTheme } from '../../renderer/components/charts/theme';
import { recordChart } from '../../renderer/components/commissioning/commissioning-charts';

/** A theme whose colours are all different, so each one is seen to land where it belongs. */
const theme: ChartTheme = {
  fg: '#101010',
  muted: '#202020',
  grid: '#303030',
  panel: '#404040',
  accent: '#505050',
  good: '#606060',
  warn: '#707070',
  bad: '#808080',
  series: ['#909090', '#a0a0a0'],
};

describe('chart frame shared by the Planner and Commissioning charts', () => {
  it('titles a linear axis and colours its ticks, grid and border from the theme', () => {
    expect(linearAxis(theme, 'time, s')).toEqual({
      type: 'linear',
      title: { display: true, text: 'time, s', color: '#101010' },
      ticks: { color: '#202020' },
      grid: { color: '#303030' },
      border: { color: '#303030' },
    });
    expect(bottomLegend(theme)).toEqual({ position: 'bottom', labels: { color: '#101010', usePointStyle: true, boxHeight: 8 } });
  });

  it("frames a commissioning record's chart with it: still, filling its panel, time across, legend below", () => {
    const c = recordChart({ tS: [0, 0.5, 1], frequencyHz: [50, 49.6, 49.9], voltageV: [400, 396, 399] }, 'frequency', theme);
    expect(c.options).toMatchObject({ ...STILL_CHART, parsing: false, plugins: { legend: bottomLegend(theme) } });
    expect(c.options?.scales).toEqual({ x: linearAxis(theme, 'time, s'), y: linearAxis(theme, 'frequency, Hz') });
    expect(c.data.datasets[0]!.data).toEqual([
      { x: 0, y: 50 },
      { x: 0.5, y: 49.6 },
      { x: 1, y: 49.9 },
    ]);
  });
});
