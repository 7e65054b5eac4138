/**
 * A rated load step at rated power factor on default data: one 1000 kVA / 800 kW set with
 * the schema's machine and regulator defaults, 400 kW + 300 kVAR, then +400 kW + 300 kVAR at
 * 1 s. With the derived field ceiling the voltage comes back to the regulator's steady state
 * at full load; with a ceiling barely above the rated-load field it stays down, and the run
 * says so (unserved load, failed recovery with its reason).
 */
import { describe, expect, it } from 'vitest';
import { fieldCeiling, ratedLoadFieldPU, simulate } from '../../../electron/engine';
import { SET_DEFAULTS } from '../../../shared-types';
import type { Plant } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { makePlant } from '../../helpers/plants';

function plant(regulator: Record<string, unknown> = {}, protection: Record<string, unknown> = {}, set: Record<string, unknown> = {}): Plant {
  return makePlant(
    [{ id: 'G1', ratedKVA: 1000, ratedKW: 800, governor: { mode: 'droop' }, regulator: { mode: 'reactive-droop', ...regulator }, protection, ...set }],
    [{ id: 'L', kW: 400, kVAR: 300 }],
  );
}

function ratedStep(p: Plant) {
  return simulate({ plant: p, durationS: 15, stepMs: 2, events: [{ atS: 1, type: 'load-step', kW: 400, kVAR: 300 }] });
}

describe('field at rated load and the derived ceiling', () => {
  it('is the one-axis steady state at rated kVA and 0.8 PF (closed form)', () => {
    // Closed form with the schema defaults X d 2.5, X'd 0.25, residual 0.03 pu, V = 1, I = 0.8 − j0.6:
    // E' = 1 + j0.25 (0.8 − j0.6) = 1.15 + j0.2, |E'| = 1.16726, δ = atan(0.2 / 1.15) = 9.866°,
    // I_d = 0.8 sin δ + 0.6 cos δ = 0.72821, E_fd = 1.16726 + 2.25 × 0.72821 − 0.03 = 2.7757 pu.
    const e = Math.hypot(1.15, 0.2);
    const d = Math.atan2(0.2, 1.15);
    const id = 0.8 * Math.sin(d) + 0.6 * Math.cos(d);
    const expected = e + 2.25 * id - 0.03;
    expectClose(expected, 2.7757, { abs: 1e-4 }, 'closed form, pu');
    const p = plant();
    expectClose(ratedLoadFieldPU(p.sets[0]!), expected, { rel: 1e-12 }, 'rated-load field, pu');
    const c = fieldCeiling(p.sets[0]!);
    expect(c.derived).toBe(true);
    expectClose(c.ceilingPU, SET_DEFAULTS.fieldCeilingFactor * expected, { rel: 1e-12 }, 'derived ceiling, pu (1.6 × rated-load field)');
    expect(c.reason).toContain('rated load');
    expect(c.warning).toBeNull();
  });

  it('warns when a user ceiling leaves less than 30 % margin', () => {
    const c = fieldCeiling(plant({ ceilingPU: 3 }).sets[0]!);
    expect(c.derived).toBe(false);
    expectClose(c.marginPct, (3 / c.ratedFieldPU - 1) * 100, { rel: 1e-12 }, 'margin, %');
    expect(c.warning).toMatch(/only 8 % above/);
    expect(fieldCeiling(plant({ ceilingPU: 1.3 * c.ratedFieldPU + 1e-9 }).sets[0]!).warning).toBeNull();
  });
});

