import { describe, expect, it } from 'vitest';
import { dispatch } from '../../../electron/handlers';
import type { TrainerState } from '../../../shared-types';

async function fail(method: string, payload: unknown): Promise<string> {
  const r = await dispatch(method, payload);
  expect(r.ok).toBe(false);
  return r.ok ? '' : r.error.message;
}

describe('trainer handlers', () => {
  it('lists the levels and starts, steps and judges an exercise through the table', async () => {
    const levels = await dispatch('trainerLevels', {});
    expect(levels.ok && levels.value.map((l) => l.id)).toEqual(['steady', 'slow-breaker', 'drifting-bus', 'set-window']);
    const start = await dispatch('trainerStart', { seed: 3, levelId: 'steady' });
    if (!start.ok) throw new Error(start.error.message);
    let state: TrainerState = JSON.parse(JSON.stringify(start.value)) as TrainerState;
    const cmd = await dispatch('trainerStep', { state, inputs: { speed: 0, voltage: 0, close: true }, dtS: 0.05 });
    if (!cmd.ok) throw new Error(cmd.error.message);
    state = cmd.value;
    const closed = await dispatch('trainerStep', { state, inputs: { speed: 0, voltage: 0 }, dtS: 0.05 });
    if (!closed.ok) throw new Error(closed.error.message);
    expect(closed.value.phase).toBe('closed');
    const verdict = await dispatch('trainerClose', { state: closed.value });
    expect(verdict.ok && verdict.value.attempt.seed).toBe(3);
  });

  it('names the field and the rule for bad requests', async () => {
    expect(await fail('trainerStart', { seed: 1.5, levelId: 'steady' })).toBe('seed: must be a whole number');
    expect(await fail('trainerStart', { seed: 1, levelId: 'nope' })).toMatch(/^levelId: unknown level "nope"/);
    const start = await dispatch('trainerStart', { seed: 1, levelId: 'steady' });
    if (!start.ok) throw new Error(start.error.message);
    expect(await fail('trainerStep', { state: start.value, inputs: { speed: 2, voltage: 0 }, dtS: 0.01 })).toBe('inputs.speed: must be -1, 0 or 1');
    expect(await fail('trainerStep', { state: start.value, inputs: { speed: 0, voltage: 0 }, dtS: 1 })).toBe('dtS: must be 0.25 s or less');
    expect(await fail('trainerStep', { state: { ...start.value, tS: -1 }, inputs: { speed: 0, voltage: 0 }, dtS: 0.01 })).toBe('state.tS: must be 0 or more');
    expect(await fail('trainerClose', { state: start.value })).toMatch(/^state: the breaker has not closed yet/);
  });
});
