import { describe, it, expect } from 'vitest';
import { describePlant, fieldLimitKVAR, ratedFieldEmfPU, setCapability, settingWarnings, solveSharingAtMost, solveSharing } from '../../electron/engine';
import { expectClose } from '../helpers/expect-close';
import { demoPlant, makePlant, rawSet } from '../helpers/plants';

describe('setCapability: the limit curves from the machine data', () => {
  // A 1250 kVA, 1000 kW, rated PF 0.8 set with Xd = 2.5 pu (the test builder's defaults).
  const set = makePlant([rawSet('A', { machine: { xdPU: 2.5 } })]).sets[0]!;
  const c = setCapability(set);

  it('field EMF at rated kVA and PF: E = |V + jXd I| = √((1 + Xd sin φ)² + (Xd cos φ)²) (closed form)', () => {
    // √((1 + 2.5 × 0.6)² + (2.5 × 0.8)²) = √(6.25 + 4) = √10.25 = 3.2016 pu.
    expectClose(ratedFieldEmfPU(2.5, 0.8), Math.sqrt(10.25), { rel: 1e-12 }, 'E rated');
    expectClose(c.fieldEmfPU, 3.2016, { abs: 1e-4 }, 'E rated (hand calculation)');
  });

  it('the field limit passes through the rated point and meets the kVAR axis at S (E − 1) / Xd (closed form)', () => {
    // At 1000 kW: q = (√(10.25 − (2.5 × 0.8)²) − 1) / 2.5 = (2.5 − 1) / 2.5 = 0.6 pu = 750 kVAR: the rated point.
    expectClose(fieldLimitKVAR(set, 1000), 750, { rel: 1e-12 }, 'field limit at rated kW = rated kVAR');
    expectClose(c.ratedKVAR, 750, { rel: 1e-12 }, 'rated kVAR = 1250 × 0.6');
    // At 0 kW: 1250 × (3.2016 − 1) / 2.5 = 1100.8 kVAR.
    expectClose(fieldLimitKVAR(set, 0), (1250 * (Math.sqrt(10.25) - 1)) / 2.5, { rel: 1e-12 }, 'field limit at 0 kW');
    expectClose(fieldLimitKVAR(set, 0), 1100.8, { abs: 0.05 }, 'field limit at 0 kW (hand calculation)');
    // Every point of the drawn field curve satisfies (1 + Xd q)² + (Xd p)² = E².
    for (const pt of c.field) {
      const p = pt.kW / 1250;
      const q = pt.kVAR / 1250;
      expectClose((1 + 2.5 * q) ** 2 + (2.5 * p) ** 2, 10.25, { rel: 1e-9 }, 'on the field circle');
    }
    // Below rated kW the field limit binds (inside the stator circle); above it the stator circle binds
    // (they cross at the rated point).
    expect(Math.hypot(800, fieldLimitKVAR(set, 800))).toBeLessThan(1250);
    expect(fieldLimitKVAR(set, 1100)).toBeGreaterThan(Math.sqrt(1250 ** 2 - 1100 ** 2));
  });

  it('stator circle, leading limit and engine limits from the ratings (closed form)', () => {
    for (const pt of c.stator) expectClose(Math.hypot(pt.kW, pt.kVAR), 1250, { rel: 1e-12 }, 'stator circle radius = rated kVA');
    expect(c.stator[0]!.kVAR).toBeCloseTo(-1250, 9);
    expect(c.stator[c.stator.length - 1]!.kVAR).toBeCloseTo(1250, 9);
    expect(c.leadingKVAR).toBe(-375); // 30 % of 1250 kVA (default leading limit)
    expect(c.overloadKW).toBeCloseTo(1100, 9); // 110 % of 1000 kW (ISO 8528-1 prime overload, value from memory)
    expect(c.motoringKW).toBeCloseTo(250, 9); // 25 % (IEEE C37.102 four-stroke diesel, value from memory)
    expect(c.reverseTripKW).toBeCloseTo(100, 9); // 10 % default 32 setting
    expect(c.minChartKW).toBeLessThan(-250);
    expect(c.maxChartKW).toBeGreaterThan(1250);
  });

  it('describePlant carries every set’s chart', () => {
    const d = describePlant(demoPlant());
    expect(d.sets.map((s) => s.capability.id)).toEqual(['G1', 'G2', 'G3']);
    // G1: Xd 2.6, PF 0.8 → E = √((1 + 1.56)² + 2.08²) (closed form).
    expectClose(d.sets[0]!.capability.fieldEmfPU, Math.hypot(2.56, 2.08), { rel: 1e-12 }, 'G1 E');
    expect(d.settingWarnings).toEqual([]);
  });

  it('the solver holds a reactive-droop set at its field limit and flags it by name', () => {
    // B's no-load voltage far above A's: B would take more kVAR than its field allows at its kW.
    const r = solveSharing(
      makePlant(
        [
          rawSet('A', { regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 400 } }),
          rawSet('B', { regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 440 } }),
        ],
        [{ id: 'L', kW: 1600, kVAR: 600 }],
      ),
    );
    const b = r.sets[1]!;
    expectClose(b.kVAR, fieldLimitKVAR(makePlant([rawSet('B')]).sets[0]!, b.kW), { rel: 1e-9 }, 'B on its field limit at its kW');
    expect(b.flags).toContain('field-limit');
    expect(b.notes.join(' ')).toMatch(/B is held at its field-heating limit/);
    expectClose(r.sets[0]!.kVAR + b.kVAR, r.totals.loadKVAR, { rel: 1e-9 }, 'kVAR balance');
  });
});

