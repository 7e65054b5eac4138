import { describe, it, expect } from 'vitest';
import { solveSharing, NoSteadyState } from '../../../electron/engine';
import type { SharingResult } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

// ---- An independent solve of the same network, written here with plain complex arithmetic ----
// Unknowns: x0 (bus frequency, or the isochronous set's kW), bus voltage V_b (angle 0), and each
// set's terminal voltage in polar form (E_i, δ_i). Equations: the set's sending-end P equals its
// governor output, its regulator law on |V_t| and Q, and the bus balance Σ V_b conj(I_i) = S_load.
// Solved by Newton with a finite-difference Jacobian: nothing is shared with the engine.

type C = [number, number];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const conj = (a: C): C => [a[0], -a[1]];
const polar = (r: number, th: number): C => [r * Math.cos(th), r * Math.sin(th)];

interface IndepSet {
  z: C;
  /** Governor: sending-end W as a function of (x0). */
  pW: (x0: number) => number;
  /** Regulator residual from |V_t| (V) and sending-end Q (VAR). */
  qRule: (e: number, qVAR: number) => number;
}

function solveIndependent(sets: IndepSet[], loadW: number, loadVAR: number, x0: number, vb: number) {
  const n = sets.length;
  const x = [x0, vb, ...sets.flatMap(() => [vb, 0])];
  const resid = (x: number[]) => {
    const out: number[] = [];
    let bus: C = [0, 0];
    sets.forEach((s, i) => {
      const vt = polar(x[2 + 2 * i]!, x[3 + 2 * i]!);
      const cur = div(sub(vt, [x[1]!, 0]), s.z);
      const ss = mul(vt, conj(cur));
      out.push((ss[0] - s.pW(x[0]!)) / 1e3, s.qRule(x[2 + 2 * i]!, ss[1]));
      const sr = mul([x[1]!, 0], conj(cur));
      bus = [bus[0] + sr[0], bus[1] + sr[1]];
    });
    out.push((bus[0] - loadW) / 1e3, (bus[1] - loadVAR) / 1e3);
    return out;
  };
  for (let it = 0; it < 100; it++) {
    const f0 = resid(x);
    if (Math.max(...f0.map(Math.abs)) < 1e-9) break;
    const m = f0.length;
    const J = f0.map(() => new Array<number>(m).fill(0));
    for (let j = 0; j < m; j++) {
      const h = 1e-7 * Math.max(1, Math.abs(x[j]!));
      const xp = [...x];
      xp[j] = xp[j]! + h;
      const fp = resid(xp);
      for (let r = 0; r < m; r++) J[r]![j] = (fp[r]! - f0[r]!) / h;
    }
    const b = f0.map((v) => -v);
    for (let c = 0; c < m; c++) {
      let p = c;
      for (let r = c + 1; r < m; r++) if (Math.abs(J[r]![c]!) > Math.abs(J[p]![c]!)) p = r;
      [J[c], J[p]] = [J[p]!, J[c]!];
      [b[c], b[p]] = [b[p]!, b[c]!];
      for (let r = c + 1; r < m; r++) {
        const f = J[r]![c]! / J[c]![c]!;
        for (let k = c; k < m; k++) J[r]![k] = J[r]![k]! - f * J[c]![k]!;
        b[r] = b[r]! - f * b[c]!;
      }
    }
    for (let r = m - 1; r >= 0; r--) {
      let s = b[r]!;
      for (let k = r + 1; k < m; k++) s -= J[r]![k]! * b[k]!;
      b[r] = s / J[r]![r]!;
    }
    for (let j = 0; j < m; j++) x[j] = x[j]! + b[j]!;
  }
  return {
    x0: x[0]!,
    vb: x[1]!,
    sets: sets.map((s, i) => {
      const vt = polar(x[2 + 2 * i]!, x[3 + 2 * i]!);
      const cur = div(sub(vt, [x[1]!, 0]), s.z);
      const ss = mul(vt, conj(cur));
      return { kW: ss[0] / 1e3, kVAR: ss[1] / 1e3, e: x[2 + 2 * i]!, lossKW: (s.z[0] * (cur[0] ** 2 + cur[1] ** 2)) / 1e3 };
    }),
    n,
  };
}