describe('rated 0.8 PF load step on default data', () => {
  it('ends within the regulator steady-state band at the full load, nothing unserved, nothing tripped (all defaults)', () => {
    // Every default in place: the derived field ceiling, the 110 % fuel limit (overload allowance),
    // the V/Hz roll-off and the protection elements.
    const r = ratedStep(plant());
    // Droop line: f = 52 − 0.04 · 50 · 800 / 800 = 50 Hz (closed form): the speed comes back.
    expectClose(r.metrics.final.frequencyHz, 50, { abs: 0.01 }, 'final frequency, Hz');
    expect(r.metrics.trips).toEqual([]);
    // Reactive droop: V = V_nl − droop · V_r · Q / Qbase = 416 − 0.04 · 400 · 600 / 600 = 400 V (closed form).
    expectClose(r.metrics.final.voltageV, 400, { abs: 0.025 * 400 }, 'final voltage, V (ISO 8528-5 G2 band ±2.5 %)');
    expectClose(r.metrics.final.voltageV, 400, { abs: 0.5 }, 'final voltage, V');
    expectClose(r.metrics.final.sets[0]!.kW, 800, { abs: 1 }, 'final kW');
    expectClose(r.metrics.final.sets[0]!.kVAR, 600, { abs: 1 }, 'final kVAR');
    expect(r.metrics.unservedKWh).toBe(0);
    expect(r.warnings.join(' ')).not.toMatch(/not served/);
    expectClose(r.metrics.steadyState!.voltageV, 400, { abs: 0.01 }, 'closed-form steady state, V');
    const rec = r.metrics.classes.find((c) => c.quantity === 'voltage recovery time')!;
    expect(rec.pass.G1).toBe(true);
    expect(rec.note).toBeUndefined();
  });

  it('with the default V/Hz roll-off the voltage follows the knee and slope at the final speed', () => {
    // A standby-rated set (no overload allowance: fuel limit = rated kW = the load) has nothing
    // to climb back with, so the speed stays low; 81U is switched off to watch the regulator.
    const r = ratedStep(plant({}, { underFrequencyPct: 0 }, { overloadPct: 100 }));
    const f = r.metrics.final.frequencyHz;
    expect(f).toBeLessThan(48);
    // Roll-off: knee 50 − 2 = 48 Hz, 3 % of rated voltage per Hz below it, on top of the droop line:
    // V = 400 · (1.04 − 0.04 · 600 / 600 − 0.03 · (48 − f)) (closed form).
    expectClose(r.metrics.final.voltageV, 400 * (1 - 0.03 * (48 - f)), { abs: 0.5 }, 'final voltage, V (V/Hz roll-off)');
    expectClose(r.metrics.final.sets[0]!.kW, 800, { abs: 1 }, 'final kW');
    expect(r.metrics.unservedKWh).toBe(0);
  });

  it('with a 3 pu ceiling the voltage stays down and the run says so', () => {
    const r = ratedStep(plant({ ceilingPU: 3 }, { underFrequencyPct: 0, underVoltagePct: 0 }));
    expect(r.warnings.join(' ')).toMatch(/only 8 % above/);
    // More than 10 % low at the end.
    expect(r.metrics.final.voltageV).toBeLessThan(360);
    expect(r.metrics.unservedKWh).toBeGreaterThan(0);
    expect(r.metrics.maxUnservedKW).toBeGreaterThan(100);
    expect(r.warnings.join(' ')).toMatch(/Load was not served .* kWh in all\. Load is still not served at the end/);
    expect(r.log.some((e) => /constant-power and constant-current loads now draw as constant impedance/.test(e.text))).toBe(true);
    const rec = r.metrics.classes.find((c) => c.quantity === 'voltage recovery time')!;
    expect(rec.pass).toEqual({ G1: false, G2: false, G3: false });
    expect(rec.note).toMatch(/below the 400\.0 V steady state of the final loads/);
  });

  it('with a 3 pu ceiling and its undervoltage element on, the set trips on 27 after its delay', () => {
    const r = ratedStep(plant({ ceilingPU: 3 }, { underFrequencyPct: 0 }));
    const trip = r.metrics.trips.find((x) => x.device === '27')!;
    expect(trip.id).toBe('G1');
    // The voltage sinks below 80 % within a few seconds of the step at 1 s (the field flux decays
    // with T'd0 = 2.5 s) and stays there; the 27 delay is 5 s.
    const below = r.series.t.find((t, k) => t > 1 && r.series.voltageV[k]! < 320)!;
    expect(trip.atS).toBeGreaterThan(1 + 5);
    expectClose(trip.atS, below + 5, { abs: 0.05 }, 'trip time, s (first plotted point below 320 V + 5 s)');
    expect(r.log.some((e) => /G1 tripped on undervoltage \(device 27\): below 320 V/.test(e.text))).toBe(true);
    expect(r.log.some((e) => /bus dead: 800 kW of load not served/.test(e.text))).toBe(true);
    const rec = r.metrics.classes.find((c) => c.quantity === 'voltage recovery time')!;
    expect(rec.note).toMatch(/no steady state to recover to: no set is on line/);
  });

  it('the over-excitation limiter holds the field at its limit after its delay, and says so', () => {
    // Limit 100 % of the 2.7757 pu rated-load field, 0.2 s: the field forcing after the step lasts longer.
    const r = ratedStep(plant({ oelPct: 100, oelDelayS: 0.2, vhzSlopePctPerHz: 0 }, { underFrequencyPct: 0, underVoltagePct: 0 }));
    const acts = r.log.find((l) => /G1 over-excitation limiter acts: field held at 2\.78 pu after 0\.2 s above it/.test(l.text));
    expect(acts).toBeDefined();
    expect(acts!.atS).toBeGreaterThan(1.2);
    expect(r.warnings.join(' ')).toMatch(/over-excitation limiter held the field at 2\.78 pu/);
  });

  it('the over-excitation limiter resets once the field has stayed below its limit for the reset time, and may act again', () => {
    // Limit 110 % of the 2.7757 pu rated-load field (3.05 pu), delay 0.2 s, reset 2 s (values chosen
    // for the test). The rated step (L2) goes on at 1 s: the field forces above the limit, is held,
    // then settles at the full-load field below it. L2 goes off at 6 s and on again at 9 s.
    const run = (oelResetS: number) =>
      simulate({
        plant: makePlant(
          [
            {
              id: 'G1',
              ratedKVA: 1000,
              ratedKW: 800,
              governor: { mode: 'droop' },
              regulator: { mode: 'reactive-droop', oelPct: 110, oelDelayS: 0.2, oelResetS, vhzSlopePctPerHz: 0 },
              protection: { underFrequencyPct: 0, underVoltagePct: 0 },
            },
          ],
          [
            { id: 'L', kW: 400, kVAR: 300 },
            { id: 'L2', kW: 400, kVAR: 300, online: false },
          ],
        ),
        durationS: 14,
        stepMs: 2,
        events: [
          { atS: 1, type: 'load-step', loadId: 'L2', online: true },
          { atS: 6, type: 'load-step', loadId: 'L2', online: false },
          { atS: 9, type: 'load-step', loadId: 'L2', online: true },
        ],
      });
    const r = run(2);
    const acts = r.log.filter((l) => /G1 over-excitation limiter acts: field held at 3\.05 pu after 0\.2 s above it/.test(l.text));
    const resets = r.log.filter((l) => /G1 over-excitation limiter resets: field below 3\.05 pu for 2 s/.test(l.text));
    expect(acts).toHaveLength(2);
    expect(resets).toHaveLength(2);
    // Released no sooner than the reset time after it acted (the field must stay below for 2 s).
    expect(resets[0]!.atS).toBeGreaterThanOrEqual(acts[0]!.atS + 2);
    expect(resets[0]!.atS).toBeLessThan(6);
    // Free again, the field forces after the second step and the limiter needs its delay to act.
    expect(acts[1]!.atS).toBeGreaterThanOrEqual(9 + 0.2);
    expect(r.warnings.join(' ')).toMatch(/reset time/);
    // A reset time longer than the run: the limiter holds to the end (acts once, never resets).
    const latched = run(600);
    expect(latched.log.filter((l) => /limiter acts/.test(l.text))).toHaveLength(1);
    expect(latched.log.some((l) => /limiter resets/.test(l.text))).toBe(false);
  });
});
