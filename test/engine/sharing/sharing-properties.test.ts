import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { EngineError, solveSharing } from '../../../electron/engine';
import { plantSchema } from '../../../electron/handlers';
import type { Plant, SharingResult } from '../../../shared-types';

// Plants are generated raw and passed through the plant schema, so every plant tested is one a
// user could load. Invariants (conservation laws and the definitions in the README): power balance, circulating currents summing to zero,
// order independence, droop frequency falling with load, and never a NaN.

// `wide` spans the schema's whole plausible range (setpoints within 50 % of rated); a plant the schema refuses is
// filtered out, so the ranges must stay mostly valid or the generator would search for a long time.
const set = (i: number, wide: boolean) =>
  fc
    .record({
      online: fc.oneof({ weight: 5, arbitrary: fc.constant(true) }, { weight: 1, arbitrary: fc.constant(false) }),
      ratedKW: wide ? fc.double({ min: 1, max: 1e6, noNaN: true }) : fc.double({ min: 50, max: 3000, noNaN: true }),
      pfRated: fc.double({ min: 0.5, max: 0.95, noNaN: true }),
      kvaOver: fc.double({ min: 1, max: 1.5, noNaN: true }),
      gov: fc.constantFrom('droop', 'droop', 'droop', 'isochronous', 'baseload'),
      govDroop: wide ? fc.double({ min: 0.01, max: 20, noNaN: true }) : fc.double({ min: 2, max: 6, noNaN: true }),
      noLoadHz: wide ? fc.double({ min: 25, max: 75, noNaN: true }) : fc.double({ min: 50.5, max: 53, noNaN: true }),
      setpointHz: wide ? fc.double({ min: 25, max: 75, noNaN: true }) : fc.double({ min: 49.8, max: 50.2, noNaN: true }),
      basePu: fc.double({ min: -0.2, max: 1.2, noNaN: true }),
      link: fc.oneof({ weight: 6, arbitrary: fc.constant(true) }, { weight: 1, arbitrary: fc.constant(false) }),
      reg: fc.constantFrom('reactive-droop', 'reactive-droop', 'reactive-droop', 'cross-current', 'voltage', 'power-factor'),
      regDroop: wide ? fc.double({ min: 0.01, max: 20, noNaN: true }) : fc.double({ min: 2, max: 6, noNaN: true }),
      noLoadV: wide ? fc.double({ min: 200, max: 600, noNaN: true }) : fc.double({ min: 400, max: 425, noNaN: true }),
      setpointV: wide ? fc.double({ min: 200, max: 600, noNaN: true }) : fc.double({ min: 395, max: 405, noNaN: true }),
      pf: fc.double({ min: 0.5, max: 1, noNaN: true }),
      minPu: fc.double({ min: -0.1, max: 0.05, noNaN: true }),
      feeder: fc.oneof(
        fc.constant({ rOhm: 0, xOhm: 0 }),
        fc.record({ rOhm: fc.double({ min: 0, max: wide ? 1 : 0.01, noNaN: true }), xOhm: fc.double({ min: 0, max: wide ? 1 : 0.01, noNaN: true }) }),
      ),
    })
    .map((s) => ({
      id: `S${i}`,
      online: s.online,
      ratedKW: s.ratedKW,
      ratedKVA: s.ratedKW * s.kvaOver,
      ratedPF: s.pfRated,
      minKW: s.minPu * s.ratedKW,
      reversePowerTripPct: 10,
      governor: { mode: s.gov, droopPct: s.govDroop, noLoadHz: s.noLoadHz, setpointHz: s.setpointHz, baseKW: s.basePu * s.ratedKW, loadSharingLink: s.link },
      regulator: { mode: s.reg, droopPct: s.regDroop, noLoadV: s.noLoadV, setpointV: s.setpointV, pf: s.pf },
      feeder: s.feeder,
    }));

