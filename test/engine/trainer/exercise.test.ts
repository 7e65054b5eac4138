import { describe, expect, it } from 'vitest';
import { startExercise, trainerMachineFromPlant, TRAINER_LEVELS } from '../../../electron/engine/trainer';
import { demoPlant } from '../../helpers/plants';

describe('startExercise', () => {
  it('gives the same start for the same seed and level, a different one for another seed', () => {
    const a = startExercise({ seed: 42, levelId: 'steady' });
    const b = startExercise({ seed: 42, levelId: 'steady' });
    const c = startExercise({ seed: 43, levelId: 'steady' });
    expect(b).toEqual(a);
    expect(c.angleDeg).not.toBe(a.angleDeg);
    expect(c.incomingFrequencyHz).not.toBe(a.incomingFrequencyHz);
  });

  it('starts the incoming set clearly off the bus: 0.3–1.5 Hz slip and 2–8 % voltage, any angle', () => {
    for (let seed = 1; seed <= 200; seed++) {
      const s = startExercise({ seed, levelId: 'drifting-bus' });
      const slip = Math.abs(s.incomingFrequencyHz - s.busFrequencyHz);
      const dv = Math.abs(s.incomingVoltageV / s.busVoltageV - 1);
      expect(slip).toBeGreaterThanOrEqual(0.3);
      expect(slip).toBeLessThan(1.5);
      expect(dv).toBeGreaterThanOrEqual(0.02 - 1e-12);
      expect(dv).toBeLessThan(0.08);
      expect(s.angleDeg).toBeGreaterThanOrEqual(-180);
      expect(s.angleDeg).toBeLessThan(180);
      expect(s.phase).toBe('running');
    }
  });

  it('leaves the window blank on the level where the trainee must set it', () => {
    expect(startExercise({ seed: 1, levelId: 'set-window' }).window).toBeNull();
    expect(startExercise({ seed: 1, levelId: 'steady' }).window).toEqual({ slipHz: 0.1, angleDeg: 10, voltagePct: 5 });
  });

  it('refuses an unknown level by name, listing the known ones', () => {
    expect(() => startExercise({ seed: 1, levelId: 'expert' })).toThrow(/levelId: unknown level "expert"; choose one of "steady"/);
    expect(TRAINER_LEVELS.map((l) => l.id)).toEqual(['steady', 'slow-breaker', 'drifting-bus', 'set-window']);
  });

  it('takes the incoming set and the running bus from a plant', () => {
    const plant = demoPlant();
    const { machine, bus } = trainerMachineFromPlant(plant, 'G3');
    expect(machine.ratedKVA).toBe(500);
    expect(machine.xddpPU).toBe(0.14 + 0.02);
    // G1 (1250 kVA, 0.14 pu) ∥ G2 (800 kVA, 0.15 pu) on 2050 kVA: 1/X = (1250/2050)/0.14 + (800/2050)/0.15 (closed form).
    expect(bus.ratedKVA).toBe(2050);
    expect(bus.xPU).toBeCloseTo(1 / (1250 / 2050 / 0.14 + 800 / 2050 / 0.15), 12);
    expect(() => trainerMachineFromPlant(plant, 'G9')).toThrow('incomingSetId: no set "G9" in the plant.');
  });
});
