import 'vitest-canvas-mock';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import type { VueWrapper } from '@vue/test-utils';
import TrainerView from '../../renderer/views/TrainerView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { useTrainerStore } from '../../renderer/stores/trainer';
import { freshStores } from './view-harness';
import type { TrainerAttempt } from '../../shared-types';
import { CSV_CAUTION_LINE } from '../../shared-types';
import { sessionCsv } from '../../renderer/components/trainer/session-csv';

/** The operator looks and acts every 50 ms (the live view steps every animation frame; the model is the same). */
const FRAME_S = 0.05;

/**
 * A scripted operator: presses and releases keys on the window, as a trainee would, and
 * lets the model run one frame per step. It sees only what the screen shows (slip, ΔV, angle).
 */
function operator(trainer: ReturnType<typeof useTrainerStore>) {
  const down = (key: string): void => void window.dispatchEvent(new KeyboardEvent('keydown', { key }));
  const up = (key: string): void => void window.dispatchEvent(new KeyboardEvent('keyup', { key }));
  const frames = async (n: number): Promise<void> => {
    for (let i = 0; i < n && trainer.state?.phase !== 'closed'; i++) await trainer.advance(FRAME_S);
  };
  /** Holds `key` for `n` frames. */
  const press = async (key: string, n: number): Promise<void> => {
    down(key);
    await frames(Math.max(1, n));
    up(key);
  };
  return {
    frames,
    press,
    down,
    /** Brings slip to about `targetHz` and the voltage within 1 %: hold for a time in proportion to the error, then watch. */
    async match(targetHz: number): Promise<void> {
      for (let round = 0; round < 60; round++) {
        const slipErr = trainer.slipHz - targetHz;
        const dv = trainer.voltageDifferencePct;
        if (Math.abs(slipErr) < 0.015 && Math.abs(dv) < 1) return;
        if (Math.abs(slipErr) >= 0.015) await press(slipErr > 0 ? 'ArrowDown' : 'ArrowUp', Math.min(20, Math.round((Math.abs(slipErr) / 0.2) * 20)));
        if (Math.abs(dv) >= 1) await press(dv > 0 ? 'ArrowLeft' : 'ArrowRight', Math.min(20, Math.round((Math.abs(dv) / 1) * 20)));
        await frames(15);
      }
      throw new Error(`operator could not match: slip ${trainer.slipHz}, ΔV ${trainer.voltageDifferencePct} %`);
    },
    /** Waits until the angle is in [lo, hi] degrees (at most `maxS` seconds). */
    async waitForAngle(lo: number, hi: number, maxS = 60): Promise<void> {
      for (let i = 0; i < maxS / FRAME_S; i++) {
        const a = trainer.state!.angleDeg;
        if (a >= lo && a <= hi) return;
        await trainer.advance(FRAME_S);
      }
      throw new Error('the angle never came round');
    },
  };
}

