import { describe, it, expect } from 'vitest';
import { solveSharing, NoSteadyState } from '../../../electron/engine';
import type { SharingResult } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';
import { makePlant, rawSet } from '../../helpers/plants';

/** A set in droop: rating kW (kVA = 1.25 kW), droop %, no-load Hz; extra fields override. */
function droopSet(id: string, kW: number, droopPct: number, noLoadHz: number, over: Record<string, unknown> = {}) {
  return rawSet(id, { ratedKW: kW, ratedKVA: kW * 1.25, governor: { mode: 'droop', droopPct, noLoadHz }, ...over });
}

/** An isochronous set of rating kW. */
function isoSet(id: string, kW: number, setpointHz: number, over: Record<string, unknown> = {}) {
  return rawSet(id, { ratedKW: kW, ratedKVA: kW * 1.25, governor: { mode: 'isochronous', setpointHz }, ...over });
}

const load = (kW: number, over: Record<string, unknown> = {}) => [{ id: 'L', kW, kVAR: 0, ...over }];
const kw = (r: SharingResult) => r.sets.map((s) => s.kW);

/** Droop % giving a slope of `kWPerHz` for a set of `ratedKW` at `fHz` rated: k = P_r / (δ f_r). */
const droopFor = (ratedKW: number, kWPerHz: number, fHz: number) => (100 * ratedKW) / (kWPerHz * fHz);

