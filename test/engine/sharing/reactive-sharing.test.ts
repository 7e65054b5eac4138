import { describe, it, expect } from 'vitest';
import { solveSharing, NoSteadyState } from '../../../electron/engine';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

const SQRT3 = Math.sqrt(3);
const load = (kW: number, kVAR: number, over: Record<string, unknown> = {}) => [{ id: 'L', kW, kVAR, ...over }];
const reg = (r: Record<string, unknown>) => ({ regulator: r });

describe('solveSharing: reactive sharing (closed forms)', () => {
  it('reactive droop on unequal sets (closed form, converted to the kVAR base)', () => {
    // Closed form: 1000 and 500 kVA, 4 % on the kVA base, V0 1.01 and 1.00 pu, 600 kVAR
    // → 483.3 / 116.7 kVAR, V = 0.9907 pu. Droopline's droop is on Qbase = kVA·√(1 − 0.8²) = 0.6 kVA, so
    // 4 % per kVA is 4 % × 0.6 = 2.4 % per Qbase.
    const a = rawSet('A', { ratedKVA: 1000, ratedKW: 800, ...reg({ mode: 'reactive-droop', droopPct: 2.4, noLoadV: 404 }) });
    const b = rawSet('B', { ratedKVA: 500, ratedKW: 400, ...reg({ mode: 'reactive-droop', droopPct: 2.4, noLoadV: 400 }) });
    const r = solveSharing(makePlant([a, b], load(600, 600)));
    // Recomputed: 1.01 − 4e-5 Q1 = 1.00 − 8e-5 (600 − Q1) → Q1 = 0.058 / 1.2e-4.
    const q1 = 0.058 / 1.2e-4;
    expectClose(r.sets[0]!.kVAR, q1, { rel: 1e-12 }, 'A kVAR (recomputed)');
    expectClose(r.sets[0]!.kVAR, 483.3, { abs: 0.05 }, 'A kVAR (closed form)');
    expectClose(r.sets[1]!.kVAR, 116.7, { abs: 0.05 }, 'B kVAR (closed form)');
    expectClose(r.bus.voltageV / 400, 0.9907, { abs: 5e-5 }, 'V pu (closed form)');
    // Equal no-load voltages → 400 / 200 kVAR (closed form).
    const eq = solveSharing(makePlant([a, { ...b, regulator: { mode: 'reactive-droop', droopPct: 2.4, noLoadV: 404 } }], load(600, 600)));
    expectClose(eq.sets[0]!.kVAR, 400, { rel: 1e-12 }, 'A kVAR, equal V0');
    expectClose(eq.sets[1]!.kVAR, 200, { rel: 1e-12 }, 'B kVAR, equal V0');
    expectClose(eq.sets[0]!.circulatingA, 0, { abs: 1e-9 }, 'no circulating current with proportional sharing');
  });

  it('circulating current between two sets in reactive droop at different no-load voltages', () => {
    // Closed form: 1250 kVA, PF 0.8 → Qbase 750 kVAR; 4 % of 400 V → 46.875 kVAR/V. V0 416 and 412 V, no
    // reactive load: V = 414 V, Q = ±93.75 kVAR; circulating = 93 750 / (√3 · 414) A each way.
    const r = solveSharing(
      makePlant(
        [rawSet('A', reg({ mode: 'reactive-droop', droopPct: 4, noLoadV: 416 })), rawSet('B', reg({ mode: 'reactive-droop', droopPct: 4, noLoadV: 412 }))],
        load(1000, 0),
      ),
    );
    expectClose(r.bus.voltageV, 414, { rel: 1e-12 }, 'V');
    expectClose(r.sets[0]!.kVAR, 93.75, { rel: 1e-12 }, 'A kVAR');
    expectClose(r.sets[1]!.kVAR, -93.75, { rel: 1e-12 }, 'B kVAR');
    const ic = 93_750 / (SQRT3 * 414);
    expectClose(r.sets[0]!.circulatingA, ic, { rel: 1e-12 }, 'A circulating A');
    expectClose(r.sets[1]!.circulatingA, -ic, { rel: 1e-12 }, 'B circulating A');
    const ratedA = 1_250_000 / (SQRT3 * 400);
    expectClose(r.sets[0]!.circulatingPct, (100 * ic) / ratedA, { rel: 1e-12 }, 'A circulating %');
    expect(r.sets[1]!.pfLagging).toBe(false);
    expectClose(r.sets[0]!.sharingErrorKVARPct, (100 * 93.75) / 1250, { rel: 1e-12 }, 'kVAR sharing error %');
  });

  it('cross-current sets hold the setpoint and share kVAR in proportion to ratedKVA', () => {
    // Closed form: 1000 and 500 kVA, 600 kVAR → 400 / 200 kVAR at 400 V; no circulating current.
    const a = rawSet('A', { ratedKVA: 1000, ratedKW: 800, ...reg({ mode: 'cross-current', setpointV: 400 }) });
    const b = rawSet('B', { ratedKVA: 500, ratedKW: 400, ...reg({ mode: 'cross-current', setpointV: 400 }) });
    const r = solveSharing(makePlant([a, b], load(600, 600)));
    expect(r.bus.voltageV).toBe(400);
    expectClose(r.sets[0]!.kVAR, 400, { rel: 1e-12 }, 'A');
    expectClose(r.sets[1]!.kVAR, 200, { rel: 1e-12 }, 'B');
    expectClose(r.sets[1]!.circulatingA, 0, { abs: 1e-9 }, 'B circulating');
    // Different setpoints: the loop holds their kVA-weighted mean, and says so.
    const mixed = solveSharing(makePlant([a, { ...b, regulator: { mode: 'cross-current', setpointV: 406 } }], load(600, 600)));
    expectClose(mixed.bus.voltageV, (1000 * 400 + 500 * 406) / 1500, { rel: 1e-12 }, 'weighted setpoint');
    expect(mixed.warnings[0]).toMatch(/different voltage setpoints/);
  });

  it('one set in voltage control with a reactive-droop set: the droop set sits on its line at the setpoint', () => {
    // Closed form: B 46.875 kVAR/V × (416 − 400) = 750 kVAR; A takes 900 − 750 = 150 kVAR at 400 V.
    const a = rawSet('A', reg({ mode: 'voltage', setpointV: 400 }));
    const b = rawSet('B', reg({ mode: 'reactive-droop', droopPct: 4, noLoadV: 416 }));
    const r = solveSharing(makePlant([a, b], load(1000, 900)));
    expect(r.bus.voltageV).toBe(400);
    expectClose(r.sets[1]!.kVAR, 750, { rel: 1e-12 }, 'B');
    expectClose(r.sets[0]!.kVAR, 150, { rel: 1e-12 }, 'A');
  });

  it('Theraja, A Textbook of Electrical Technology Vol. II: 10 MW at 0.8 PF, A at 6000 kW and 0.92 lagging → B at 0.629 lagging', () => {
    // A: base load 6000 kW in power-factor control 0.92; B: droop governor, voltage control, takes the rest.
    const a = rawSet('A', { ratedKW: 8000, ratedKVA: 10_000, governor: { mode: 'baseload', baseKW: 6000 }, regulator: { mode: 'power-factor', pf: 0.92 } });
    const b = rawSet('B', { ratedKW: 8000, ratedKVA: 10_000, regulator: { mode: 'voltage', setpointV: 400 } });
    const r = solveSharing(makePlant([a, b], load(10_000, 7500)));
    expectClose(r.sets[0]!.pf, 0.92, { rel: 1e-12 }, 'A PF');
    expectClose(r.sets[1]!.kW, 4000, { rel: 1e-12 }, 'B kW');
    expectClose(r.sets[1]!.pf, 0.629, { abs: 5e-4 }, 'B PF (Theraja)');
    expect(r.sets[1]!.pfLagging).toBe(true);
  });

  it('constant-impedance loads: the droop set meets Q0 (V/V_r)² on the quadratic', () => {
    // Closed form: 46.875 (416 − V) = 600 V² / 400² → c V² + a V − a·416 = 0.
    const a = 46.875;
    const c = 600 / 160_000;
    const v = (-a + Math.sqrt(a * a + 4 * c * a * 416)) / (2 * c);
    const r = solveSharing(makePlant([rawSet('A')], load(800, 600, { model: 'constant-impedance' })));
    expectClose(r.bus.voltageV, v, { rel: 1e-12 }, 'V');
    expectClose(r.totals.loadKVAR, (600 * v * v) / 160_000, { rel: 1e-12 }, 'load kVAR at V');
    expectClose(r.totals.loadKW, (800 * v * v) / 160_000, { rel: 1e-12 }, 'load kW at V');
    expectClose(r.sets[0]!.kW, r.totals.loadKW, { rel: 1e-12 }, 'kW balance');
  });

  it('power-factor control with reactive droop: Q = P tan φ, the droop set sets the voltage', () => {
    // Closed form: equal 1000 kW sets in droop share 1200 kW → 600 kW each; A at PF 0.8 → 450 kVAR;
    // B takes 700 − 450 = 250 kVAR → V = 416 − 250 / 46.875.
    const a = rawSet('A', reg({ mode: 'power-factor', pf: 0.8 }));
    const r = solveSharing(makePlant([a, rawSet('B')], load(1200, 700)));
    expectClose(r.sets[0]!.kVAR, 450, { rel: 1e-12 }, 'A');
    expectClose(r.bus.voltageV, 416 - 250 / 46.875, { rel: 1e-12 }, 'V');
  });

  it('a set whose no-load voltage is far below the other is held at its leading limit; the other takes the rest', () => {
    // Closed form: Qbase = 1250 × 0.6 = 750 kVAR, slope 750 / (0.04 × 400) = 46.875 kVAR/V. V0 416 and 380 V at no
    // reactive load would give ±46.875 × 18 = ±843.75 kVAR, but B's leading limit is 30 % of 1250 kVA = 375 kVAR:
    // B is held at −375 kVAR, A gives +375 kVAR on its droop line, V = 416 − 375 / 46.875 = 408 V.
    const r = solveSharing(
      makePlant(
        [rawSet('A', reg({ mode: 'reactive-droop', droopPct: 4, noLoadV: 416 })), rawSet('B', reg({ mode: 'reactive-droop', droopPct: 4, noLoadV: 380 }))],
        load(1000, 0),
      ),
    );
    expectClose(r.sets[1]!.kVAR, -0.3 * 1250, { rel: 1e-12 }, 'B held at the leading limit');
    expectClose(r.sets[0]!.kVAR, 375, { rel: 1e-12 }, 'A kVAR');
    expectClose(r.bus.voltageV, 416 - 375 / 46.875, { abs: 1e-9 }, 'V (closed form)');
    expect(r.sets[1]!.flags).toEqual(['under-excited']);
    expect(r.sets[0]!.flags).toEqual([]);
    expect(r.warnings.join('\n')).toContain(
      'B is held at its under-excitation limit: 375 kVAR leading (30 % of 1250 kVA); it absorbs reactive power from the other sets.',
    );
  });

  it('a voltage-holding set beyond its ratings is flagged (kVA and field heating), not held', () => {
    // Closed form: B (reactive droop, V0 372 V) would absorb 46.875 × 28 = 1312.5 kVAR at 400 V; held at −375 kVAR.
    // A holds 400 V and supplies load + 375 = 1375 kVAR at 0 kW: 110 % of 1250 kVA. Field limit at 0 kW (Xd 2.5,
    // rated PF 0.8): E = √((1 + 2.5 × 0.6)² + (2.5 × 0.8)²) = 3.2016 pu, Q = 1250 (E − 1) / 2.5 = 1100.8 kVAR.
    const o = solveSharing(
      makePlant([rawSet('A', reg({ mode: 'voltage' })), rawSet('B', reg({ mode: 'reactive-droop', droopPct: 4, noLoadV: 372 }))], load(0, 1000)),
    );
    expectClose(o.sets[0]!.kVAR, 1375, { rel: 1e-12 }, 'A kVAR');
    expect(o.sets[0]!.flags).toEqual(['overload-kVA', 'field-limit']);
    const e = Math.hypot(1 + 2.5 * 0.6, 2.5 * 0.8);
    expectClose(e, 3.2016, { abs: 1e-4 }, 'E at rated kVA and PF (closed form)');
    expect(o.warnings.join('\n')).toContain('A is over its kVA rating: 1375 kVA of 1250 kVA (110 %)');
    expect(o.warnings.join('\n')).toContain(
      `A is beyond its field-heating limit: 1375 kVAR lagging at 0 kW (the limit there is ${((1250 * (e - 1)) / 2.5).toFixed(0)} kVAR).`,
    );
  });

  it('no steady state: two voltage holders, no voltage reference, voltage collapse', () => {
    const cases: [unknown[], unknown[], RegExp][] = [
      [
        [rawSet('A', reg({ mode: 'voltage' })), rawSet('B', reg({ mode: 'voltage' }))],
        load(100, 50),
        /Sets A and B all hold voltage without reactive droop or a shared cross-current loop/,
      ],
      [
        [rawSet('A', reg({ mode: 'voltage' })), rawSet('B', reg({ mode: 'cross-current' })), rawSet('C', reg({ mode: 'cross-current' }))],
        load(100, 50),
        /Sets A, B and C all hold voltage/,
      ],
      [[rawSet('A', reg({ mode: 'power-factor' }))], load(100, 50), /No online set controls voltage/],
      [[rawSet('A')], load(100, 25_000), /more than the sets in reactive droop can supply at any voltage/],
    ];
    for (const [sets, loads, re] of cases) {
      let err: unknown;
      try {
        solveSharing(makePlant(sets, loads));
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(NoSteadyState);
      expect((err as Error).message).toMatch(re);
    }
  });
});