/** Reactive droop law: |V_t| = V0 − droop · V_r · Q / Qbase (the reactive-droop definition). */
const droopQ =
  (v0: number, droopPct: number, qBaseKVAR: number, vr = 400) =>
  (e: number, q: number) =>
    e - (v0 - ((droopPct / 100) * vr * q) / 1e3 / qBaseKVAR);
/** Speed droop law: P = ratedKW (f_nl − f) / (droop · f_r), in W. */
const droopP =
  (ratedKW: number, droopPct: number, fnl: number, fr = 50) =>
  (f: number) =>
    ((ratedKW * (fnl - f)) / ((droopPct / 100) * fr)) * 1e3;

function compare(r: SharingResult, ind: ReturnType<typeof solveIndependent>, tol = 1e-7) {
  ind.sets.forEach((s, i) => {
    expectClose(r.sets[i]!.kW, s.kW, { rel: tol, abs: 1e-6 }, `set ${i} kW vs independent solve`);
    expectClose(r.sets[i]!.kVAR, s.kVAR, { rel: tol, abs: 1e-6 }, `set ${i} kVAR vs independent solve`);
    expectClose(r.sets[i]!.terminalV, s.e, { rel: tol }, `set ${i} terminal V vs independent solve`);
    expectClose(r.sets[i]!.feederLossKW, s.lossKW, { rel: 1e-6, abs: 1e-9 }, `set ${i} feeder loss vs independent solve`);
  });
  expectClose(r.bus.voltageV, ind.vb, { rel: tol }, 'bus V vs independent solve');
}