describe('solveSharing: droop sets (closed forms)', () => {
  it('two equal sets in 4 % droop from the same no-load setpoint split equally on the droop line', () => {
    // Closed form: k = 1000 kW / (0.04 · 50 Hz) = 500 kW/Hz each; f = 52 − 1200 / 1000 = 50.8 Hz.
    const r = solveSharing(makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 1000, 4, 52)], load(1200)));
    expectClose(r.bus.frequencyHz, 50.8, { abs: 1e-9 }, 'bus frequency (closed form)');
    expectClose(r.sets[0]!.kW, 600, { rel: 1e-12 }, 'A kW (closed form)');
    expectClose(r.sets[1]!.kW, 600, { rel: 1e-12 }, 'B kW (closed form)');
    expect(r.method).toBe('closed-form');
    // The bus frequency follows the droop line: 1800 kW → 52 − 1800/1000 = 50.2 Hz (closed form).
    expectClose(solveSharing(makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 1000, 4, 52)], load(1800))).bus.frequencyHz, 50.2, { abs: 1e-9 });
  });

  it('unequal sets with equal per-unit droop share in proportion to rating (closed form)', () => {
    // Closed form: 1000 + 500 kW, both 4 %, f_nl 62.4 Hz on 60 Hz, 1200 kW → 60.48 Hz, 800 / 400 kW.
    const r = solveSharing(makePlant([droopSet('A', 1000, 4, 62.4), droopSet('B', 500, 4, 62.4)], load(1200), { ratedFrequencyHz: 60 }));
    const k1 = 1000 / (0.04 * 60);
    const k2 = 500 / (0.04 * 60);
    expectClose(r.bus.frequencyHz, 62.4 - 1200 / (k1 + k2), { abs: 1e-9 }, 'f (recomputed closed form)');
    expectClose(r.bus.frequencyHz, 60.48, { abs: 1e-9 }, 'f (closed form)');
    expectClose(r.sets[0]!.kW, 800, { rel: 1e-12 }, 'A kW (closed form)');
    expectClose(r.sets[1]!.kW, 400, { rel: 1e-12 }, 'B kW (closed form)');
    expectClose(r.sets[0]!.sharingErrorKWPct, 0, { abs: 1e-9 }, 'A sharing error');
    expectClose(r.sets[0]!.loadingPct, 80, { rel: 1e-12 }, 'A loading %');
  });

  it('unequal droop: 3 % and 5 % with their own no-load settings (closed form)', () => {
    // Closed form: two 1000 kW sets, 3 % and 5 %, f_nl 61.8 and 63.0 Hz, 1500 kW → 60.5625 Hz, 687.5 / 812.5 kW.
    const r = solveSharing(makePlant([droopSet('A', 1000, 3, 61.8), droopSet('B', 1000, 5, 63)], load(1500), { ratedFrequencyHz: 60 }));
    expectClose(r.bus.frequencyHz, 60.5625, { abs: 1e-9 }, 'f');
    expectClose(r.sets[0]!.kW, 687.5, { rel: 1e-12 }, 'A kW');
    expectClose(r.sets[1]!.kW, 812.5, { rel: 1e-12 }, 'B kW');
    // Sharing error vs proportional (750 kW each): −62.5 kW = −6.25 % of rating, and +6.25 % (closed form).
    expectClose(r.sets[0]!.sharingErrorKWPct, -6.25, { abs: 1e-9 }, 'A sharing error %');
    expectClose(r.sets[1]!.sharingErrorKWPct, 6.25, { abs: 1e-9 }, 'B sharing error %');
  });

  it('a no-load setpoint mismatch skews the split by what the droop lines predict', () => {
    // Closed form: equal 1000 kW sets, 4 % on 50 Hz (k = 500 kW/Hz); f_nl 52.0 and 51.9 Hz; load 1000 kW.
    // f = (k·52 + k·51.9 − 1000) / 2k = 50.95 Hz; skew = k·Δf_nl / 2 = 25 kW each way.
    const r = solveSharing(makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 1000, 4, 51.9)], load(1000)));
    expectClose(r.bus.frequencyHz, 50.95, { abs: 1e-9 }, 'f');
    expectClose(r.sets[0]!.kW, 525, { rel: 1e-12 }, 'A kW');
    expectClose(r.sets[1]!.kW, 475, { rel: 1e-12 }, 'B kW');
  });

  it('Chapman, parallel operation example: 1 MW/Hz sets at 61.5 and 61.0 Hz', () => {
    // Chapman, Electric Machinery Fundamentals, parallel operation: 2.5 MW → 60 Hz, 1.5 / 1.0 MW;
    // +1 MW → 59.5 Hz, 2.0 / 1.5 MW; G2 raised 0.5 Hz → 59.75 Hz, 1.75 / 1.75 MW.
    const d = droopFor(3000, 1000, 60); // 3000 kW sets, slope 1 MW/Hz
    const plant = (f2: number, kW: number) => makePlant([droopSet('G1', 3000, d, 61.5), droopSet('G2', 3000, d, f2)], load(kW), { ratedFrequencyHz: 60 });
    let r = solveSharing(plant(61, 2500));
    expectClose(r.bus.frequencyHz, 60, { abs: 1e-9 }, 'f at 2.5 MW');
    expect(kw(r).map((v) => +v.toFixed(6))).toEqual([1500, 1000]);
    r = solveSharing(plant(61, 3500));
    expectClose(r.bus.frequencyHz, 59.5, { abs: 1e-9 }, 'f at 3.5 MW');
    expect(kw(r).map((v) => +v.toFixed(6))).toEqual([2000, 1500]);
    r = solveSharing(plant(61.5, 3500));
    expectClose(r.bus.frequencyHz, 59.75, { abs: 1e-9 }, 'f after raising G2');
    expect(kw(r).map((v) => +v.toFixed(6))).toEqual([1750, 1750]);
  });

  it('Chapman, single set: f_nl 61.0 Hz, 1 MW/Hz', () => {
    const d = droopFor(3000, 1000, 60);
    const one = (fnl: number, kW: number) => solveSharing(makePlant([droopSet('G', 3000, d, fnl)], load(kW), { ratedFrequencyHz: 60 })).bus.frequencyHz;
    expectClose(one(61, 1000), 60, { abs: 1e-9 }, '1000 kW → 60 Hz (Chapman)');
    expectClose(one(61, 1800), 59.2, { abs: 1e-9 }, '+800 kW → 59.2 Hz (Chapman)');
    expectClose(one(61.8, 1800), 60, { abs: 1e-9 }, 'f_nl 61.8 Hz restores 60 Hz (Chapman)');
  });

  it('three sets P = 50(50 − f), 100(51 − f), 150(52 − f) MW, 700 MW', () => {
    // Three droop lines (closed form): 49 Hz; 50 / 200 / 450 MW. 10 % droop keeps every set inside its rating.
    const sets = [droopSet('G1', 250_000, 10, 50), droopSet('G2', 500_000, 10, 51), droopSet('G3', 750_000, 10, 52)];
    const r = solveSharing(makePlant(sets, load(700_000)));
    expectClose(r.bus.frequencyHz, 49, { abs: 1e-9 }, 'f');
    expectClose(r.sets[0]!.kW, 50_000, { rel: 1e-12 }, 'G1');
    expectClose(r.sets[1]!.kW, 200_000, { rel: 1e-12 }, 'G2');
    expectClose(r.sets[2]!.kW, 450_000, { rel: 1e-12 }, 'G3');
  });

  it('Glover, Sarma & Overbye, Example 12.4: 200 MW step on 1000/750/500 MVA units, R = 0.05', () => {
    // Δf = −0.2667 Hz; ΔPm 88.9 / 66.7 / 44.4 MW. Droop R = 0.05 pu on the unit's own base = 5 %.
    const plant = (kW: number) =>
      makePlant([droopSet('U1', 1_000_000, 5, 63), droopSet('U2', 750_000, 5, 63), droopSet('U3', 500_000, 5, 63)], load(kW), { ratedFrequencyHz: 60 });
    const before = solveSharing(plant(1_125_000));
    const after = solveSharing(plant(1_325_000));
    expectClose(after.bus.frequencyHz - before.bus.frequencyHz, -0.2667, { abs: 5e-5 }, 'Δf (Glover 12.4)');
    expectClose(after.sets[0]!.kW - before.sets[0]!.kW, 88_900, { abs: 50 }, 'ΔP1 (Glover 12.4)');
    expectClose(after.sets[1]!.kW - before.sets[1]!.kW, 66_700, { abs: 50 }, 'ΔP2 (Glover 12.4)');
    expectClose(after.sets[2]!.kW - before.sets[2]!.kW, 44_400, { abs: 50 }, 'ΔP3 (Glover 12.4)');
  });

  it('Theraja, two 2000 kVA sets drooping 50→48 and 50→47.5 Hz', () => {
    // Theraja, A Textbook of Electrical Technology Vol. II: 3000 kW → 48.33 Hz, 1667 / 1333 kW; most load without overload 3600 kW.
    const s1 = rawSet('A', { ratedKW: 2000, ratedKVA: 2000, governor: { mode: 'droop', droopPct: 4, noLoadHz: 50 } });
    const s2 = rawSet('B', { ratedKW: 2000, ratedKVA: 2000, governor: { mode: 'droop', droopPct: 5, noLoadHz: 50 } });
    const r = solveSharing(makePlant([s1, s2], load(3000)));
    expectClose(r.bus.frequencyHz, 48.33, { abs: 0.005 }, 'f (Theraja)');
    expectClose(r.sets[0]!.kW, 1667, { abs: 0.5 }, 'A kW (Theraja)');
    expectClose(r.sets[1]!.kW, 1333, { abs: 0.5 }, 'B kW (Theraja)');
    const full = solveSharing(makePlant([s1, s2], load(3600)));
    expectClose(full.sets[0]!.kW, 2000, { rel: 1e-12 }, 'A at rating at 3600 kW (Theraja)');
    // At its rating A is neither overloaded nor at its fuel limit (the overload limit, 110 % = 2200 kW).
    expect(full.sets[0]!.flags).toEqual([]);
    // Beyond: 3700 kW → f = 50 − 3700 / (1000 + 800) kW/Hz = 47.944 Hz, A 2055.6 kW: in its overload range (closed form).
    const over = solveSharing(makePlant([s1, s2], load(3700)));
    expectClose(over.bus.frequencyHz, 50 - 3700 / 1800, { abs: 1e-9 }, 'f at 3700 kW (closed form)');
    expectClose(over.sets[0]!.kW, 1000 * (3700 / 1800), { rel: 1e-12 }, 'A kW at 3700 kW (closed form)');
    expect(over.sets[0]!.flags).toEqual(['overload-kW', 'overload-kVA']); // rated kVA = rated kW here
  });

  it('Chapman, three 10 MW sets with slopes 5, 5, 6 MW/Hz', () => {
    // 16 MW at 60 Hz: 5 / 5 / 6 MW; G3 reaches its limit first at 59.33 Hz (8.33 / 8.33 / 10 MW);
    // f_nl 62.0 / 62.0 / 61.67 Hz gives rated output at 60 Hz.
    const d5 = droopFor(10_000, 5000, 60);
    const d6 = droopFor(10_000, 6000, 60);
    const plant = (fnl: [number, number, number], kW: number) =>
      makePlant([droopSet('G1', 10_000, d5, fnl[0]), droopSet('G2', 10_000, d5, fnl[1]), droopSet('G3', 10_000, d6, fnl[2])], load(kW), {
        ratedFrequencyHz: 60,
      });
    let r = solveSharing(plant([61, 61, 61], 16_000));
    expectClose(r.bus.frequencyHz, 60, { abs: 1e-9 }, 'f at 16 MW');
    expect(kw(r).map((v) => +v.toFixed(6))).toEqual([5000, 5000, 6000]);
    r = solveSharing(plant([61, 61, 61], 16_000 * (61 - 59 - 1 / 3)));
    expectClose(r.bus.frequencyHz, 59.3333, { abs: 1e-4 }, 'f with G3 at limit (Chapman)');
    expectClose(r.sets[2]!.kW, 10_000, { rel: 1e-9 }, 'G3 at 10 MW');
    expectClose(r.sets[0]!.kW, 8333, { abs: 0.5 }, 'G1 8.33 MW (Chapman)');
    // At its rating, not at its fuel limit (110 % overload allowance).
    expect(r.sets[2]!.flags).not.toContain('at-max-kW');
    r = solveSharing(plant([62, 62, 61 + 2 / 3], 30_000));
    expectClose(r.bus.frequencyHz, 60, { abs: 1e-9 }, 'rated output at 60 Hz (Chapman)');
    for (const s of r.sets) expectClose(s.kW, 10_000, { rel: 1e-9 }, `${s.id} at rating`);
  });

  it('beyond its overload limit a droop set stays at its fuel limit and the others take the rest', () => {
    // Closed form: A 500 kW (4 %, f_nl 52.5 Hz, 250 kW/Hz) reaches its overload limit 550 kW (110 %) at
    // 52.5 − 550/250 = 50.3 Hz; B 1000 kW (52 Hz, 500 kW/Hz) then takes the rest: 52 − (1500 − 550)/500 = 50.1 Hz.
    const r = solveSharing(makePlant([droopSet('A', 500, 4, 52.5), droopSet('B', 1000, 4, 52)], load(1500)));
    expectClose(r.sets[0]!.kW, 550, { rel: 1e-12 }, 'A at its overload limit');
    expectClose(r.sets[1]!.kW, 950, { rel: 1e-12 }, 'B takes the rest');
    expectClose(r.bus.frequencyHz, 50.1, { abs: 1e-9 }, 'f');
    expect(r.sets[0]!.flags).toEqual(['overload-kW', 'at-max-kW']);
    expect(r.sets[0]!.notes[0]).toMatch(/A is at its governor's fuel limit, the overload limit of 550 kW \(110 % of 500 kW\)/);
  });

  it('two identical droop sets at 105 % of their total rating each carry 105 %, on the droop line, flagged overload-kW', () => {
    // Closed form: two 1000 kW sets, 4 % on 50 Hz, f_nl 52 Hz (k = 500 kW/Hz each); load 2100 kW (105 %):
    // each 1050 kW, f = 52 − 2100 / 1000 = 49.9 Hz (rated kW at 50 Hz, so 105 % sits 0.1 Hz below).
    const r = solveSharing(makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 1000, 4, 52)], load(2100)));
    const k = 1000 / (0.04 * 50);
    expectClose(r.bus.frequencyHz, 52 - 2100 / (2 * k), { abs: 1e-9 }, 'f (closed form)');
    expectClose(r.bus.frequencyHz, 49.9, { abs: 1e-9 }, 'f = 49.9 Hz (closed form)');
    for (const s of r.sets) {
      expectClose(s.kW, 1050, { rel: 1e-12 }, `${s.id} kW (closed form)`);
      expectClose(s.loadingPct, 105, { rel: 1e-12 }, `${s.id} loading %`);
      expect(s.flags).toEqual(['overload-kW']);
    }
    expect(r.warnings.join(' ')).toMatch(/A is in its overload range: 1050 kW of 1000 kW rated \(105 %.*ISO 8528-1, value from memory/);
  });

  it('a set whose speed setting is below the bus motors at zero fuel; the other carries the load plus its motoring power', () => {
    // Closed form: A 1000 kW, 4 %, f_nl 52 Hz (500 kW/Hz); B 500 kW, 4 %, f_nl 49 Hz (250 kW/Hz), motoring 25 %
    // (IEEE C37.102 typical for a four-stroke diesel, value from memory) = 125 kW. Load 600 kW: A alone gives
    // 600 kW at 52 − 600/500 = 50.8 Hz, above B's 49 Hz, so B is at zero fuel: −125 kW; A carries 725 kW at
    // f = 52 − 725/500 = 50.55 Hz.
    const plant = (trip: number) =>
      makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 500, 4, 49, { reversePowerTripPct: trip, reversePowerDelayS: 4 })], load(600));
    const r = solveSharing(plant(30));
    expectClose(r.sets[1]!.kW, -125, { rel: 1e-12 }, 'B at −motoring power (closed form)');
    expectClose(r.sets[0]!.kW, 725, { rel: 1e-12 }, 'A = load + B motoring power (closed form)');
    expectClose(r.bus.frequencyHz, 50.55, { abs: 1e-9 }, 'f (closed form)');
    expect(r.sets[1]!.flags).toEqual(['motoring', 'at-min-kW']);
    expect(r.sets[1]!.notes[0]).toMatch(/B is motoring: it absorbs 125 kW from the bus at zero fuel .*within its reverse-power setting of 30 % \(150 kW\)/);
    // 32 set at 10 % (50 kW): 125 kW is beyond it, flagged and said in words with the delay.
    const t = solveSharing(plant(10));
    expect(t.sets[1]!.flags).toEqual(['motoring', 'reverse-power', 'at-min-kW']);
    expect(t.sets[1]!.notes[0]).toBe(
      'B is motoring: it absorbs 125 kW (25.0 % of rating), beyond its reverse-power setting of 10 % (50 kW): the 32 relay would trip it after 4 s.',
    );
  });
});

