/**
 * The plant's right-hand side reuses, in the later RK4 stages of a step, the load sums worked out at the step's
 * first evaluation (`evaluatePlant` with `stage` true): for any state it gives exactly what a full evaluation gives,
 * frequency-dependent loads included.
 */
import { describe, expect, it } from 'vitest';
import { buildSimModel } from '../../../electron/engine/simulation/sim-model';
import { createOutputs, evaluatePlant } from '../../../electron/engine/simulation/plant-dynamics';
import { initialiseAtRest } from '../../../electron/engine/simulation/initialise';
import { OMEGA, DELTA, STATES_PER_SET } from '../../../electron/engine/simulation/layout';
import { makePlant, rawSet } from '../../helpers/plants';

function setUp(withP = true) {
  const plant = makePlant(
    [rawSet('A'), rawSet('B', { ratedKVA: 800, ratedKW: 640, feeder: { rOhm: 0.003, xOhm: 0.004 } })],
    [
      ...(withP ? [{ id: 'P', kW: 600, kVAR: 300 }] : []),
      { id: 'Z', kW: 200, kVAR: 50, model: 'constant-impedance' },
      { id: 'F', kW: 300, kVAR: 200, frequencySensitivity: 1.5, kVARFrequencySensitivity: 2 },
    ],
  );
  const m = buildSimModel(plant, 0.001);
  const y = new Float64Array(m.n * STATES_PER_SET);
  const init = initialiseAtRest(m, plant, y, new Set());
  const out = createOutputs(m.n);
  out.bus.re = init.busPU;
  out.bus.im = 0;
  return { m, y, out };
}

describe('evaluatePlant in the later stages of a step', () => {
  it('gives the same derivatives and outputs as a full evaluation at a moved state', () => {
    const a = setUp();
    const b = setUp();
    const moved = (y: Float64Array) => {
      const z = y.slice();
      for (let i = 0; i < a.m.n; i++) {
        z[i * STATES_PER_SET + OMEGA] = z[i * STATES_PER_SET + OMEGA]! + 0.004 * (i + 1);
        z[i * STATES_PER_SET + DELTA] = z[i * STATES_PER_SET + DELTA]! + 0.002;
      }
      return z;
    };
    const dyA = new Float64Array(a.y.length);
    const dyB = new Float64Array(b.y.length);
    // A: the first evaluation of the step, then a stage at the moved state; B: a full evaluation at the moved state.
    evaluatePlant(a.m, a.y, dyA, a.out);
    evaluatePlant(a.m, moved(a.y), dyA, a.out, true);
    evaluatePlant(b.m, b.y, dyB, b.out);
    evaluatePlant(b.m, moved(b.y), dyB, b.out);
    expect(Array.from(dyA)).toEqual(Array.from(dyB));
    expect(a.out.loadP).toBe(b.out.loadP);
    expect(a.out.loadQ).toBe(b.out.loadQ);
    // The frequency-dependent load follows the bus speed in the stage too: the load differs from the state at rest.
    expect(a.out.omegaBus).not.toBe(1);
    expect(Array.from(a.out.buf)).toEqual(Array.from(b.out.buf));
  });

  it('a first evaluation picks up a load switched off since the last step; a later stage keeps the loads of its step', () => {
    const a = setUp();
    const b = setUp(false);
    const dy = new Float64Array(a.y.length);
    evaluatePlant(a.m, a.y, dy, a.out);
    const withLoad = a.out.loadP;
    a.m.loads[0]!.on = false;
    // A later stage of the same step still draws the load (loads switch only between steps).
    evaluatePlant(a.m, a.y, dy, a.out, true);
    expect(a.out.loadP).toBe(withLoad);
    // The next step's first evaluation draws what a plant without the load draws at the same state.
    evaluatePlant(a.m, a.y, dy, a.out);
    evaluatePlant(b.m, a.y, new Float64Array(a.y.length), b.out);
    expect(a.out.loadP).toBe(b.out.loadP);
    expect(a.out.loadP).toBeLessThan(withLoad);
  });
});