describe('solveSharing with feeders (Newton–Raphson)', () => {
  const fA = { rOhm: 0.004, xOhm: 0.008 };
  const fB = { rOhm: 0.009, xOhm: 0.005 };

  it('two droop sets through unequal feeders agree with an independent complex-arithmetic solve', () => {
    const plant = makePlant(
      [
        rawSet('A', { feeder: fA, regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 416 } }),
        rawSet('B', {
          ratedKW: 640,
          ratedKVA: 800,
          feeder: fB,
          governor: { mode: 'droop', droopPct: 5, noLoadHz: 52.4 },
          regulator: { mode: 'reactive-droop', droopPct: 3, noLoadV: 410 },
        }),
      ],
      [{ id: 'L', kW: 1100, kVAR: 650 }],
    );
    const r = solveSharing(plant);
    expect(r.method).toBe('newton-raphson');
    const ind = solveIndependent(
      [
        { z: [0.004, 0.008], pW: droopP(1000, 4, 52), qRule: droopQ(416, 4, 750) },
        { z: [0.009, 0.005], pW: droopP(640, 5, 52.4), qRule: droopQ(410, 3, 480) },
      ],
      1_100_000,
      650_000,
      50,
      400,
    );
    compare(r, ind);
    expectClose(r.bus.frequencyHz, ind.x0, { abs: 1e-9 }, 'f vs independent solve');
    expect(r.totals.feederLossKW).toBeGreaterThan(1);
    expectClose(r.totals.kW, r.totals.loadKW + r.totals.feederLossKW, { rel: 1e-12 }, 'Σ kW = load + losses');
  });

  it('isochronous + voltage control behind a feeder agrees with the independent solve', () => {
    // A isochronous at 50 Hz and voltage control (400 V at its terminals); B droop / reactive droop.
    const plant = makePlant(
      [
        rawSet('A', { feeder: fA, governor: { mode: 'isochronous', setpointHz: 50 }, regulator: { mode: 'voltage', setpointV: 400 } }),
        rawSet('B', { feeder: fB, governor: { mode: 'droop', droopPct: 4, noLoadHz: 51 }, regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 410 } }),
      ],
      [{ id: 'L', kW: 1300, kVAR: 700, model: 'constant-impedance' }],
    );
    const r = solveSharing(plant);
    expect(r.bus.frequencyHz).toBe(50);
    // Independent: x0 = A's kW (W); the load is Z-constant so its S depends on V_b: iterate the
    // independent solve on V_b until consistent (fixed point, converges quickly for this small drop).
    let vb = 400;
    let ind = solveIndependent([], 0, 0, 0, 400);
    for (let k = 0; k < 60; k++) {
      const u = (vb / 400) ** 2;
      ind = solveIndependent(
        [
          { z: [0.004, 0.008], pW: (p) => p, qRule: (e) => e - 400 },
          { z: [0.009, 0.005], pW: () => droopP(1000, 4, 51)(50), qRule: droopQ(410, 4, 750) },
        ],
        1_300_000 * u,
        700_000 * u,
        700_000,
        vb,
      );
      if (Math.abs(ind.vb - vb) < 1e-12) break;
      vb = ind.vb;
    }
    compare(r, ind, 1e-6);
    expectClose(r.sets[0]!.terminalV, 400, { rel: 1e-12 }, 'A holds its terminals at the setpoint');
    expectClose(r.sets[1]!.kW, 500, { rel: 1e-9 }, 'B on its droop line at 50 Hz (closed form 500 kW/Hz × 1 Hz)');
  });

  it('cross-current sets behind feeders hold the kVA-weighted terminal voltage and share kVAR by kVA', () => {
    const plant = makePlant(
      [
        rawSet('A', { ratedKVA: 1000, ratedKW: 800, feeder: fA, regulator: { mode: 'cross-current', setpointV: 400 } }),
        rawSet('B', { ratedKVA: 500, ratedKW: 400, feeder: fB, regulator: { mode: 'cross-current', setpointV: 400 } }),
      ],
      [{ id: 'L', kW: 800, kVAR: 500 }],
    );
    const r = solveSharing(plant);
    const [a, b] = r.sets;
    expectClose(a!.kVAR / 1000, b!.kVAR / 500, { rel: 1e-9 }, 'kVAR per kVA equal');
    expectClose((1000 * a!.terminalV + 500 * b!.terminalV) / 1500, 400, { rel: 1e-12 }, 'weighted terminal V');
    expectClose(r.totals.kVAR, r.totals.loadKVAR + r.totals.feederLossKVAR, { rel: 1e-10 }, 'Σ kVAR = load + feeder kVAR');
  });

  it('approaches the closed forms as the feeders vanish', () => {
    const mk = (scale: number) =>
      makePlant(
        [
          rawSet('A', { feeder: { rOhm: 0.004 * scale, xOhm: 0.008 * scale } }),
          rawSet('B', {
            ratedKW: 500,
            ratedKVA: 625,
            feeder: { rOhm: 0.009 * scale, xOhm: 0.005 * scale },
            regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 412 },
          }),
        ],
        [{ id: 'L', kW: 1000, kVAR: 600 }],
      );
    const closed = solveSharing(mk(0));
    const tiny = solveSharing(mk(1e-6));
    expect(closed.method).toBe('closed-form');
    expect(tiny.method).toBe('newton-raphson');
    expectClose(tiny.bus.frequencyHz, closed.bus.frequencyHz, { abs: 1e-6 }, 'f');
    expectClose(tiny.bus.voltageV, closed.bus.voltageV, { rel: 1e-6 }, 'V');
    for (let i = 0; i < 2; i++) {
      expectClose(tiny.sets[i]!.kW, closed.sets[i]!.kW, { rel: 1e-6 }, `kW ${i}`);
      expectClose(tiny.sets[i]!.kVAR, closed.sets[i]!.kVAR, { rel: 1e-5 }, `kVAR ${i}`);
    }
  });

  it('an isochronous set saturates when load plus losses exceed it, handing frequency to the droop set', () => {
    // Closed forms would keep A (1000 kW) just short of full output at 1240 kW load with B at 250 kW;
    // the feeder losses push it over, so frequency falls below 50 Hz.
    const plant = makePlant(
      [
        // A standby-rated set (no overload allowance) so that its limit is its rating.
        rawSet('A', { overloadPct: 100, feeder: { rOhm: 0.01, xOhm: 0.01 }, governor: { mode: 'isochronous', setpointHz: 50 } }),
        rawSet('B', { ratedKW: 500, ratedKVA: 625, feeder: { rOhm: 0.01, xOhm: 0.01 }, governor: { mode: 'droop', droopPct: 4, noLoadHz: 51 } }),
      ],
      [{ id: 'L', kW: 1240, kVAR: 300 }],
    );
    const r = solveSharing(plant);
    expectClose(r.sets[0]!.kW, 1000, { rel: 1e-12 }, 'A at max');
    expect(r.bus.frequencyHz).toBeLessThan(50);
    expect(r.warnings[0]).toMatch(/at full output/);
    expectClose(r.totals.kW, r.totals.loadKW + r.totals.feederLossKW, { rel: 1e-10 }, 'Σ kW = load + losses');
  });

  it('the demo plant solves with losses reported and balanced', () => {
    const plant = makePlant(
      [rawSet('G1', { feeder: { rOhm: 0.0016, xOhm: 0.0024 } }), rawSet('G2', { ratedKW: 640, ratedKVA: 800, feeder: { rOhm: 0.0035, xOhm: 0.003 } })],
      [{ id: 'L', kW: 1200, kVAR: 700 }],
    );
    const r = solveSharing(plant);
    for (const s of r.sets) expect(s.feederLossKW).toBeGreaterThan(0);
    expectClose(r.totals.feederLossKW, r.sets[0]!.feederLossKW + r.sets[1]!.feederLossKW, { rel: 1e-12 }, 'loss total');
    expect(r.sets[0]!.terminalAngleDeg).toBeGreaterThan(0);
  });

  it('never mutates the plant (deep-frozen input solves the same)', () => {
    const freeze = <T>(o: T): T => {
      if (o && typeof o === 'object') {
        Object.values(o).forEach(freeze);
        Object.freeze(o);
      }
      return o;
    };
    const plant = makePlant([rawSet('A', { feeder: fA }), rawSet('B', { feeder: fB, governor: { mode: 'isochronous' } })], [{ id: 'L', kW: 900, kVAR: 400 }]);
    const before = JSON.stringify(plant);
    const r = solveSharing(freeze(plant));
    expect(JSON.stringify(plant)).toBe(before);
    // A alone gives 1000 kW at 50 Hz, more than the 900 kW load: B backs off to its minimum and A sets the frequency.
    expectClose(r.sets[1]!.kW, 0, { abs: 1e-6 }, 'B at its minimum');
    expect(r.bus.frequencyHz).toBeGreaterThan(50);
    expect(r.warnings[0]).toMatch(/at minimum output/);
  });

  it('load plus losses beyond capability is no steady state', () => {
    const plant = makePlant([rawSet('A', { feeder: { rOhm: 0.01, xOhm: 0.01 } })], [{ id: 'L', kW: 1200, kVAR: 300 }]);
    expect(() => solveSharing(plant)).toThrow(NoSteadyState);
    // Just inside the overload limit (1100 kW) without feeders, over it with the losses.
    const edge = makePlant([rawSet('A', { feeder: { rOhm: 0.01, xOhm: 0.01 } })], [{ id: 'L', kW: 1095, kVAR: 300 }]);
    expect(() => solveSharing(edge)).toThrow(
      /^The load \(1095 kW\) is more than the online sets can supply at their overload limits \(\d+ kW into the bus, after feeder losses\): \d+ kW short/,
    );
  });
});
