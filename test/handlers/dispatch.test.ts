import { describe, it, expect } from 'vitest';
import { ENGINE_METHODS } from '../../shared-types';
import { dispatch, handlers } from '../../electron/handlers';
import { demoPlantJson } from '../helpers/plants';

// The run-time list is derived from a record that `satisfies Record<EngineMethod, true>` (shared-types/engine-api.ts).
describe('handler table', () => {
  it('has a handler with a schema for every contract method', () => {
    expect(Object.keys(handlers).sort()).toEqual([...ENGINE_METHODS].sort());
    for (const m of ENGINE_METHODS) expect(typeof handlers[m].schema.safeParse).toBe('function');
  });

  it('refuses an unknown method by name', async () => {
    const r = await dispatch('formatDisk', {});
    expect(r).toEqual({ ok: false, error: { name: 'EngineError', code: 'UNKNOWN_METHOD', message: 'Unknown engine method "formatDisk".' } });
  });

  it('describePlant returns rated figures for the demo plant', async () => {
    const r = await dispatch('describePlant', { plant: demoPlantJson() });
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value.sets.map((s) => s.ratedSpeedRpm)).toEqual([1500, 1500, 1500]);
  });

  it('describePlant names the field of a bad request', async () => {
    const plant = demoPlantJson() as { sets: { governor: { droopPct: number } }[] };
    plant.sets[1]!.governor.droopPct = 0;
    const r = await dispatch('describePlant', { plant });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('INVALID_INPUT');
      expect(r.error.message).toBe('sets[1].governor.droopPct: must be greater than 0 in droop mode');
    }
  });

  it('does not mutate the request it validates', async () => {
    const plant = demoPlantJson();
    const before = JSON.stringify(plant);
    await dispatch('describePlant', { plant });
    expect(JSON.stringify(plant)).toBe(before);
  });
});
