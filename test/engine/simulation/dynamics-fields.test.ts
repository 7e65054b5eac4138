/**
 * Model constants that were fixed in code are per-set (or per-plant) fields now: the schema
 * fills the documented defaults (`SET_DEFAULTS`, `PLANT_DEFAULTS`), refuses values out of range by
 * field, and the simulator uses what the plant gives.
 */
import { describe, expect, it } from 'vitest';
import { simulate } from '../../../electron/engine';
import { buildSimModel } from '../../../electron/engine/simulation/sim-model';
import { plantSchema } from '../../../electron/handlers';
import { PLANT_DEFAULTS, SET_DEFAULTS } from '../../../shared-types';
import { makePlant, rawPlant, rawSet } from '../../helpers/plants';

describe('dynamics fields', () => {
  it('an old file gets the documented defaults', () => {
    const p = makePlant([rawSet('A')]);
    const s = p.sets[0]!;
    expect(s.machine.tddopS).toBe(SET_DEFAULTS.tddopS);
    expect(s.governor.isoGainPU).toBe(SET_DEFAULTS.isoGainPU);
    expect(s.regulator.resetS).toBe(SET_DEFAULTS.regulatorResetS);
    expect(s.regulator.pfTrimS).toBe(SET_DEFAULTS.pfTrimS);
    expect(s.regulator.oelResetS).toBe(SET_DEFAULTS.oelResetS);
    expect(p.powerLoadBreakPct).toBe(PLANT_DEFAULTS.powerLoadBreakPct);
  });

  it('the simulator takes each from the plant', () => {
    const p = makePlant(
      [
        rawSet('A', {
          machine: { tddopS: 0.02 },
          governor: { mode: 'isochronous', isoGainPU: 33 },
          regulator: { mode: 'power-factor', pf: 0.9, resetS: 0.7, pfTrimS: 8, oelResetS: 12 },
        }),
        rawSet('B'),
      ],
      [],
      { powerLoadBreakPct: 60 },
    );
    const m = buildSimModel(p, 0.001);
    expect(m.td20S[0]).toBe(0.02);
    expect(m.isoGainPU[0]).toBe(33);
    expect(m.avrResetS[0]).toBe(0.7);
    expect(m.pfTrimS[0]).toBe(8);
    expect(m.oelResetS[0]).toBe(12);
    expect(m.breakPU).toBe(0.6);
  });

  it('a stiffer isochronous governor (larger gain) dips less on the same block load', () => {
    const run = (isoGainPU: number) =>
      simulate({
        plant: makePlant([rawSet('A', { governor: { mode: 'isochronous', isoGainPU } })], [{ id: 'L', kW: 200, kVAR: 100 }]),
        durationS: 4,
        stepMs: 2,
        events: [{ atS: 1, type: 'load-step', kW: 500, kVAR: 300 }],
      }).metrics.frequencyNadirHz;
    expect(run(40)).toBeGreaterThan(run(10));
  });

  it('refuses values out of range, naming the field and the rule', () => {
    const issue = (set: Record<string, unknown>, over: Record<string, unknown> = {}) => {
      const r = plantSchema.safeParse(rawPlant([rawSet('A', set)], [], over));
      expect(r.success).toBe(false);
      return `${r.error!.issues[0]!.path.join('.')}: ${r.error!.issues[0]!.message}`;
    };
    expect(issue({ machine: { tdopS: 0.02, tddopS: 0.03 } })).toMatch(/^sets\.0\.machine\.tddopS: must be less than T'd0/);
    expect(issue({ governor: { mode: 'droop', droopPct: 4, isoGainPU: 0 } })).toBe('sets.0.governor.isoGainPU: must be 0.01 pu or more');
    expect(issue({ regulator: { mode: 'voltage', resetS: 100 } })).toBe('sets.0.regulator.resetS: must be 60 s or less');
    expect(issue({}, { powerLoadBreakPct: 99 })).toBe('powerLoadBreakPct: must be 95 % or less');
  });
});