describe('solveSharing: isochronous, base load, offline', () => {
  it('isochronous + droop (closed form): the droop set sits on its line at the iso setpoint', () => {
    // A isochronous 60 Hz, 1000 kW; B 500 kW, 5 %, f_nl 61.5 Hz → B 250 kW; load 900 kW → A 650 kW.
    const plant = (kW: number) => makePlant([isoSet('A', 1000, 60), droopSet('B', 500, 5, 61.5)], load(kW), { ratedFrequencyHz: 60 });
    const r = solveSharing(plant(900));
    expect(r.bus.frequencyHz).toBe(60);
    expectClose(r.sets[1]!.kW, 250, { rel: 1e-12 }, 'B kW');
    expectClose(r.sets[0]!.kW, 650, { rel: 1e-12 }, 'A kW');
    expect(r.warnings).toEqual([]);
  });

  it('isochronous saturation hands frequency to the droop set (closed form)', () => {
    // A standby-rated isochronous set (no overload allowance: overloadPct 100), 1000 kW; load 1400 kW →
    // A at 1000 kW, f = 61.5 − 400 / 166.7 = 59.10 Hz (closed form).
    const r = solveSharing(makePlant([isoSet('A', 1000, 60, { overloadPct: 100 }), droopSet('B', 500, 5, 61.5)], load(1400), { ratedFrequencyHz: 60 }));
    expectClose(r.sets[0]!.kW, 1000, { rel: 1e-12 }, 'A at max');
    expectClose(r.bus.frequencyHz, 61.5 - 400 / (500 / (0.05 * 60)), { abs: 1e-9 }, 'f (closed form)');
    expectClose(r.bus.frequencyHz, 59.1, { abs: 0.005 }, 'f 59.10 Hz (closed form)');
    expect(r.sets[0]!.flags).toContain('at-max-kW');
    expect(r.warnings[0]).toMatch(/isochronous set\(s\) A are at full output: frequency is now set by the droop sets/);
    // With the default 110 % allowance A holds 60 Hz up to 1100 + 250 = 1350 kW; at 1400 kW it is at
    // 1100 kW and B gives 300 kW at 61.5 − 300 / 166.67 = 59.7 Hz (closed form).
    const p = solveSharing(makePlant([isoSet('A', 1000, 60), droopSet('B', 500, 5, 61.5)], load(1400), { ratedFrequencyHz: 60 }));
    expectClose(p.sets[0]!.kW, 1100, { rel: 1e-12 }, 'A at its overload limit');
    expectClose(p.bus.frequencyHz, 61.5 - 300 / (500 / (0.05 * 60)), { abs: 1e-9 }, 'f (closed form)');
    expect(p.sets[0]!.flags).toEqual(['overload-kW', 'at-max-kW']);
  });

  it('an isochronous set at its minimum hands frequency to the droop sets when load is light', () => {
    // Closed form: B at 60 Hz gives 250 kW; load 200 kW would need A at −50 kW but minKW = 0 → A at 0,
    // B alone: f = 61.5 − 200 / 166.67 = 60.3 Hz.
    const r = solveSharing(makePlant([isoSet('A', 1000, 60), droopSet('B', 500, 5, 61.5)], load(200), { ratedFrequencyHz: 60 }));
    expectClose(r.sets[0]!.kW, 0, { abs: 1e-12 }, 'A at min');
    expectClose(r.bus.frequencyHz, 60.3, { abs: 1e-9 }, 'f');
    expect(r.sets[0]!.flags).toContain('at-min-kW');
    expect(r.warnings[0]).toMatch(/at minimum output/);
  });

  it('reverse power down to minKW: an isochronous set may motor to its limit, flagged', () => {
    // Closed form: A minKW −50 kW (trip 10 % of 1000 kW = 100 kW); load 220 kW, B gives 250 → A −30 kW at 60 Hz.
    const r = solveSharing(makePlant([isoSet('A', 1000, 60, { minKW: -50 }), droopSet('B', 500, 5, 61.5)], load(220), { ratedFrequencyHz: 60 }));
    expect(r.bus.frequencyHz).toBe(60);
    expectClose(r.sets[0]!.kW, -30, { rel: 1e-12 }, 'A kW');
    expect(r.sets[0]!.flags).toEqual(['motoring']);
    expect(r.warnings.join(' ')).toMatch(/A is motoring: it absorbs 30 kW from the bus, within its reverse-power setting of 10 % \(100 kW\)/);
    // minKW −200 kW (above zero fuel, −250 kW): load 100 kW → A −150 kW, beyond the 100 kW setting (closed form).
    const t = solveSharing(makePlant([isoSet('A', 1000, 60, { minKW: -200 }), droopSet('B', 500, 5, 61.5)], load(100), { ratedFrequencyHz: 60 }));
    expectClose(t.sets[0]!.kW, -150, { rel: 1e-12 }, 'A kW');
    expect(t.sets[0]!.flags).toEqual(['motoring', 'reverse-power']);
    expect(t.sets[0]!.notes[0]).toMatch(/the 32 relay would trip it after 3 s/);
  });

  it('several isochronous sets share in proportion to ratedKW (load-sharing link), with a droop set', () => {
    // Closed form: C (droop 500 kW, 4 %, f_nl 51 Hz) gives 250 kW at 50 Hz; 1750 − 250 = 1500 kW
    // split 1000 : 500 by rating → 1000 / 500 kW.
    const r = solveSharing(makePlant([isoSet('A', 1000, 50), isoSet('B', 500, 50), droopSet('C', 500, 4, 51)], load(1750)));
    expect(r.bus.frequencyHz).toBe(50);
    expectClose(r.sets[0]!.kW, 1000, { rel: 1e-12 }, 'A');
    expectClose(r.sets[1]!.kW, 500, { rel: 1e-12 }, 'B');
    expectClose(r.sets[2]!.kW, 250, { rel: 1e-12 }, 'C');
    // All isochronous, linked: 900 kW → 600 / 300 kW at 50 Hz.
    const all = solveSharing(makePlant([isoSet('A', 1000, 50), isoSet('B', 500, 50)], load(900)));
    expect(kw(all).map((v) => +v.toFixed(9))).toEqual([600, 300]);
  });

  it('base-load sets hold baseKW (clamped to their limits); offline sets carry nothing', () => {
    // Closed form: base 300 kW; A 1000 kW, 4 %, 52 Hz takes 1000 − 300 = 700 → f = 52 − 700/500 = 50.6 Hz.
    const base = rawSet('B', { governor: { mode: 'baseload', baseKW: 300 } });
    const off = droopSet('C', 1000, 4, 52, { online: false });
    const r = solveSharing(makePlant([droopSet('A', 1000, 4, 52), base, off], load(1000)));
    expectClose(r.sets[1]!.kW, 300, { rel: 1e-12 }, 'base kW');
    expectClose(r.bus.frequencyHz, 50.6, { abs: 1e-9 }, 'f');
    expect(r.sets[2]).toMatchObject({ id: 'C', online: false, kW: 0, kVAR: 0, currentA: 0, flags: ['offline'] });
    const capped = solveSharing(makePlant([droopSet('A', 1000, 4, 52), rawSet('B', { governor: { mode: 'baseload', baseKW: 5000 } })], load(1500)));
    expectClose(capped.sets[1]!.kW, 1100, { rel: 1e-12 }, 'base held at the overload limit (110 % of 1000 kW)');
    expect(capped.warnings).toContain("B's base-load setting (5000 kW) is outside what its governor can give (0 to 1100 kW): it runs at 1100 kW.");
  });

  it('frequency-dependent loads settle where droop line and load line meet', () => {
    // Closed form: k (f_nl − f) = P0 (1 + s (f − f_r)/f_r), k = 500 kW/Hz, f_nl 52, P0 1000 kW, s = 2:
    // f = (k f_nl − P0 + P0 s) / (k + P0 s / f_r) = (26000 − 1000 + 2000) / (500 + 40) = 50 Hz.
    const r = solveSharing(makePlant([droopSet('A', 1000, 4, 52)], load(1000, { frequencySensitivity: 2 })));
    const f = (500 * 52 - 1000 + 1000 * 2) / (500 + (1000 * 2) / 50);
    expectClose(r.bus.frequencyHz, f, { abs: 1e-9 }, 'f (closed form)');
    expectClose(r.totals.loadKW, 1000 * (1 + (2 * (f - 50)) / 50), { rel: 1e-12 }, 'load kW at f');
    expectClose(r.sets[0]!.kW, r.totals.loadKW, { rel: 1e-12 }, 'balance');
  });
});

