/** The `simulate` handler: the scenario schema's messages, progress and cancelling. */
import { describe, expect, it } from 'vitest';
import { simulate } from '../../electron/engine';
import { dispatch } from '../../electron/handlers';
import { scenarioSchema } from '../../electron/schemas/simulation-schema';
import { demoPlantJson } from '../helpers/plants';

const scenario = (over: Record<string, unknown> = {}) => ({
  format: 'droopline.scenario',
  version: 1,
  plant: demoPlantJson(),
  durationS: 2,
  stepMs: 2,
  events: [{ atS: 0.5, type: 'load-step', kW: 200, kVAR: 100 }],
  ...over,
});

async function messages(payload: unknown): Promise<string[]> {
  const r = await dispatch('simulate', payload);
  expect(r.ok).toBe(false);
  if (r.ok) return [];
  expect(r.error.code).toBe('INVALID_INPUT');
  return r.error.issues!.map((i) => `${i.path}: ${i.message}`);
}

describe('simulate handler', () => {
  it('runs a valid scenario and fills defaults', async () => {
    const r = await dispatch('simulate', scenario({ stepMs: undefined, outputPoints: 50 }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.steps).toBe(2000);
    expect(r.value.series.setIds).toEqual(['G1', 'G2', 'G3']);
    expect(r.value.metrics.frequencyNadirHz).toBeLessThan(r.value.metrics.initial.frequencyHz);
  });

  it('gives the same result in chunks as the engine in one go', async () => {
    const payload = scenario({ durationS: 3, outputPoints: 40 });
    const r = await dispatch('simulate', payload);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const direct = simulate(scenarioSchema.parse(payload));
    expect(r.value.metrics).toEqual(direct.metrics);
    expect(r.value.series).toEqual(direct.series);
  });

  it.each([
    [{ durationS: undefined }, 'durationS: is required'],
    [{ plant: undefined }, 'plant: is required'],
    [{ plant: undefined, plantFile: 'works.plant.json' }, 'plant: is required here: plantFile ("works.plant.json") is read by the command line only'],
    [{ durationS: -1 }, 'durationS: must be greater than 0'],
    [{ durationS: 7200 }, 'durationS: must be 3600 s or less'],
    [{ stepMs: 50 }, 'stepMs: must be 20 ms or less'],
    [{ format: 'droopline.plant' }, 'format: must be "droopline.scenario"'],
    [{ version: 2 }, 'version: must be 1 (this version of Droopline reads scenarios of version 1)'],
    [{ events: [{ atS: 1, type: 'explode' }] }, 'events[0].type: must be "load-step", "trip", "close", "setpoint", "ramp" or "motor-start"'],
    [{ events: [{ atS: 1, type: 'trip', setId: 'G9' }] }, 'events[0].setId: no set "G9" in the plant'],
    [{ events: [{ atS: 5, type: 'trip', setId: 'G1' }] }, 'events[0].atS: must be within the run (0 to 2 s)'],
    [{ events: [{ atS: 1, type: 'load-step' }] }, 'events[0].kW: is required (or name a plant load with loadId)'],
    [{ events: [{ atS: 1, type: 'load-step', loadId: 'L7', online: false }] }, 'events[0].loadId: no load "L7" in the plant'],
    [{ events: [{ atS: 1, type: 'motor-start', kVA: 500, pf: 1.3, durationS: 2 }] }, 'events[0].pf: must be 1 or less'],
    [{ events: [{ atS: 1, type: 'ramp', setId: 'G1', durationS: 2 }] }, 'events[0].toKW: is required'],
    [{ events: [{ atS: 1, type: 'close', setId: 'G1', angle: 20 }] }, 'events[0]: unknown field(s): angle'],
    [{ events: [{ atS: 1, type: 'setpoint', setId: 'G1' }] }, 'events[0].frequencyHz: give frequencyHz, voltageV or kW'],
    [{ startDeExcited: ['G1'] }, 'startDeExcited[0]: set "G1" is on line; only an off-line set can start de-excited'],
    [{ durationS: 3600, stepMs: 0.1 }, 'stepMs: too small for 3600 s: the run would take more than 20,000,000 steps'],
  ])('names the field and the rule: %j', async (over, message) => {
    expect(await messages(scenario(over))).toContain(message);
  });

  it('names plant fields from the plant, as the plant file does', async () => {
    const plant = demoPlantJson() as { sets: { governor: { droopPct: number } }[] };
    plant.sets[1]!.governor.droopPct = -3;
    expect(await messages(scenario({ plant }))).toContain('sets[1].governor.droopPct: must be 0 or more');
  });

  it('reports progress and can be cancelled between chunks', async () => {
    const fractions: number[] = [];
    const ctl = new AbortController();
    const ctx = {
      progress: (f: number) => {
        fractions.push(f);
        if (fractions.length === 2) ctl.abort();
      },
      signal: ctl.signal,
    };
    const r = await dispatch('simulate', scenario({ durationS: 20 }), ctx);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('CANCELLED');
    expect(fractions).toHaveLength(2);
    expect(fractions[1]!).toBeGreaterThan(fractions[0]!);
    expect(fractions[1]!).toBeLessThan(1);
  });

  it('turns a plant with no operating point into a sentence, not a stack', async () => {
    const plant = demoPlantJson() as { loads: { kW: number }[] };
    plant.loads[0]!.kW = 50_000;
    const r = await dispatch('simulate', scenario({ plant }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('NO_STEADY_STATE');
      expect(r.error.message).not.toMatch(/\bat \w+ \(/);
    }
  });
});
