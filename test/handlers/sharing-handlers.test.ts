import { describe, it, expect } from 'vitest';
import { dispatch } from '../../electron/handlers';
import type { LoadSweep, SharingResult } from '../../shared-types';
import { demoPlantJson, rawPlant, rawSet } from '../helpers/plants';

type Raw = Record<string, unknown> & { sets: Record<string, unknown>[] };
const demo = () => demoPlantJson() as Raw;

async function failure(method: 'solveSharing' | 'sweepLoad', payload: unknown) {
  const r = await dispatch(method, payload);
  expect(r.ok).toBe(false);
  if (r.ok) throw new Error('expected a failure');
  return r.error;
}

describe('solveSharing handler', () => {
  it('solves the demo plant and honours the load override', async () => {
    const r = await dispatch('solveSharing', { plant: demo() });
    expect(r.ok).toBe(true);
    const v = (r as { value: SharingResult }).value;
    expect(v.sets.map((s) => s.id)).toEqual(['G1', 'G2', 'G3']);
    expect(v.method).toBe('newton-raphson');
    const o = await dispatch('solveSharing', { plant: demo(), load: { kW: 600, kVAR: 200 } });
    expect(o.ok && o.value.totals.loadKW).toBe(600);
  });

  it('does not mutate the request', async () => {
    const req = { plant: demo(), load: { kW: 600, kVAR: 200 } };
    const copy = JSON.parse(JSON.stringify(req)) as unknown;
    await dispatch('solveSharing', req);
    expect(req).toEqual(copy);
  });

  it.each([
    [{ kW: -5, kVAR: 0 }, 'load.kW: must be 0 or more'],
    [{ kW: 'lots', kVAR: 0 }, 'load.kW: must be a number (kW)'],
    [{ kW: 100 }, 'load.kVAR: is required'],
    [{ kW: 100, kVAR: 0, pf: 0.8 }, 'load: unknown field(s): pf'],
    ['100 kW', 'load: must be an object'],
  ])('load override %j → "%s"', async (load, message) => {
    expect((await failure('solveSharing', { plant: demo(), load })).message).toBe(message);
  });

  it('names unknown request fields and a missing plant', async () => {
    expect((await failure('solveSharing', { plant: demo(), extra: 1 })).message).toBe('(root): unknown field(s): extra');
    expect((await failure('solveSharing', {})).message).toBe('plant: is required');
  });

  // Every plant-file rule the solver relies on, through the solver's own request (field: rule).
  const plantRules: [string, (p: Raw) => void, string][] = [
    ['loadSharingLink not boolean', (p) => ((p.sets[0]!.governor as Raw).loadSharingLink = 'yes'), 'sets[0].governor.loadSharingLink: must be true or false'],
    ['zero droop in droop mode', (p) => ((p.sets[1]!.governor as Raw).droopPct = 0), 'sets[1].governor.droopPct: must be greater than 0 in droop mode'],
    ['droop above 20 %', (p) => ((p.sets[1]!.governor as Raw).droopPct = 25), 'sets[1].governor.droopPct: must be 20 % or less'],
    ['zero reactive droop', (p) => ((p.sets[2]!.regulator as Raw).droopPct = 0), 'sets[2].regulator.droopPct: must be greater than 0 in reactive-droop mode'],
    ['unknown governor mode', (p) => ((p.sets[0]!.governor as Raw).mode = 'offline'), 'sets[0].governor.mode: must be "droop", "isochronous" or "baseload"'],
    [
      'unknown regulator mode',
      (p) => ((p.sets[0]!.regulator as Raw).mode = 'manual'),
      'sets[0].regulator.mode: must be "reactive-droop", "cross-current", "voltage" or "power-factor"',
    ],
    ['power factor above 1', (p) => ((p.sets[0]!.regulator as Raw).pf = 1.2), 'sets[0].regulator.pf: must be 1 or less'],
    ['ratedKW above ratedKVA', (p) => (p.sets[0]!.ratedKW = 2000), 'sets[0].ratedKW: must not exceed ratedKVA'],
    ['minKW above ratedKW', (p) => (p.sets[0]!.minKW = 1500), 'sets[0].minKW: must not exceed ratedKW'],
    ['minKW below zero fuel', (p) => (p.sets[0]!.minKW = -300), 'sets[0].minKW: must not be below the motoring power (−motoringPct % of ratedKW: zero fuel)'],
    ['negative feeder resistance', (p) => ((p.sets[0]!.feeder as Raw).rOhm = -0.01), 'sets[0].feeder.rOhm: must be 0 or more'],
    ['leading kVAR limit above 100 %', (p) => (p.sets[0]!.leadingKVARLimitPct = 150), 'sets[0].leadingKVARLimitPct: must be 100 % or less'],
    ['duplicate set id', (p) => (p.sets[1]!.id = 'G1'), 'sets[1].id: must be unique ("G1" is used twice)'],
    ['negative load kW', (p) => ((p.loads as Raw[])[0]!.kW = -1), 'loads[0].kW: must be 0 or more'],
    ['unknown load model', (p) => ((p.loads as Raw[])[0]!.model = 'motor'), 'loads[0].model: must be "constant-power", "constant-impedance" or "zip"'],
    ['frequency sensitivity above 10', (p) => ((p.loads as Raw[])[0]!.frequencySensitivity = 12), 'loads[0].frequencySensitivity: must be 10 or less'],
    ['rated frequency not 50 or 60', (p) => (p.ratedFrequencyHz = 55), 'ratedFrequencyHz: must be 50 or 60 (Hz)'],
    ['no sets', (p) => (p.sets = []), 'sets: must hold at least one set'],
  ];
  it.each(plantRules)('plant rule: %s', async (_name, edit, message) => {
    const p = demo();
    edit(p);
    const e = await failure('solveSharing', { plant: p });
    expect(e.code).toBe('INVALID_INPUT');
    expect(e.message.split('\n')).toContain(message);
  });

  it('reports no steady state as its own code with a sentence', async () => {
    const e = await failure('solveSharing', { plant: demo(), load: { kW: 5000, kVAR: 0 } });
    expect(e.code).toBe('NO_STEADY_STATE');
    expect(e.message).toMatch(/^The load \(5000 kW\) is more than the online sets can supply/);
    const two = rawPlant([rawSet('A', { regulator: { mode: 'voltage' } }), rawSet('B', { regulator: { mode: 'voltage' } })], [{ id: 'L', kW: 100, kVAR: 0 }]);
    const e2 = await failure('solveSharing', { plant: two });
    expect(e2.code).toBe('NO_STEADY_STATE');
    expect(e2.message).toContain('their kVAR split is undefined');
  });
});