describe('solveSharing: bus warnings', () => {
  it('warns when frequency or voltage sits more than 5 % from rated, not inside the usual droop band', () => {
    // Closed form: 10 % droop from 55 Hz at no load → 55 Hz (+10 %); 4 % droop from 52 Hz → 52 Hz (+4 %, quiet).
    const wide = solveSharing(makePlant([droopSet('A', 1000, 10, 55)], load(0)));
    expect(wide.warnings).toContain('Bus frequency 55.00 Hz is 10.0 % from rated (more than ±5 %).');
    expect(solveSharing(makePlant([droopSet('A', 1000, 4, 52)], load(0))).warnings).toEqual([]);
    // Reactive droop 4 % from 440 V (+10 %) at no reactive load.
    const hi = solveSharing(makePlant([droopSet('A', 1000, 4, 52, { regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 440 } })], load(100)));
    expect(hi.warnings).toContain('Bus voltage 440 V is 10.0 % from rated (more than ±5 %).');
  });
});

describe('solveSharing: no steady state', () => {
  const noSS = (fn: () => unknown, re: RegExp) => {
    let err: unknown;
    try {
      fn();
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(NoSteadyState);
    expect((err as Error).message).toMatch(re);
  };

  it('load beyond the sets capability', () => {
    // Overload limits 1100 + 550 = 1650 kW (110 %): 1700 kW is 50 kW short (closed form).
    noSS(
      () => solveSharing(makePlant([droopSet('A', 1000, 4, 52), droopSet('B', 500, 4, 52)], load(1700))),
      /^The load \(1700 kW\) is more than the online sets can supply at their overload limits \(1650 kW\): 50 kW short, so there is no steady state/,
    );
    noSS(() => solveSharing(makePlant([isoSet('A', 1000, 50)], load(1200))), /\(1100 kW\): 100 kW short/);
  });

  it('load below the sets minimum output', () => {
    // A may motor down to −250 kW (25 %): with B at 400 kW the plant cannot go below 150 kW; 100 kW is 50 kW too little.
    noSS(
      () => solveSharing(makePlant([droopSet('A', 1000, 4, 52), rawSet('B', { governor: { mode: 'baseload', baseKW: 400 } })], load(100))),
      /The load \(100 kW\) is less than the sets' lowest output \(150 kW, 50 kW too much\)/,
    );
  });

  it('isochronous sets without a load-sharing link', () => {
    noSS(
      () => solveSharing(makePlant([isoSet('A', 1000, 50, { governor: { mode: 'isochronous', loadSharingLink: false } }), isoSet('B', 1000, 50)], load(500))),
      /Sets A and B are isochronous without a common load-sharing link/,
    );
  });

  it('no frequency reference, no set online', () => {
    noSS(() => solveSharing(makePlant([rawSet('B', { governor: { mode: 'baseload', baseKW: 400 } })], load(400))), /No online set controls frequency/);
    noSS(() => solveSharing(makePlant([droopSet('A', 1000, 4, 52, { online: false })], load(400))), /No set is online/);
  });
});