const loadArb = (i: number, wide: boolean) =>
  fc
    .record({
      kW: fc.double({ min: 0, max: wide ? 2e6 : 3000, noNaN: true }),
      q: fc.double({ min: -0.3, max: 1, noNaN: true }),
      model: fc.constantFrom('constant-power', 'constant-impedance'),
      s: fc.double({ min: 0, max: wide ? 10 : 2, noNaN: true }),
    })
    .map((l) => ({ id: `L${i}`, kW: l.kW, kVAR: l.kW * l.q, model: l.model, frequencySensitivity: l.s }));

const plantArb = (wide = false) =>
  fc
    .integer({ min: 1, max: 6 })
    .chain((n) =>
      fc.tuple(
        fc.tuple(...Array.from({ length: n }, (_, i) => set(i, wide))),
        fc.integer({ min: 1, max: 3 }).chain((m) => fc.tuple(...Array.from({ length: m }, (_, i) => loadArb(i, wide)))),
      ),
    )
    .map(([sets, loads]) => plantSchema.safeParse({ format: 'droopline.plant', version: 1, name: 'p', ratedFrequencyHz: 50, ratedVoltageV: 400, sets, loads }))
    .filter((r) => r.success)
    .map((r) => r.data as Plant);

/** Solves, or returns the typed error; anything else (an untyped throw) fails the property. */
function attempt(plant: Plant, load?: { kW: number; kVAR: number }): SharingResult | EngineError {
  try {
    return solveSharing(plant, load);
  } catch (e) {
    if (e instanceof EngineError && (e.code === 'NO_STEADY_STATE' || e.code === 'DIVERGED') && e.message.length > 20) return e;
    throw e;
  }
}

function allFinite(v: unknown): boolean {
  if (typeof v === 'number') return Number.isFinite(v);
  if (Array.isArray(v)) return v.every(allFinite);
  if (v && typeof v === 'object') return Object.values(v).every(allFinite);
  return true;
}

const RUNS = 200;

