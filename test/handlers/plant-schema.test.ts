import { describe, it, expect } from 'vitest';
import { dispatch } from '../../electron/handlers';
import { demoPlantJson, rawPlant, rawSet } from '../helpers/plants';

/** Runs validatePlant and returns the "path: message" lines, or [] when valid. */
async function problems(plant: unknown): Promise<string[]> {
  const r = await dispatch('validatePlant', { plant });
  return r.ok ? [] : (r.error.issues ?? []).map((i) => `${i.path}: ${i.message}`);
}

function withSet(over: Record<string, unknown>): unknown {
  return rawPlant([rawSet('G1'), rawSet('G2', over)]);
}

describe('plant schema', () => {
  it('accepts the demo plant and fills defaults', async () => {
    const r = await dispatch('validatePlant', { plant: demoPlantJson() });
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value.sets[0]!.machine.dampingPU).toBeGreaterThanOrEqual(0);
  });

  it.each<[string, unknown, string]>([
    ['wrong format', { ...rawPlant([rawSet('A')]), format: 'x' }, 'format: must be "droopline.plant"'],
    ['newer version', { ...rawPlant([rawSet('A')]), version: 2 }, 'version: must be 1'],
    ['empty name', { ...rawPlant([rawSet('A')]), name: '' }, 'name: must not be empty'],
    ['odd frequency', { ...rawPlant([rawSet('A')]), ratedFrequencyHz: 55 }, 'ratedFrequencyHz: must be 50 or 60 (Hz)'],
    ['zero voltage', { ...rawPlant([rawSet('A')]), ratedVoltageV: 0 }, 'ratedVoltageV: must be 100 V or more'],
    ['no sets', rawPlant([]), 'sets: must hold at least one set'],
    ['negative droop', withSet({ governor: { mode: 'droop', droopPct: -1, noLoadHz: 52 } }), 'sets[1].governor.droopPct: must be 0 or more'],
    [
      'zero droop in droop mode',
      withSet({ governor: { mode: 'droop', droopPct: 0, noLoadHz: 52 } }),
      'sets[1].governor.droopPct: must be greater than 0 in droop mode',
    ],
    ['unknown governor mode', withSet({ governor: { mode: 'turbo' } }), 'sets[1].governor.mode: must be "droop", "isochronous" or "baseload"'],
    [
      'unknown regulator mode',
      withSet({ regulator: { mode: 'x' } }),
      'sets[1].regulator.mode: must be "reactive-droop", "cross-current", "voltage" or "power-factor"',
    ],
    [
      'reactive droop 0',
      withSet({ regulator: { mode: 'reactive-droop', droopPct: 0, noLoadV: 410 } }),
      'sets[1].regulator.droopPct: must be greater than 0 in reactive-droop mode',
    ],
    ['pf above 1', withSet({ regulator: { mode: 'power-factor', pf: 1.2 } }), 'sets[1].regulator.pf: must be 1 or less'],
    ['kW above kVA', withSet({ ratedKW: 2000 }), 'sets[1].ratedKW: must not exceed ratedKVA'],
    ['missing kVA', withSet({ ratedKVA: undefined }), 'sets[1].ratedKVA: is required'],
    ['text for kVA', withSet({ ratedKVA: 'big' }), 'sets[1].ratedKVA: must be a number (kVA)'],
    ['odd poles', withSet({ poles: 5 }), 'sets[1].poles: must be even'],
    ['rated PF 1', withSet({ ratedPF: 1 }), 'sets[1].ratedPF: must be less than 1'],
    ['duplicate id', rawPlant([rawSet('G1'), rawSet('G1')]), 'sets[1].id: must be unique ("G1" is used twice)'],
    [
      'min kW below zero fuel',
      withSet({ minKW: -300, motoringPct: 25 }),
      'sets[1].minKW: must not be below the motoring power (−motoringPct % of ratedKW: zero fuel)',
    ],
    ['negative feeder R', withSet({ feeder: { rOhm: -1, xOhm: 0 } }), 'sets[1].feeder.rOhm: must be 0 or more'],
    ['negative X d', withSet({ machine: { xdPU: -2 } }), 'sets[1].machine.xdPU: must be 0.1 pu or more'],
    ['unknown field', withSet({ colour: 'red' }), 'sets[1]: unknown field(s): colour'],
    ['negative load kW', rawPlant([rawSet('A')], [{ id: 'L', kW: -5, kVAR: 0 }]), 'loads[0].kW: must be 0 or more'],
    [
      'duplicate load id',
      rawPlant(
        [rawSet('A')],
        [
          { id: 'L', kW: 5, kVAR: 0 },
          { id: 'L', kW: 5, kVAR: 0 },
        ],
      ),
      'loads[1].id: must be unique ("L" is used twice)',
    ],
    ['isochronous without setpoint is filled from rated', withSet({ governor: { mode: 'isochronous' } }), ''],
  ])('%s', async (_name, plant, expected) => {
    const got = await problems(plant);
    if (expected === '') expect(got).toEqual([]);
    else
      expect(
        got.some((g) => g.startsWith(expected)),
        `${expected} in ${JSON.stringify(got)}`,
      ).toBe(true);
  });

  it('never sends a stack trace across the boundary', async () => {
    const r = await dispatch('validatePlant', { plant: 'not a plant' });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.message).toBe('(root): must be an object');
      expect(JSON.stringify(r.error)).not.toMatch(/at .*\.ts:\d+/);
    }
  });
});
