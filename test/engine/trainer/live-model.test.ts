import { describe, expect, it } from 'vitest';
import { wrapAngleDeg as wrapDeg } from '../../../electron/engine';
import { SPEED_RAISE_HZ_PER_S, startExercise, stepTrainer } from '../../../electron/engine/trainer';
import type { TrainerState } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';

const idle = { speed: 0, voltage: 0 } as const;

function run(s: TrainerState, seconds: number, inputs: Parameters<typeof stepTrainer>[1] = idle): TrainerState {
  let x = s;
  for (let i = 0; i < Math.round(seconds * 60); i++) x = stepTrainer(x, inputs, 1 / 60);
  return x;
}

describe('stepTrainer', () => {
  it('turns the phase angle at 360° × slip per second when nothing is touched (closed form)', () => {
    const s0 = run(startExercise({ seed: 5, levelId: 'steady' }), 2);
    const slip = s0.incomingFrequencyHz - s0.busFrequencyHz;
    const s1 = run(s0, 0.5);
    expectClose(wrapDeg(s1.angleDeg - s0.angleDeg), wrapDeg(360 * slip * 0.5), { abs: 0.05 }, 'angle turned in 0.5 s');
  });

  it('moves the speed reference at the raise rate while raise is held, and the set follows it', () => {
    const s0 = startExercise({ seed: 9, levelId: 'steady' });
    const s1 = run(s0, 2, { speed: 1, voltage: 0 });
    expectClose(s1.speedReferenceHz - s0.speedReferenceHz, 2 * SPEED_RAISE_HZ_PER_S, { abs: 1e-9 }, 'reference moved');
    const s2 = run(s1, 4);
    // Running light in droop: ω_ref − ω = R · D (ω − 1), so ω = (ω_ref + R D) / (1 + R D) (closed form, R = 0.04, D = 2).
    const rd = 0.04 * 2;
    const expected = (50 * (s2.speedReferenceHz / 50 + rd)) / (1 + rd);
    expectClose(s2.incomingFrequencyHz, expected, { abs: 0.002 }, 'speed settles on the droop line');
  });

  it('brings the voltage to a raised reference through the regulator', () => {
    const s0 = startExercise({ seed: 9, levelId: 'steady' });
    const s1 = run(s0, 1, { speed: 0, voltage: -1 });
    expectClose(s1.voltageReferenceV - s0.voltageReferenceV, -0.01 * 400, { abs: 1e-9 }, 'voltage reference moved 1 %/s');
    const s2 = run(s1, 3);
    expectClose(s2.incomingVoltageV, s2.voltageReferenceV, { abs: 0.05 }, 'voltage settles on reference');
  });

  it('lands the contact exactly one breaker closing time after the command', () => {
    const s0 = run(startExercise({ seed: 3, levelId: 'slow-breaker' }), 1);
    const cmd = stepTrainer(s0, { ...idle, close: true }, 1 / 60);
    expect(cmd.phase).toBe('closing');
    expect(cmd.closeCommandAtS).toBe(s0.tS);
    const closed = run(cmd, 0.5);
    expect(closed.phase).toBe('closed');
    expectClose(closed.contact!.atS - s0.tS, 0.3, { abs: 1e-9 }, 'command to contact');
    expect(closed.contact!.commandAngleDeg).toBe(s0.angleDeg);
    expect(stepTrainer(closed, idle, 0.1)).toBe(closed);
  });

  it('never mutates its input and refuses bad steps and an early close', () => {
    const s0 = startExercise({ seed: 3, levelId: 'set-window' });
    const copy = structuredClone(s0);
    stepTrainer(s0, { speed: 1, voltage: 1 }, 0.1);
    expect(s0).toEqual(copy);
    expect(() => stepTrainer(s0, idle, 0.5)).toThrow('dtS: must be between 0 and 0.25 s (got 0.5).');
    expect(() => stepTrainer(s0, { ...idle, close: true }, 0.01)).toThrow('close: set the sync-check window first');
    const set = stepTrainer(s0, { ...idle, window: { slipHz: 0.1, angleDeg: 10, voltagePct: 5 }, close: true }, 0.01);
    expect(set.phase).toBe('closing');
  });

  it('lets the bus drift on the drifting level and holds it on the steady one', () => {
    const steady = run(startExercise({ seed: 11, levelId: 'steady' }), 5);
    expect(steady.busFrequencyHz).toBe(steady.busBaseFrequencyHz);
    const drifting = run(startExercise({ seed: 11, levelId: 'drifting-bus' }), 5);
    expect(Math.abs(drifting.busFrequencyHz - drifting.busBaseFrequencyHz)).toBeGreaterThan(0);
    expect(Math.abs(drifting.busFrequencyHz - drifting.busBaseFrequencyHz)).toBeLessThanOrEqual(0.15);
  });
});
