import { describe, expect, it } from 'vitest';
import { finiteDifferenceSensitivity, sharingSensitivity } from '../../../electron/engine';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';
import { expectClose } from '../../helpers/expect-close';

const noFeeder = { rOhm: 0, xOhm: 0 };

describe('sharingSensitivity', () => {
  it('sharingSensitivity closed form: two droop sets, values recomputed from the droop slopes', () => {
    // A: 1000 kW at 4 %, B: 500 kW at 5 %, 50 Hz: k_A = 1000 / (0.04 × 50) = 500 kW/Hz,
    // k_B = 500 / (0.05 × 50) = 200 kW/Hz (closed form). +0.1 Hz on A: bus +0.1 × 500/700 Hz,
    // A gains 500 × (1 − 500/700) × 0.1 = 14.2857 kW, B loses the same.
    const plant = makePlant([
      rawSet('A', { feeder: noFeeder }),
      rawSet('B', { ratedKW: 500, ratedKVA: 625, governor: { mode: 'droop', droopPct: 5, noLoadHz: 52 }, feeder: noFeeder }),
    ]);
    const load = { kW: 900, kVAR: 500 };
    const r = sharingSensitivity(plant, load);
    expect(r.method).toBe('closed-form');
    expectClose(r.kWPerSpeed[0]![0]!, 500 * (1 - 500 / 700) * 0.1, { rel: 1e-12 }, 'A per A');
    expectClose(r.kWPerSpeed[1]![0]!, -500 * (1 - 500 / 700) * 0.1, { rel: 1e-12 }, 'B per A');
    expectClose(r.busHzPerSpeed[0]!, (0.1 * 500) / 700, { rel: 1e-12 }, 'bus per A');
    // Reactive: b = Qbase / (droop × V) = 750 / (0.04 × 400) = 46.875 and 375 / (0.04 × 400) = 23.4375 kVAR/V;
    // +1 % (4 V) on A: A gains 46.875 × (1 − 46.875/70.3125) × 4 = 62.5 kVAR (closed form).
    expectClose(r.kVARPerVoltage[0]![0]!, 46.875 * (1 - 46.875 / 70.3125) * 4, { rel: 1e-12 }, 'kVAR A per A');
    expect(r.largest[0]).toMatchObject({ quantity: 'kW', cause: 'speed' });
  });

  it('sharingSensitivity closed form equals central finite differences of the solver', () => {
    const plant = makePlant([
      rawSet('A', { feeder: noFeeder }),
      rawSet('B', {
        ratedKW: 500,
        ratedKVA: 625,
        governor: { mode: 'droop', droopPct: 5, noLoadHz: 52 },
        regulator: { mode: 'reactive-droop', droopPct: 3, noLoadV: 410 },
        feeder: noFeeder,
      }),
      rawSet('C', { ratedKW: 800, ratedKVA: 1000, feeder: noFeeder }),
    ]);
    const load = { kW: 1500, kVAR: 900 };
    const cf = sharingSensitivity(plant, load);
    const fd = finiteDifferenceSensitivity(plant, load);
    expect(cf.method).toBe('closed-form');
    for (const key of ['kWPerSpeed', 'kVARPerSpeed', 'kWPerVoltage', 'kVARPerVoltage'] as const) {
      cf[key].forEach((row, i) => row.forEach((v, j) => expectClose(v, fd[key][i]![j]!, { abs: 1e-6 }, `${key}[${i}][${j}]`)));
    }
    cf.busHzPerSpeed.forEach((v, j) => expectClose(v, fd.busHzPerSpeed[j]!, { abs: 1e-9 }, 'bus Hz'));
    cf.busVPerVoltage.forEach((v, j) => expectClose(v, fd.busVPerVoltage[j]!, { abs: 1e-7 }, 'bus V'));
  });

  it('sharingSensitivity with feeders uses the solver and keeps the invariants of a common speed shift', () => {
    // Raising every droop set's no-load frequency by 0.1 Hz moves the bus by 0.1 Hz and nobody's kW
    // (loads here do not depend on frequency): the columns of kW sum to ~0 per row and bus Hz to 0.1.
    const plant = demoPlant();
    const r = sharingSensitivity(plant);
    expect(r.method).toBe('finite-difference');
    expectClose(
      r.busHzPerSpeed.reduce((a, b) => a + b, 0),
      0.1,
      { abs: 1e-7 },
      'Σ bus Hz',
    );
    for (const row of r.kWPerSpeed)
      expectClose(
        row.reduce((a, b) => a + b, 0),
        0,
        { abs: 1e-5 },
        'Σ kW per row',
      );
    expect(r.kWPerSpeed[0]![0]!).toBeGreaterThan(0);
    expect(r.largest.length).toBe(6);
    // Plant untouched.
    expect(plant.sets[0]!.governor.noLoadHz).toBe(51.2);
  });
});
