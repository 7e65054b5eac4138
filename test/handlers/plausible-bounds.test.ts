/**
 * Extreme but finite numbers are refused by plausible bounds, each with its rule, instead of producing
 * NaN or Infinity downstream (a rated voltage of 5e-324, 1e308 kVA, damping 1e308, a 0 Hz live bus).
 */
import { describe, it, expect } from 'vitest';
import { dispatch } from '../../electron/handlers';
import type { TrainerState } from '../../shared-types';
import { demoPlantJson, rawPlant, rawSet } from '../helpers/plants';

async function refusal(method: Parameters<typeof dispatch>[0], payload: unknown): Promise<string> {
  const r = await dispatch(method, payload);
  expect(r.ok).toBe(false);
  return r.ok ? '' : `${r.error.code}: ${r.error.message}`;
}

type RawPlant = { ratedVoltageV: number; sets: Record<string, unknown>[]; loads: Record<string, unknown>[] };

describe('plant schema: plausible bounds', () => {
  const cases: [string, (p: RawPlant) => void, string][] = [
    ['a rated voltage of 5e-324 V', (p) => (p.ratedVoltageV = 5e-324), 'ratedVoltageV: must be 100 V or more'],
    ['1e308 kVA', (p) => (p.sets[0]!.ratedKVA = 1e308), 'sets[0].ratedKVA: must be 2 000 000 kVA or less'],
    ['damping 1e308 pu', (p) => (p.sets[0]!.machine = { dampingPU: 1e308 }), 'sets[0].machine.dampingPU: must be 500 pu or less'],
    ['a subtransient reactance of 1e-300 pu', (p) => (p.sets[0]!.machine = { xddpPU: 1e-300 }), 'sets[0].machine.xddpPU: must be 0.01 pu or more'],
    ['inertia 1e308 s', (p) => (p.sets[0]!.machine = { inertiaS: 1e308 }), 'sets[0].machine.inertiaS: must be 60 s or less'],
    ['a feeder of 1e9 Ω', (p) => (p.sets[0]!.feeder = { rOhm: 1e9 }), 'sets[0].feeder.rOhm: must be 100 Ω or less'],
    ['a load of 1e300 kW', (p) => (p.loads[0] = { id: 'L', kW: 1e300, kVAR: 0 }), 'loads[0].kW: must be 10 000 000 kW or less'],
    [
      'a no-load frequency of 5 Hz on a 50 Hz plant',
      (p) => (p.sets[0]!.governor = { mode: 'droop', droopPct: 4, noLoadHz: 5 }),
      'sets[0].governor.noLoadHz: must be within 50 % of the rated 50 Hz (25–75 Hz)',
    ],
    [
      'a voltage setpoint of 4 V on a 400 V plant',
      (p) => (p.sets[0]!.regulator = { mode: 'voltage', setpointV: 4 }),
      'sets[0].regulator.setpointV: must be within 50 % of the rated 400 V (200–600 V)',
    ],
  ];
  it.each(cases)('refuses %s with the rule in the message', async (_what, mutate, message) => {
    const p = rawPlant([rawSet('G1'), rawSet('G2')], [{ id: 'L1', kW: 800, kVAR: 400 }]) as unknown as RawPlant;
    mutate(p);
    expect(await refusal('validatePlant', { plant: p })).toContain(message);
  });

  it('keeps accepting the demo plant and a 1000 MW textbook unit', async () => {
    expect((await dispatch('validatePlant', { plant: demoPlantJson() })).ok).toBe(true);
    const big = rawPlant(
      [rawSet('U1', { ratedKVA: 1_250_000, ratedKW: 1_000_000, governor: { mode: 'droop', droopPct: 5 }, regulator: { mode: 'reactive-droop', droopPct: 4 } })],
      [],
      { ratedFrequencyHz: 60, ratedVoltageV: 22000 },
    );
    expect((await dispatch('validatePlant', { plant: big })).ok).toBe(true);
  });
});

describe('closing map refuses what evaluateSync refuses', () => {
  it('a live bus at 0 Hz: both refuse with the same rule (used to give an infinite torque in the map)', async () => {
    const c = {
      bus: { frequencyHz: 0, voltageV: 400 },
      incoming: { frequencyHz: 50, voltageV: 400, angleDeg: 0, ratedKVA: 1000, xddpPU: 0.15 },
      busSource: { ratedKVA: 1000, xPU: 0.15 },
      breakerClosingMs: 100,
      limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
      ratedFrequencyHz: 50,
    };
    expect(await refusal('evaluateSync', c)).toContain('bus.frequencyHz: must be greater than 0 when the bus is live');
    expect(await refusal('closingMap', { case: c, angleSteps: 5, slipSteps: 5 })).toContain(
      'case.bus.frequencyHz: must be greater than 0 when the bus is live',
    );
  });
});

describe('trainer schemas: plausible bounds', () => {
  it('a step with damping 1e308 is refused (it used to leave the exercise on a NaN state)', async () => {
    const start = await dispatch('trainerStart', { seed: 1, levelId: 'basic' });
    if (!start.ok) {
      const levels = await dispatch('trainerLevels', {});
      if (!levels.ok) throw new Error('no levels');
      const again = await dispatch('trainerStart', { seed: 1, levelId: levels.value[0]!.id });
      if (!again.ok) throw new Error(again.error.message);
      return check(again.value);
    }
    return check(start.value);
    async function check(state: TrainerState) {
      const bad = { ...state, machine: { ...state.machine, dampingPU: 1e308 } };
      expect(await refusal('trainerStep', { state: bad, inputs: { speed: 0, voltage: 0 }, dtS: 0.05 })).toContain(
        'state.machine.dampingPU: must be 500 pu or less',
      );
    }
  });
});

describe('trainer level in the state: bounded drift (fuzz finding)', () => {
  it('a bus drift of 1e308 Hz is refused (it used to return an angle of Infinity)', async () => {
    const start = await dispatch('trainerStart', { seed: 3, levelId: 'drifting-bus' });
    if (!start.ok) throw new Error(start.error.message);
    const bad = { ...start.value, level: { ...start.value.level, busDriftHz: 1e308 } };
    expect(await refusal('trainerStep', { state: bad, inputs: { speed: 0, voltage: 0 }, dtS: 0.05 })).toContain('state.level.busDriftHz: must be 5 Hz or less');
  });
});

describe('trainer live model at the edges of its bounds (fuzz finding)', () => {
  it('lags of 5e-324 s, damping 500 pu on 0.01 s of inertia: every frame stays finite', async () => {
    // Explicit Euler with a lag far below the 1 ms substep used to return an infinite incoming frequency.
    const start = await dispatch('trainerStart', { seed: 3, levelId: 'steady' });
    if (!start.ok) throw new Error(start.error.message);
    let state: TrainerState = {
      ...start.value,
      machine: { ...start.value.machine, actuatorLagS: 5e-324, engineLagS: 5e-324, exciterLagS: 5e-324, dampingPU: 500, inertiaS: 0.01 },
    };
    for (let i = 0; i < 20; i++) {
      const r = await dispatch('trainerStep', { state, inputs: { speed: 1, voltage: 1 }, dtS: 0.1 });
      if (!r.ok) throw new Error(r.error.message);
      state = r.value;
      for (const k of ['incomingFrequencyHz', 'angleDeg', 'mechanicalPU', 'fieldPU', 'emfPU'] as const) expect(Number.isFinite(state[k])).toBe(true);
    }
  });
});