describe('TrainerView driven by key presses', () => {
  let w: VueWrapper | null = null;
  beforeEach(() => {
    freshStores();
    // The test is the clock: no animation frames of its own.
    vi.stubGlobal('requestAnimationFrame', () => 1);
    vi.stubGlobal('cancelAnimationFrame', () => undefined);
  });
  afterEach(() => {
    w?.unmount();
    w = null;
    vi.unstubAllGlobals();
  });

  async function setUp(seed: number) {
    await usePlantStore().loadDemo();
    const trainer = useTrainerStore();
    trainer.seed = seed;
    w = mount(TrainerView, { attachTo: document.body });
    await flushPromises();
    expect(trainer.state?.seed).toBe(seed);
    return trainer;
  }

  it('closes inside the window after matching speed and voltage, and calls it good', async () => {
    const trainer = await setUp(2024);
    expect(w!.get('[data-test="trainer-caution"]').text()).toContain('not an authorisation to operate');
    const op = operator(trainer);
    await op.match(0.07);
    // Command when the angle is one advance angle short of zero, so contact lands near 0°.
    const adv = 360 * trainer.slipHz * 0.08;
    await op.waitForAngle(-adv - 2, -adv + 0.5);
    op.down(' ');
    await op.frames(6);
    await flushPromises();
    const v = trainer.verdict!;
    expect(v.insideWindow).toBe(true);
    expect(['good', 'fair']).toContain(v.grade);
    expect(Math.abs(v.contact.angleDeg)).toBeLessThan(3);
    expect(v.score).toBeGreaterThanOrEqual(80);
    expect(w!.get('[data-test="verdict-grade"]').text()).toMatch(/✓/);
    expect(w!.get('[data-test="verdict-text"]').text()).toMatch(/inside the window/);
    expect(trainer.attempts).toHaveLength(1);
    expect(trainer.attempts[0]!.seed).toBe(2024);
    expect(w!.get('[data-test="attempt-0"] [data-test="attempt-score"]').text()).toBe(String(v.score));
  }, 30_000);

  it('closes far outside the window when Space goes at a wide angle, and says so', async () => {
    const trainer = await setUp(2024);
    const op = operator(trainer);
    await op.match(0.15);
    await op.waitForAngle(60, 120);
    op.down(' ');
    await op.frames(6);
    await flushPromises();
    const v = trainer.verdict!;
    expect(v.insideWindow).toBe(false);
    expect(v.grade).toBe('harmful');
    expect(v.score).toBeLessThan(20);
    expect(w!.get('[data-test="verdict-grade"]').text()).toContain('Harmful close');
    expect(w!.get('[data-test="verdict-text"]').text()).toMatch(/Closed outside the window .*Phase angle at contact/);
    expect(v.traces.tS.length).toBeGreaterThan(100);
  }, 30_000);

  it("applies a new level at once (same seed) and writes the trainee's name on the attempt", async () => {
    const trainer = await setUp(77);
    const levels = trainer.levels;
    const other = levels.find((l) => l.id !== trainer.state!.levelId)!;
    await w!.get('[data-test="trainer-level"]').setValue(other.id);
    await vi.waitFor(() => expect(trainer.state!.levelId).toBe(other.id));
    expect(trainer.state!.level.breakerClosingMs).toBe(other.breakerClosingMs);
    expect(trainer.state!.seed).toBe(77);
    expect(w!.text()).toContain('applies at once');

    await w!.get('[data-test="trainer-name"]').setValue('  R. Okafor ');
    const op = operator(trainer);
    trainer.setWindow({ slipHz: 0.2, angleDeg: 10, voltagePct: 5 });
    await op.frames(2);
    op.down(' ');
    await op.frames(8);
    await flushPromises();
    await vi.waitFor(() => expect(trainer.attempts).toHaveLength(1));
    expect(trainer.attempts[0]!.trainee).toBe('R. Okafor');
    expect(w!.get('[data-test="attempt-0"] [data-test="attempt-trainee"]').text()).toBe('R. Okafor');
  }, 30_000);

  it("draws the trainee's path on the window plane and, after the close, the command and contact points", async () => {
    const trainer = await setUp(2024);
    const op = operator(trainer);
    await op.frames(10);
    // 0.05 s frames, a sample every 0.05 s: the start and ten steps.
    expect(trainer.path.length).toBe(11);
    // Closed form: command at −360° × slip × 0.08 s for the level's 80 ms breaker.
    expect(trainer.commandAngleDeg()).toBeCloseTo(-360 * trainer.slipHz * 0.08, 9);
    expect(w!.find('[data-test="plane-trace"]').exists()).toBe(true);
    op.down(' ');
    await op.frames(4);
    await flushPromises();
    const c = trainer.state!.contact!;
    expect(trainer.path.at(-1)).toEqual({ tS: c.atS, angleDeg: c.angleDeg, slipHz: c.slipHz });
    expect(trainer.commandAngleDeg()).toBeNull();
    expect(w!.find('[data-test="plane-command"]').exists()).toBe(true);
    expect(w!.find('[data-test="plane-contact"]').exists()).toBe(true);
    expect(w!.get('[data-test="plane-now"]').text()).toContain(`At contact: ${c.angleDeg < 0 ? '−' : '+'}${Math.abs(c.angleDeg).toFixed(1)}°`);
  }, 30_000);

  it('never lets a step of the old exercise land after a new one has started', async () => {
    const trainer = await setUp(12);
    // A frame asks for a step while a new exercise (with a fault) is starting: the step must not overwrite it.
    const starting = trainer.start(13, { breakerSlowMs: 100 });
    const step = trainer.advance(0.05);
    await Promise.all([starting, step]);
    expect(trainer.state!.seed).toBe(13);
    expect(trainer.state!.faults).toEqual({ breakerSlowMs: 100 });
    expect(trainer.state!.tS).toBe(0);
  });

  it('takes a seed through the number input and refuses one that is not a whole number, keeping the last seed', async () => {
    const trainer = await setUp(7);
    await w!.get('[data-test="trainer-seed"]').setValue('2.5');
    await flushPromises();
    expect(trainer.seed).toBe(7);
    expect(w!.get('[data-test="error-trainer-seed"]').text()).toBe('seed must be a whole number, 0 or more');
    expect((w!.get('[data-test="trainer-seed"]').element as HTMLInputElement).value).toBe('2.5');
    await w!.get('[data-test="trainer-seed"]').setValue('42');
    await flushPromises();
    expect(trainer.seed).toBe(42);
    expect(w!.find('[data-test="error-trainer-seed"]').exists()).toBe(false);
    expect(w!.get('[data-test="trainer-repeat"]').text()).toBe('Start seed 42');
  });

  it('repeats the same start from the same seed', async () => {
    const trainer = await setUp(77);
    const first = trainer.state!;
    await trainer.start(77);
    expect(trainer.state!.angleDeg).toBe(first.angleDeg);
    expect(trainer.state!.incomingFrequencyHz).toBe(first.incomingFrequencyHz);
  });

  it('holds raise while the key is down and nudges on a short click of the button', async () => {
    const trainer = await setUp(5);
    const op = operator(trainer);
    const ref0 = trainer.state!.speedReferenceHz;
    await op.press('ArrowUp', 10);
    // 10 steps of 50 ms at 0.2 Hz/s = 0.1 Hz (closed form).
    expect(trainer.state!.speedReferenceHz - ref0).toBeCloseTo(0.1, 9);
    const btn = w!.get('[data-test="voltage-lower"]');
    const v0 = trainer.state!.voltageReferenceV;
    await btn.trigger('pointerdown');
    await btn.trigger('pointerup');
    await op.frames(10);
    // A click holds for 0.25 s: 1 %/s × 0.25 s × 400 V = 1 V (closed form).
    expect(v0 - trainer.state!.voltageReferenceV).toBeCloseTo(1, 6);
  });

  it('asks for the window first on that level, then allows the close', async () => {
    await usePlantStore().loadDemo();
    const trainer = useTrainerStore();
    trainer.levelId = 'set-window';
    w = mount(TrainerView, { attachTo: document.body });
    await flushPromises();
    expect(w.get('[data-test="trainer-state"]').text()).toContain('Set the sync-check window');
    expect(w.get('[data-test="close-breaker"]').attributes('disabled')).toBeDefined();
    await w.get('[data-test="trainer-window"] [data-test="limit-angle"]').setValue('10');
    await w.get('[data-test="trainer-window"] [data-test="limit-slip"]').setValue('0.1');
    await w.get('[data-test="trainer-window"] [data-test="limit-voltage"]').setValue('5');
    await w.get('[data-test="trainer-apply-window"]').trigger('click');
    expect(trainer.canClose).toBe(true);
    await trainer.advance(FRAME_S);
    expect(trainer.state!.window).toEqual({ slipHz: 0.1, angleDeg: 10, voltagePct: 5 });
  });

  it("runs an instructor's exercise with a slow breaker: the trainee commands by the setting, contact lands late, and the verdict says why it failed", async () => {
    const trainer = await setUp(2024);
    // The instructor builds a one-exercise set in the panel: level 1 (80 ms breaker), seed 2024, breaker 400 ms slower.
    await w!.get('[data-test="instructor-add-set"]').trigger('click');
    const set = trainer.exerciseSets[0]!;
    const row = w!.get(`[data-test="exercise-${set.exercises[0]!.id}"]`);
    await row.get('[data-test="ex-level"]').setValue('steady');
    await row.get('[data-test="ex-seed"]').setValue('2024');
    await row.get('[data-test="fault-breaker"]').setValue(true);
    await flushPromises();
    await w!.get('[data-test="fault-breaker-ms"]').setValue('400');
    await flushPromises();
    expect(trainer.exerciseSets[0]!.exercises[0]!.faults).toEqual({ breakerSlowMs: 400 });
    await w!.get('[data-test="set-run"]').trigger('click');
    await flushPromises();
    expect(trainer.state!.faults).toEqual({ breakerSlowMs: 400 });
    expect(trainer.state!.level.breakerClosingMs).toBe(80);
    expect(w!.get('[data-test="session-bar"]').text()).toContain('exercise 1 of 1');

    // The trainee knows only the 80 ms setting: commands one 80 ms advance short of zero.
    const op = operator(trainer);
    await op.match(0.09);
    const adv = 360 * trainer.slipHz * 0.08;
    await op.waitForAngle(-adv - 1, -adv + 0.5);
    op.down(' ');
    await op.frames(14);
    await flushPromises();
    const v = trainer.verdict!;
    // Contact 480 ms after the command: the angle moved 360 × slip × 0.48 s ≈ 15° (closed form), past the ±10° window.
    expect(v.contact.atS - trainer.state!.closeCommandAtS!).toBeCloseTo(0.48, 9);
    expect(v.contact.angleDeg).toBeGreaterThan(10);
    expect(v.insideWindow).toBe(false);
    expect(v.verdict).toContain('The breaker took 480 ms, 400 ms slower than its 80 ms setting');
    expect(v.pass).toEqual({ passed: false, reasons: expect.arrayContaining(['The contact was outside the graded window.']) });
    expect(w!.get('[data-test="session-pass"]').text()).toContain('Not passed');
    const a = trainer.attempts[0]!;
    expect(a.passed).toBe(false);
    expect(a.faults).toBe('breaker 400 ms slower than its setting');
    expect(a.exerciseSetId).toBe(set.id);
    expect(w!.get('[data-test="session-summary"]').text()).toContain('Session finished: 0 of 1 passed');
    const csv = sessionCsv(trainer.session!.setName, trainer.sessionAttempts);
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe(CSV_CAUTION_LINE);
    expect(lines[1]).toContain('1 attempt, 0 passed');
    expect(lines[2]).toContain('score (0-100),passed');
    expect(lines[3]).toContain(`,${v.score},no,`);
  }, 60_000);

  it('runs a dead-bus exercise: the trainee brings the set to rated and energises the bus, and passes', async () => {
    const trainer = await setUp(606);
    const setId = trainer.addExerciseSet('Dead bus');
    const exId = trainer.exerciseSets[0]!.exercises[0]!.id;
    await trainer.editExercise(setId, exId, (e) => ({
      ...e,
      levelId: 'steady',
      seed: 606,
      faults: { deadBus: true },
      pass: { minScore: 60, insideWindow: true, withinMachineLimits: true },
    }));
    await trainer.startSession(setId);
    await flushPromises();
    expect(trainer.state!.busVoltageV).toBe(0);
    expect(w!.get('[data-test="trainer-state"]').text()).toContain('Dead bus');
    const op = operator(trainer);
    // Slip here reads the distance from rated frequency; voltage difference the distance from rated voltage.
    await op.match(0);
    op.down(' ');
    await op.frames(6);
    await flushPromises();
    const v = trainer.verdict!;
    expect(v.deadBusClose).toBe(true);
    expect(v.insideWindow).toBe(true);
    expect(v.pass!.passed).toBe(true);
    expect(w!.get('[data-test="session-pass"]').text()).toContain('Passed');
    expect(w!.find('[data-test="traces-source"]').exists()).toBe(false);
  }, 60_000);

  it('refuses an exercise field beside it, stops the set from running and keeps the last accepted exercise for the project', async () => {
    const trainer = await setUp(3);
    await w!.get('[data-test="instructor-add-set"]').trigger('click');
    const set = trainer.exerciseSets[0]!;
    const good = trainer.snapshotExercises();
    const row = w!.get(`[data-test="exercise-${set.exercises[0]!.id}"]`);
    await row.get('[data-test="pass-score"]').setValue('120');
    await flushPromises();
    expect(w!.get('[data-test="ex-error-pass.minScore"]').text()).toContain('pass mark must be 100 or less');
    expect(w!.get('[data-test="set-run"]').attributes('disabled')).toBeDefined();
    expect(w!.get('[data-test="set-problem"]').text()).toContain('Put right the refused fields');
    expect(trainer.snapshotExercises()).toEqual(good);
    await row.get('[data-test="pass-score"]').setValue('80');
    await flushPromises();
    expect(w!.find('[data-test="ex-error-pass.minScore"]').exists()).toBe(false);
    expect(trainer.snapshotExercises()[0]!.exercises[0]!.pass.minScore).toBe(80);
  });

  it('keeps the log with the project: snapshot and restore', () => {
    const trainer = useTrainerStore();
    const a: TrainerAttempt = {
      at: '2026-01-01T00:00:00.000Z',
      seed: 1,
      level: 'steady',
      angleAtContactDeg: 2,
      slipAtContactHz: 0.05,
      voltageDifferencePct: 0.5,
      surgeCurrentPU: 0.2,
      torqueStepPU: 0.2,
      score: 90,
      verdict: 'Good close.',
    };
    trainer.restore([a]);
    const snap = trainer.snapshot();
    expect(snap).toEqual([a]);
    snap[0]!.score = 1;
    expect(trainer.attempts[0]!.score).toBe(90);
    expect(trainer.summary).toEqual({ count: 1, best: 90, mean: 90 });
  });

  it('never trims a long log: every attempt opened is saved again', () => {
    const trainer = useTrainerStore();
    const many: TrainerAttempt[] = Array.from({ length: 1200 }, (_, i) => ({
      at: '2026-01-01T00:00:00.000Z',
      seed: i,
      level: 'steady',
      angleAtContactDeg: 2,
      slipAtContactHz: 0.05,
      voltageDifferencePct: 0.5,
      surgeCurrentPU: 0.2,
      torqueStepPU: 0.2,
      score: 50,
      verdict: 'Acceptable close.',
    }));
    trainer.restore(many);
    expect(trainer.snapshot().map((a) => a.seed)).toEqual(many.map((a) => a.seed));
  });
});
