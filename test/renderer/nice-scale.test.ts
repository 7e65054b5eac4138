// Round tick values for chart axes (steps of 1, 2, 2.5, 5 × 10ⁿ).
import { describe, expect, it } from 'vitest';
import { niceBounds, niceStep, niceTicks } from '../../renderer/components/charts/nice-scale';

describe('round ticks', () => {
  it('chooses 1, 2, 2.5 or 5 × 10ⁿ steps', () => {
    expect(niceStep(2244, 5)).toBe(500);
    expect(niceStep(6.8, 5)).toBe(2);
    expect(niceStep(0.9, 5)).toBe(0.2);
    expect(niceStep(1.2, 5)).toBe(0.25);
  });
  it('puts ticks on round values, never 3.7 / 0.3 / −3.1', () => {
    expect(niceTicks(-3.1, 3.7)).toEqual([-2, 0, 2]);
    expect(niceTicks(49.62, 50.31)).toEqual([49.8, 50, 50.2]);
    expect(niceTicks(0, 2244)).toEqual([0, 500, 1000, 1500, 2000]);
    expect(niceTicks(-0.3, 0.3)).toEqual([-0.2, 0, 0.2]);
  });
  it('widens a range outwards to round ends (the load sweep ends at 2500 kW, not 2244)', () => {
    expect(niceBounds(0, 2244)).toEqual([0, 2500]);
    expect(niceBounds(-3.1, 3.7)).toEqual([-4, 4]);
  });
});
