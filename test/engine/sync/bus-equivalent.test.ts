import { describe, it, expect } from 'vitest';
import { busEquivalent, fictitiousROverX, incomingBranch, syncBasis } from '../../../electron/engine';
import type { Plant, SyncCase } from '../../../shared-types';
import { makePlant, rawSet } from '../../helpers/plants';
import { expectClose } from '../../helpers/expect-close';

function plantCase(plant: Plant, incomingSetId: string): SyncCase {
  const set = plant.sets.find((s) => s.id === incomingSetId)!;
  return {
    bus: { frequencyHz: 50, voltageV: 400 },
    incoming: { frequencyHz: 50.1, voltageV: 400, angleDeg: 0, ratedKVA: set.ratedKVA, xddpPU: set.machine.xddpPU },
    plant,
    incomingSetId,
    breakerClosingMs: 60,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
}

describe("busEquivalent from a plant (Thevenin of the online sets: X''d on a common base, plus feeders)", () => {
  it("puts two equal sets in parallel: X = X''d / 2, R = R_Gf / 2 (closed form)", () => {
    const plant = makePlant([rawSet('G1'), rawSet('G2'), rawSet('G3', { online: false })]);
    const c = plantCase(plant, 'G3');
    const b = busEquivalent(c, syncBasis(c));
    expect(b.from).toBe('plant');
    expect(b.setIds).toEqual(['G1', 'G2']);
    expectClose(b.xPU, 0.075, { rel: 1e-12 }, "X (schema default X''d 0.15 pu)");
    expectClose(b.rPU, 0.15 * 0.075, { rel: 1e-12 }, 'R = 0.15 X at 400 V (IEC 60909 R_Gf [memory])');
    // Short-circuit level at 1 pu: S / |Z|.
    expectClose(b.shortCircuitKVA!, 1250 / Math.hypot(0.075, 0.15 * 0.075), { rel: 1e-12 });
  });

  it('moves unequal sets to the incoming base (X × S_in / S_set) before paralleling', () => {
    const plant = makePlant([
      rawSet('A', { machine: { xddpPU: 0.15 } }),
      rawSet('B', { ratedKVA: 500, ratedKW: 400, machine: { xddpPU: 0.16 } }),
      rawSet('IN', { online: false }),
    ]);
    const c = plantCase(plant, 'IN');
    const b = busEquivalent(c, syncBasis(c));
    const x1 = 0.15;
    const x2 = 0.16 * (1250 / 500);
    expectClose(b.xPU, (x1 * x2) / (x1 + x2), { rel: 1e-12 });
  });

  it("adds each set's feeder in ohms on Z_base = V² / S (400 V, 1250 kVA: 0.128 Ω)", () => {
    const plant = makePlant([rawSet('G1', { feeder: { rOhm: 0, xOhm: 0.0128 } }), rawSet('G2', { online: false, feeder: { rOhm: 0.00128, xOhm: 0.0064 } })]);
    const c = plantCase(plant, 'G2');
    const basis = syncBasis(c);
    const b = busEquivalent(c, basis);
    expectClose(b.xPU, 0.15 + 0.1, { rel: 1e-12 });
    const inc = incomingBranch(c, basis);
    expectClose(inc.xPU, 0.15 + 0.05, { rel: 1e-12 });
    expectClose(inc.rPU, 0.15 * 0.15 + 0.01, { rel: 1e-12 });
  });

  it('leaves out the incoming set even when the plant marks it online', () => {
    const plant = makePlant([rawSet('G1'), rawSet('G2')]);
    const c = plantCase(plant, 'G2');
    expect(busEquivalent(c, syncBasis(c)).setIds).toEqual(['G1']);
  });

  it('refuses a plant with no other set online, naming the field', () => {
    const plant = makePlant([rawSet('G1', { online: false }), rawSet('G2')]);
    const c = plantCase(plant, 'G2');
    expect(() => busEquivalent(c, syncBasis(c))).toThrow(/^plant: no set other than G2 is online/);
  });

  it('refuses an unknown incoming set id', () => {
    const plant = makePlant([rawSet('G1'), rawSet('G2')]);
    const c = { ...plantCase(plant, 'G2'), incomingSetId: 'G9' };
    expect(() => incomingBranch(c, syncBasis(c))).toThrow('incomingSetId: "G9" is not a set of the plant (sets: G1, G2).');
  });
});

describe('fictitiousROverX', () => {
  it('is 0.15 at 1 kV or less and 0.07 above (IEC 60909-0 R_Gf, values from memory)', () => {
    expect(fictitiousROverX(400)).toBe(0.15);
    expect(fictitiousROverX(1000)).toBe(0.15);
    expect(fictitiousROverX(11000)).toBe(0.07);
  });
});
