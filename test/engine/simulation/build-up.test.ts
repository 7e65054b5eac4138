/**
 * Voltage build-up of a shunt-excited set started de-excited, off line.
 * Closed form (open circuit, field equation of machine.ts with the regulator at its
 * ceiling K·V): T'd0 dE/dt = K E + E_res − E. With E_res = 0 and E = 0 nothing ever
 * moves; with E_res > 0 and K > 1 E grows until the regulator takes over; with K < 1 it
 * stalls at E = E_res / (1 − K).
 */
import { describe, expect, it } from 'vitest';
import { createSimulation } from '../../../electron/engine';
import type { Scenario } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

function scenario(residualPU: number, ceilingPU: number): Scenario {
  const plant = makePlant(
    [
      rawSet('A'),
      rawSet('S', {
        online: false,
        regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 400, shuntExcited: true, residualPU, ceilingPU },
        machine: { tdopS: 1.5 },
      }),
    ],
    [{ id: 'L', kW: 300, kVAR: 100 }],
  );
  return { plant, durationS: 12, stepMs: 2, startDeExcited: ['S'], events: [] };
}

describe('shunt-excited build-up from residual magnetism', () => {
  it('builds up to the voltage setpoint with residual voltage', () => {
    const sim = createSimulation(scenario(0.03, 3));
    // At t = 0 the open-circuit voltage is the residual voltage: 0.03 pu × 400 V = 12 V.
    expectClose(sim.snapshot().sets[1]!.terminalV, 0.03 * 400, { abs: 1e-9 }, 'terminal voltage at start, V (residual)');
    sim.advance(0.5);
    expect(sim.snapshot().sets[1]!.terminalV).toBeGreaterThan(0.03 * 400 * 0.3);
    sim.advance(11.5);
    expectClose(sim.snapshot().sets[1]!.terminalV, 400, { abs: 0.5 }, 'terminal voltage after build-up, V');
  });

  it('stays dead without residual magnetism', () => {
    const sim = createSimulation(scenario(0, 3));
    sim.advance(12);
    expectClose(sim.snapshot().sets[1]!.terminalV, 0, { abs: 1e-9 }, 'terminal voltage, V');
  });

  it('stalls at E_res / (1 − K) when the ceiling gain is below one', () => {
    // Time constant T'd0 / (1 − K) = 7.5 s: six of them.
    const sim = createSimulation({ ...scenario(0.03, 0.8), durationS: 45, stepMs: 5 });
    sim.advance(45);
    expectClose(sim.snapshot().sets[1]!.terminalV, (0.03 / (1 - 0.8)) * 400, { rel: 0.01 }, 'stalled voltage, V (closed form 60 V)');
  });

  it('a separately excited set is not limited by its own voltage', () => {
    const s = scenario(0, 3);
    s.plant.sets[1]!.regulator.shuntExcited = false;
    const sim = createSimulation(s);
    sim.advance(12);
    expectClose(sim.snapshot().sets[1]!.terminalV, 400, { abs: 0.5 }, 'terminal voltage, V');
  });
});