describe('solveSharing invariants (fast-check)', () => {
  it('power balance: Σ kW = load + feeder losses (and Σ kVAR = load + feeder kVAR) to 1e-9 relative', () => {
    fc.assert(
      fc.property(plantArb(), (plant) => {
        const r = attempt(plant);
        if (r instanceof EngineError) return;
        // Relative to the power flowing: the largest of the load's and the sets' kVA.
        const scale = Math.max(
          1,
          Math.hypot(r.totals.loadKW, r.totals.loadKVAR),
          r.sets.reduce((a, s) => a + s.kVA, 0),
        );
        expect(Math.abs(r.totals.kW - r.totals.loadKW - r.totals.feederLossKW)).toBeLessThanOrEqual(1e-9 * scale);
        expect(Math.abs(r.totals.kVAR - r.totals.loadKVAR - r.totals.feederLossKVAR)).toBeLessThanOrEqual(1e-9 * scale);
      }),
      { numRuns: RUNS },
    );
  });

  it('circulating currents sum to zero', () => {
    fc.assert(
      fc.property(plantArb(), (plant) => {
        const r = attempt(plant);
        if (r instanceof EngineError) return;
        const sum = r.sets.reduce((a, s) => a + s.circulatingA, 0);
        const scale = Math.max(1, ...r.sets.map((s) => s.currentA));
        expect(Math.abs(sum)).toBeLessThanOrEqual(1e-9 * scale);
      }),
      { numRuns: RUNS },
    );
  });

  it('symmetry: the order of the sets does not change any set result; identical sets carry identical results', () => {
    fc.assert(
      fc.property(plantArb(), (plant) => {
        const twin = { ...plant.sets[0]!, id: 'twin', name: 'twin' };
        const p1: Plant = { ...plant, sets: [...plant.sets, twin] };
        const p2: Plant = { ...plant, sets: [twin, ...[...plant.sets].reverse()] };
        const a = attempt(p1);
        const b = attempt(p2);
        expect(a instanceof EngineError).toBe(b instanceof EngineError);
        if (a instanceof EngineError || b instanceof EngineError) return;
        for (const s of a.sets) {
          const t = b.sets.find((x) => x.id === s.id)!;
          expect(Math.abs(t.kW - s.kW)).toBeLessThanOrEqual(1e-7 * Math.max(1, Math.abs(s.kW), s.kVA));
          expect(Math.abs(t.kVAR - s.kVAR)).toBeLessThanOrEqual(1e-7 * Math.max(1, Math.abs(s.kVAR), s.kVA));
        }
        const s0 = a.sets[0]!;
        const tw = a.sets[a.sets.length - 1]!;
        expect(Math.abs(tw.kW - s0.kW)).toBeLessThanOrEqual(1e-7 * Math.max(1, s0.kVA));
        expect(Math.abs(tw.kVAR - s0.kVAR)).toBeLessThanOrEqual(1e-7 * Math.max(1, s0.kVA));
      }),
      { numRuns: 150 },
    );
  });

  it('monotonicity: more load never raises the frequency of a droop-governed bus', () => {
    fc.assert(
      fc.property(plantArb(), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (plant, u1, u2) => {
        const droopOnly: Plant = {
          ...plant,
          sets: plant.sets.map((s) =>
            s.governor.mode === 'isochronous' ? { ...s, governor: { ...s.governor, mode: 'droop' as const, droopPct: 4, noLoadHz: 52 } } : s,
          ),
        };
        const rated = droopOnly.sets.reduce((a, s) => a + (s.online ? s.ratedKW : 0), 0);
        const [lo, hi] = u1 <= u2 ? [u1, u2] : [u2, u1];
        const a = attempt(droopOnly, { kW: lo * rated, kVAR: 0.5 * lo * rated });
        const b = attempt(droopOnly, { kW: hi * rated, kVAR: 0.5 * hi * rated });
        if (a instanceof EngineError || b instanceof EngineError) return;
        expect(b.bus.frequencyHz).toBeLessThanOrEqual(a.bus.frequencyHz + 1e-9);
      }),
      { numRuns: RUNS },
    );
  });

  it('every load from 0 to the sets’ overload capability has an operating point (droop governors, no feeders); kW balance; no NaN', () => {
    // Between zero (each droop set can go down to −motoring power) and Σ overload limits the droop lines
    // always meet the load: "no steady state" there would be a solver fault.
    fc.assert(
      fc.property(plantArb(), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (plant, u, pfU) => {
        const droop: Plant = {
          ...plant,
          // Droop governors and reactive-droop regulators: a control structure with an answer at every load.
          sets: plant.sets.map((s) => ({
            ...s,
            feeder: { rOhm: 0, xOhm: 0 },
            governor: { ...s.governor, mode: 'droop' as const, droopPct: Math.max(1, s.governor.droopPct), noLoadHz: Math.max(50.5, s.governor.noLoadHz) },
            regulator: {
              ...s.regulator,
              mode: 'reactive-droop' as const,
              droopPct: Math.max(1, s.regulator.droopPct),
              noLoadV: Math.max(400, Math.min(440, s.regulator.noLoadV)),
            },
          })),
        };
        let capability = 0;
        for (const s of droop.sets) if (s.online) capability += (s.ratedKW * s.overloadPct) / 100;
        if (capability === 0) return;
        const kW = u * capability * (1 - 1e-9);
        const kVAR = kW * 0.75 * pfU; // lagging, PF from 1 down to 0.8
        const r = solveSharing(droop, { kW, kVAR });
        expect(Math.abs(r.totals.kW - kW)).toBeLessThanOrEqual(1e-9 * Math.max(1, capability));
        expect(allFinite(r)).toBe(true);
        for (const s of r.sets) if (s.online) expect(s.kW).toBeLessThanOrEqual((capability + 1) * 1.000001);
      }),
      { numRuns: RUNS },
    );
  });

  it('never NaN: any schema-valid plant gives finite numbers or a typed error with a sentence', () => {
    fc.assert(
      fc.property(plantArb(true), (plant) => {
        const r = attempt(plant);
        if (r instanceof EngineError) return;
        expect(allFinite(r)).toBe(true);
      }),
      { numRuns: 400 },
    );
  });
});