describe('sweepLoad handler', () => {
  it('sweeps the demo plant', async () => {
    const r = await dispatch('sweepLoad', { plant: demo(), steps: 23 });
    expect(r.ok).toBe(true);
    const v = (r as { value: LoadSweep }).value;
    expect(v.points).toHaveLength(23);
    expect(v.points.some((p) => p.error)).toBe(true); // 110 % is beyond the sets
  });

  it.each([
    [{ steps: 1 }, 'steps: must be 2 or more'],
    [{ steps: 2.5 }, 'steps: must be a whole number'],
    [{ steps: 5000 }, 'steps: must be 2000 or fewer'],
    [{}, 'steps: is required'],
    [{ steps: 10, fromPct: -5 }, 'fromPct: must be 0 or more'],
    [{ steps: 10, toPct: 600 }, 'toPct: must be 500 % or less'],
    [{ steps: 10, fromPct: 80, toPct: 20 }, 'toPct: must not be below fromPct'],
    [{ steps: 10, pf: 0 }, 'pf: must be greater than 0'],
    [{ steps: 10, pf: 1.1 }, 'pf: must be 1 or less'],
    [{ steps: 10, colour: 'red' }, '(root): unknown field(s): colour'],
  ])('request %j → "%s"', async (extra, message) => {
    const e = await failure('sweepLoad', { plant: demo(), ...extra });
    expect(e.code).toBe('INVALID_INPUT');
    expect(e.message).toBe(message);
  });
});