describe('settingWarnings: set-points outside the usual range are warned about in words, not refused', () => {
  it('names the set and the setting', () => {
    const p = makePlant([
      rawSet('A', { governor: { mode: 'droop', droopPct: 12, noLoadHz: 56 } }),
      rawSet('B', { governor: { mode: 'droop', droopPct: 4, noLoadHz: 49.5 }, regulator: { mode: 'reactive-droop', droopPct: 0.5, noLoadV: 450 } }),
    ]);
    expect(settingWarnings(p)).toEqual([
      'A: speed droop 12 % is outside the usual 1–10 % (3–5 % is common).',
      'A: no-load frequency 56 Hz is 12.0 % from rated 50 Hz (usually within ±10 %).',
      'B: no-load frequency 49.5 Hz is not above rated 50 Hz: in speed droop the set then carries no kW at rated frequency or above (usual: rated × (1 + droop) = 52.00 Hz).',
      'B: reactive droop 0.5 % is outside the usual 1–10 % (3–5 % is common).',
      'B: no-load voltage 450 V is 12.5 % from rated 400 V (usually within ±10 %).',
    ]);
    // The sharing result carries them too.
    expect(solveSharing(p, { kW: 500, kVAR: 0 }).warnings).toContain('A: speed droop 12 % is outside the usual 1–10 % (3–5 % is common).');
  });
});

describe('solveSharingAtMost: a load beyond the sets is answered at the most they can carry, and says so', () => {
  it('two 1000 kW sets (overload limit 2 × 1100 kW) asked for 2500 kW carry 2200 kW (closed form)', () => {
    const p = makePlant([rawSet('A'), rawSet('B')]);
    const r = solveSharingAtMost(p, { kW: 2500, kVAR: 1000 });
    expectClose(r.capped!.carriedKW, 2200, { rel: 1e-9 }, 'most carried = Σ overload limits');
    expectClose(r.capped!.shortKW, 300, { rel: 1e-8 }, 'short');
    expectClose(r.capped!.carriedKVAR, 880, { rel: 1e-9 }, 'same kVAR/kW (0.4)');
    expect(r.warnings[0]).toMatch(
      /^The load asked for \(2500 kW\) has no steady state: The load \(2500 kW\) is more than .* Shown instead: the most the sets can carry at the same power factor, 2200 kW \(300 kW less\)\.$/,
    );
    expect(solveSharingAtMost(p, { kW: 1000, kVAR: 0 }).capped).toBeUndefined();
  });
});
