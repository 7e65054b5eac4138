/**
 * A run to rest lands on the steady-state solver's answer: bus frequency and voltage,
 * every set's kW and kVAR. One case per governor and regulator mode; each starts at
 * rest, takes a disturbance (so the end is not the start) and is compared with
 * `solveSharing` of the plant as it stands after the disturbance.
 * Reference: the definitions of DESIGN.md ("Speed droop", "Reactive droop", cross-current
 * and isochronous sharing), as implemented by the sharing solver.
 */
import { describe, it } from 'vitest';
import { simulate, solveSharing } from '../../../electron/engine';
import type { Plant, ScenarioEvent } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';

const block = { id: 'B', name: 'B', online: true, kW: 300, kVAR: 180, model: 'constant-power' as const, frequencySensitivity: 0 };

function settlesOnSolver(plant: Plant, durationS: number, stepMs = 5, events: ScenarioEvent[] = [{ atS: 0.5, type: 'load-step', kW: block.kW, kVAR: block.kVAR }]): void {
  const r = simulate({ plant, durationS, stepMs, events, outputPoints: 50 });
  const after = { ...plant, loads: [...plant.loads, block] };
  const ss = solveSharing(after);
  const m = r.metrics.final;
  expectClose(m.frequencyHz, ss.bus.frequencyHz, { abs: 0.002 }, 'bus frequency, Hz');
  expectClose(m.voltageV, ss.bus.voltageV, { abs: 0.2 }, 'bus voltage, V');
  for (const s of ss.sets) {
    const got = m.sets.find((x) => x.id === s.id)!;
    expectClose(got.kW, s.kW, { abs: 1 }, `${s.id} kW`);
    expectClose(got.kVAR, s.kVAR, { abs: 1 }, `${s.id} kVAR`);
  }
}

const load = (kW: number, kVAR: number, model: 'constant-power' | 'constant-impedance' = 'constant-power') => ({ id: 'L', kW, kVAR, model });

describe('simulation run to rest agrees with solveSharing', () => {
  it('droop + reactive droop, with feeders and mixed loads (the demo plant)', () => {
    settlesOnSolver(demoPlant(), 14);
  });

  it('isochronous pair on a load-sharing link with a droop set', () => {
    const plant = makePlant(
      [
        rawSet('A', { governor: { mode: 'isochronous' } }),
        rawSet('B', { ratedKVA: 625, ratedKW: 500, governor: { mode: 'isochronous' } }),
        rawSet('C', { ratedKVA: 625, ratedKW: 500 }),
      ],
      [load(900, 500)],
    );
    settlesOnSolver(plant, 20);
  });

  it('base load set with droop sets', () => {
    const plant = makePlant([rawSet('A'), rawSet('B', { governor: { mode: 'baseload', baseKW: 350 } })], [load(1000, 600)]);
    settlesOnSolver(plant, 14);
  });

  // Unequal feeders: the regulator modes must agree with the solver's network too.
  const feederA = { feeder: { rOhm: 0.004, xOhm: 0.006 } };
  const feederB = { feeder: { rOhm: 0.01, xOhm: 0.008 } };

  it('cross-current group holding voltage, sharing kVAR by ratedKVA (unequal feeders)', () => {
    const cc = { mode: 'cross-current', droopPct: 4 };
    const plant = makePlant([rawSet('A', { regulator: cc, ...feederA }), rawSet('B', { ratedKVA: 800, ratedKW: 640, regulator: cc, ...feederB })], [load(900, 650, 'constant-impedance')]);
    settlesOnSolver(plant, 14);
  });

  it('voltage-control set with a reactive-droop set (unequal feeders)', () => {
    const plant = makePlant([rawSet('A', { regulator: { mode: 'voltage' }, ...feederA }), rawSet('B', feederB)], [load(900, 500)]);
    settlesOnSolver(plant, 14);
  });

  it('power-factor control set with a reactive-droop set (unequal feeders)', () => {
    const plant = makePlant([rawSet('A', feederA), rawSet('B', { regulator: { mode: 'power-factor', pf: 0.95 }, ...feederB })], [load(1000, 650)]);
    settlesOnSolver(plant, 40);
  });

  it('loads that follow frequency (frequencySensitivity)', () => {
    const plant = makePlant([rawSet('A'), rawSet('B')], [{ id: 'L', kW: 900, kVAR: 400, frequencySensitivity: 2 }]);
    settlesOnSolver(plant, 14);
  });
});
