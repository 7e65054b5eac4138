import { describe, expect, it } from 'vitest';
import { DEAD_BUS_CLOSE_LIMITS, DEFAULT_TRAINER_WINDOW, faultWords, judgeClose, judgePass, startExercise, stepTrainer } from '../../../electron/engine/trainer';
import type { TrainerState } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { dispatch } from '../../../electron/handlers';

/** Steps `state` with no control held for `seconds` in 50 ms frames (or until contact). */
function run(state: TrainerState, seconds: number, close = false): TrainerState {
  let s = stepTrainer(state, { speed: 0, voltage: 0, close }, 0.05);
  for (let i = 1; i < seconds / 0.05 && s.phase !== 'closed'; i++) s = stepTrainer(s, { speed: 0, voltage: 0 }, 0.05);
  return s;
}

describe('trainer faults scripted by an instructor', () => {
  it('keeps the seeded start the same with or without faults (draws in the same order)', () => {
    const plain = startExercise({ seed: 31, levelId: 'steady' });
    const faulty = startExercise({ seed: 31, levelId: 'steady', faults: { breakerSlowMs: 100, busDriftHz: 0.2 } });
    expect(faulty.angleDeg).toBe(plain.angleDeg);
    expect(faulty.incomingFrequencyHz).toBe(plain.incomingFrequencyHz);
    expect(faulty.incomingVoltageV).toBe(plain.incomingVoltageV);
    expect(plain.faults).toBeUndefined();
  });

  it('closes a slow breaker its setting plus the slow-down after the command, and says so after the close', () => {
    const s0 = startExercise({ seed: 8, levelId: 'steady', faults: { breakerSlowMs: 120 } });
    // The trainee is told the setting (80 ms); the breaker takes 80 + 120 = 200 ms.
    expect(s0.level.breakerClosingMs).toBe(80);
    const s = run(s0, 1, true);
    expect(s.phase).toBe('closed');
    expectClose(s.contact!.atS - s.closeCommandAtS!, 0.2, { abs: 1e-9 }, 'breaker time');
    const v = judgeClose(s);
    expect(v.verdict).toContain("breaker's 200 ms");
    expect(v.verdict).toContain('The breaker took 200 ms, 120 ms slower than its 80 ms setting');
  });

  it('shows the trainee a wrong window but grades to the exercise window', () => {
    const wrong = { slipHz: 0.5, angleDeg: 40, voltagePct: 10 };
    const s0 = startExercise({ seed: 3, levelId: 'steady', faults: { wrongWindow: wrong } });
    expect(s0.window).toEqual(wrong);
    expect(s0.referenceWindow).toEqual(DEFAULT_TRAINER_WINDOW);
    const closed: TrainerState = {
      ...s0,
      phase: 'closed',
      contact: { atS: 1, angleDeg: 30, slipHz: 0.05, voltageDifferencePct: 1, deltaVPU: 2 * Math.sin((15 * Math.PI) / 180), commandAngleDeg: 28 },
    };
    const v = judgeClose(closed);
    // 30° is inside the ±40° shown, outside the ±10° graded.
    expect(v.insideWindow).toBe(false);
    expect(v.checks[0]!.limit).toBe(10);
    expect(v.verdict).toContain('The sync-check window you were shown (±40.0°, 0.500 Hz, 10.0 %) was set wrong');
  });

  it('drifts the droop bus by the fault in place of the level', () => {
    const s0 = startExercise({ seed: 5, levelId: 'steady', faults: { busDriftHz: 0.3 } });
    expect(s0.level.busDriftHz).toBe(0.3);
    const f: number[] = [];
    let s = s0;
    for (let i = 0; i < 200; i++) {
      s = stepTrainer(s, { speed: 0, voltage: 0 }, 0.05);
      f.push(s.busFrequencyHz);
    }
    expect(Math.max(...f) - Math.min(...f)).toBeGreaterThan(0.01);
    expect(Math.max(...f.map((x) => Math.abs(x - s0.busBaseFrequencyHz)))).toBeLessThanOrEqual(0.3 + 1e-12);
  });

  it('starts the incoming voltage the scripted mismatch from the bus', () => {
    const s0 = startExercise({ seed: 9, levelId: 'steady', faults: { voltageMismatchPct: -12 } });
    expectClose(s0.incomingVoltageV / s0.busVoltageV, 0.88, { abs: 1e-12 }, 'mismatch');
  });

  it('energises a dead bus: judged on voltage and frequency against rated, no surge and no traces', () => {
    const s0 = startExercise({ seed: 11, levelId: 'steady', faults: { deadBus: true } });
    expect(s0.busVoltageV).toBe(0);
    expect(s0.busFrequencyHz).toBe(50);
    expect(s0.level.busDriftHz).toBe(0);
    const atRated: TrainerState = {
      ...s0,
      incomingFrequencyHz: 50.1,
      incomingVoltageV: 404,
      phase: 'closed',
      contact: { atS: 1, angleDeg: 0, slipHz: 0.1, voltageDifferencePct: 1, deltaVPU: 1.01, commandAngleDeg: 0 },
    };
    const v = judgeClose(atRated);
    expect(v.deadBusClose).toBe(true);
    expect(v.insideWindow).toBe(true);
    expect(v.surgeCurrentPU).toBe(0);
    expect(v.traces.tS).toHaveLength(0);
    // Score inside: 100 − 25 × (1/5) − 25 × (0.1/0.5) = 90 (the trainer's scoring rule).
    expect(v.score).toBe(90);
    expect(v.verdict).toContain('Dead bus energised at 404 V');
    const off = judgeClose({ ...atRated, contact: { ...atRated.contact!, slipHz: -1.2, voltageDifferencePct: 1 } });
    expect(off.insideWindow).toBe(false);
    expect(off.checks[1]!.limit).toBe(DEAD_BUS_CLOSE_LIMITS.frequencyHz);
    expect(off.verdict).toContain('Incoming frequency from rated -1.20 Hz exceeded the ±0.50 Hz a dead-bus close allows');
    // The live model closes a dead bus with the incoming voltage across the breaker and no angle.
    const closed = run(s0, 1, true);
    expect(closed.contact!.angleDeg).toBe(0);
    expectClose(closed.contact!.deltaVPU, closed.incomingVoltageV / 400, { abs: 1e-12 }, 'ΔV = incoming');
  });

  it('judges pass criteria with a sentence for each miss', () => {
    expect(judgePass({ score: 85, insideWindow: true, withinMachineLimits: true }, { minScore: 70, insideWindow: true, withinMachineLimits: true })).toEqual({
      passed: true,
      reasons: [],
    });
    const r = judgePass({ score: 40, insideWindow: false, withinMachineLimits: false }, { minScore: 70, insideWindow: true, withinMachineLimits: true });
    expect(r.passed).toBe(false);
    expect(r.reasons).toEqual([
      'Score 40 is below the pass mark of 70.',
      'The contact was outside the graded window.',
      "The close exceeded the machine's limits.",
    ]);
    expect(faultWords({ breakerSlowMs: 150, deadBus: true })).toBe('breaker 150 ms slower than its setting; dead bus to energise');
  });

  it('refuses faults out of range through the contract, naming the field', async () => {
    const r = await dispatch('trainerStart', { seed: 1, levelId: 'steady', faults: { breakerSlowMs: -5, voltageMismatchPct: 40 } });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      const paths = r.error.issues?.map((i) => i.path) ?? [];
      expect(paths).toContain('faults.breakerSlowMs');
      expect(paths).toContain('faults.voltageMismatchPct');
    }
    const ok = await dispatch('trainerStart', { seed: 1, levelId: 'steady', faults: { deadBus: true } });
    expect(ok.ok).toBe(true);
    if (ok.ok) {
      const step = await dispatch('trainerStep', { state: ok.value, inputs: { speed: 0, voltage: 0, close: true }, dtS: 0.2 });
      expect(step.ok).toBe(true);
    }
  });
});
