import { describe, it, expect } from 'vitest';
import { CABLE_SIZES, cableImpedance } from '../../shared-types';
import { expectClose } from '../helpers/expect-close';

describe('cableImpedance', () => {
  it('gives R = r20 (1 + α (T − 20)) L / n and X = x50 (f / 50) L / n', () => {
    // 240 mm² copper: r20 = 0.0754 Ω/km (IEC 60228 class 2, from memory), x = 0.079 Ω/km at 50 Hz (typical, practice).
    const z = cableImpedance({ lengthM: 80, sizeMM2: 240, runs: 2, conductorC: 70, frequencyHz: 60 });
    if (!z.ok) throw new Error(z.message);
    // α = 0.00393 /K for annealed copper at 20 °C (IEC 60028, from memory).
    // Closed form: 0.0754 × (1 + 0.00393 × 50) × 0.08 / 2 = 0.003608 Ω; 0.079 × 1.2 × 0.08 / 2 = 0.003792 Ω.
    expectClose(z.rOhm, (0.0754 * (1 + 0.00393 * 50) * 0.08) / 2, { rel: 1e-12 }, 'R');
    expectClose(z.xOhm, (0.079 * 1.2 * 0.08) / 2, { rel: 1e-12 }, 'X');
    expectClose(z.rOhm, 0.003608, { abs: 1e-6 }, 'R rounded');
  });

  it('has resistance falling and sizes rising down the table', () => {
    for (let i = 1; i < CABLE_SIZES.length; i++) {
      expect(CABLE_SIZES[i]!.sizeMM2).toBeGreaterThan(CABLE_SIZES[i - 1]!.sizeMM2);
      expect(CABLE_SIZES[i]!.r20OhmPerKm).toBeLessThan(CABLE_SIZES[i - 1]!.r20OhmPerKm);
    }
  });

  it('names the bad field instead of returning NaN', () => {
    expect(cableImpedance({ lengthM: -5, sizeMM2: 95, runs: 1, conductorC: 70, frequencyHz: 50 })).toEqual({
      ok: false,
      message: 'length: must be 0 m or more',
    });
    expect(cableImpedance({ lengthM: 5, sizeMM2: 96, runs: 1, conductorC: 70, frequencyHz: 50 })).toEqual({
      ok: false,
      message: 'size: 96 mm² is not in the cable table',
    });
    expect(cableImpedance({ lengthM: 5, sizeMM2: 95, runs: 0.5, conductorC: 70, frequencyHz: 50 })).toEqual({
      ok: false,
      message: 'runs: must be a whole number, 1 or more',
    });
  });
});
