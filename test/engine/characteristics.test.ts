import { describe, it, expect } from 'vitest';
import { describePlant, planDroop, reactiveDroopLine, setCharacteristics, speedDroopLine } from '../../electron/engine';
import { demoPlant, makePlant, rawSet } from '../helpers/plants';
import { expectClose } from '../helpers/expect-close';

describe('set characteristics (the lines every droop chart draws)', () => {
  const plant = demoPlant();
  const g1 = plant.sets[0]!; // 1000 kW, 1250 kVA, PF 0.8, 4 % droop from 51.2 Hz, 4 % reactive droop from 410 V, Xd 2.6 pu

  it('draws a droop set’s speed line from zero fuel to the overload limit', () => {
    const c = speedDroopLine(g1, plant);
    if (c.kind !== 'segment') throw new Error('a droop set has a segment');
    const [a, b] = c.points;
    expectClose(a.x, -250, { abs: 1e-9 }, 'zero fuel: −25 % motoring of 1000 kW (closed form)');
    expectClose(a.y, 51.7, { abs: 1e-12 }, '51.2 − 0.04 × 50 × (−250 / 1000) = 51.7 Hz (closed form)');
    expectClose(b.x, 1100, { abs: 1e-9 }, 'overload limit: 110 % of 1000 kW (closed form)');
    expectClose(b.y, 49.0, { abs: 1e-12 }, '51.2 − 0.04 × 50 × 1100 / 1000 = 49.0 Hz (closed form)');
  });

  it('draws a reactive-droop set’s voltage line from its leading limit to its field limit at zero kW', () => {
    const c = reactiveDroopLine(g1, plant);
    if (c.kind !== 'segment') throw new Error('a reactive-droop set has a segment');
    const [a, b] = c.points;
    expectClose(a.x, -375, { abs: 1e-9 }, 'leading limit −30 % of 1250 kVA (closed form)');
    expectClose(a.y, 418, { abs: 1e-9 }, '410 − 0.04 × 400 × (−375 / 750) = 418 V, Qbase = 1250 √(1 − 0.8²) = 750 kVAR (closed form)');
    // Field limit at P = 0: E = √((1 + 2.6 × 0.6)² + (2.6 × 0.8)²) = √10.88; q = (E − 1) / Xd × 1250 (closed form).
    const q = ((Math.sqrt(10.88) - 1) / 2.6) * 1250;
    expectClose(b.x, q, { rel: 1e-12 }, 'field-heating limit at zero kW, ≈ 1105.0 kVAR (closed form)');
    expectClose(b.x, 1105.04, { abs: 0.01 }, 'the same, as a number (closed form)');
    expectClose(b.y, 410 - (16 * q) / 750, { abs: 1e-9 }, 'V = 410 − 16 × q / 750 (closed form)');
  });

  it('holds isochronous and cross-current sets flat, base load upright and power factor at kW tan φ', () => {
    const p = makePlant([
      rawSet('A', { governor: { mode: 'isochronous', setpointHz: 50 }, minKW: 200, regulator: { mode: 'cross-current', setpointV: 400 } }),
      rawSet('B', { governor: { mode: 'baseload', baseKW: 300 }, regulator: { mode: 'power-factor', pf: 0.9 } }),
    ]);
    const a = setCharacteristics(p.sets[0]!, p);
    // From the lower of 0 and minKW (200 kW) to the overload limit, 110 % of 1000 kW (closed form).
    expect(a.speed).toEqual({
      kind: 'segment',
      points: [
        { x: 0, y: 50 },
        { x: 1100, y: 50 },
      ],
    });
    if (a.voltage.kind !== 'segment') throw new Error('cross-current is a segment');
    expect(a.voltage.points.map((pt) => pt.y)).toEqual([400, 400]);
    expect(a.voltage.points[0].x).toBeCloseTo(-375, 9); // −30 % of 1250 kVA (closed form)
    const b = setCharacteristics(p.sets[1]!, p);
    expect(b.speed).toEqual({ kind: 'vertical', x: 300 });
    if (b.voltage.kind !== 'power-factor') throw new Error('power-factor control');
    // tan(acos 0.9) = √(1 − 0.81) / 0.9 = 0.48432 kVAR per kW (closed form).
    expectClose(b.voltage.kVARPerKW, Math.sqrt(0.19) / 0.9, { rel: 1e-12 }, 'tan φ at PF 0.9');
    expectClose(b.voltage.kVARPerKW, 0.48432, { abs: 1e-5 }, 'tan φ as a number (closed form)');
  });

  it('is what describePlant returns for each set', () => {
    const d = describePlant(plant);
    plant.sets.forEach((s, i) => expect(d.sets[i]!.characteristics).toEqual(setCharacteristics(s, plant)));
  });

  it('comes with the plan for the plant now and as proposed, the proposed lines falling by the planned droop', () => {
    const plan = planDroop({ plant, frequencyBandHz: { min: 49.5, max: 51.5 }, voltageBandV: { min: 390, max: 420 } });
    plant.sets.forEach((s, i) => expect(plan.characteristics.current[i]).toEqual(setCharacteristics(s, plant)));
    plan.plant.sets.forEach((s, i) => {
      const c = plan.characteristics.proposal[i]!.speed;
      if (c.kind !== 'segment') throw new Error('droop set');
      const [a, b] = c.points;
      // Slope −(droop/100) f_r / P_r, Hz per kW (the speed-droop definition, closed form).
      expectClose((b.y - a.y) / (b.x - a.x), (-(s.governor.droopPct / 100) * 50) / s.ratedKW, { rel: 1e-9 }, `${s.id} proposed slope`);
    });
  });
});
