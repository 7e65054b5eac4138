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

function plant(regulator: Record<string, unknown> = {}): Plant {
  return makePlant(
    [{ id: 'G1', ratedKVA: 1000, ratedKW: 800, governor: { mode: 'droop' }, regulator: { mode: 'reactive-droop', ...regulator } }],
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
  it('ends within the regulator steady-state band at the full load, nothing unserved', () => {
    const r = ratedStep(plant());
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

  it('with a 3 pu ceiling the voltage stays down and the run says so', () => {
    const r = ratedStep(plant({ ceilingPU: 3 }));
    expect(r.warnings.join(' ')).toMatch(/only 8 % above/);
    // More than 10 % low at the end.
    expect(r.metrics.final.voltageV).toBeLessThan(360);
    expect(r.metrics.unservedKWh).toBeGreaterThan(0);
    expect(r.metrics.maxUnservedKW).toBeGreaterThan(100);
    expect(r.warnings.join(' ')).toMatch(/kW \(.* kWh in all\) was not served/);
    expect(r.log.some((e) => /constant-power loads now draw as constant impedance/.test(e.text))).toBe(true);
    const rec = r.metrics.classes.find((c) => c.quantity === 'voltage recovery time')!;
    expect(rec.pass).toEqual({ G1: false, G2: false, G3: false });
    expect(rec.note).toMatch(/below the 400\.0 V steady state of the final loads/);
  });
});
