/**
 * The running bus seen from the incoming breaker, as a Thevenin impedance on the incoming set's kVA base: the
 * plant's online sets (X''d each, on a common base) each behind its feeder, in parallel; or the case's
 * `busSource`; or an infinite (stiff) bus when neither is given. Also the incoming branch (X''d plus feeder).
 */
import type { BusEquivalent, GenSet, SyncCase } from '../../../shared-types';
import { InvalidInput } from '../errors';
import type { SyncBasis } from './sync-basis';

/**
 * IEC 60909-0's fictitious generator resistance as a fraction of X''d, used for the peak factor: 0.15 for
 * generators rated 1 kV or less, 0.07 above (rated below 100 MVA). Values recalled (IEC 60909-0, "generators",
 * R_Gf) — verify against the standard you hold.
 */
export function fictitiousROverX(voltageV: number): number {
  return voltageV <= 1000 ? 0.15 : 0.07;
}

/** Series impedance in pu (on the incoming set's base). */
export interface ImpedancePU {
  rPU: number;
  xPU: number;
}

/** A set's subtransient branch (X''d with R_Gf, plus its feeder) on the base `basis`. */
function setBranch(s: GenSet, basis: SyncBasis): ImpedancePU {
  const toBase = basis.incomingKVA / s.ratedKVA;
  const zBaseOhm = (basis.voltageV * basis.voltageV) / (basis.incomingKVA * 1000);
  const kR = fictitiousROverX(basis.voltageV);
  return {
    rPU: kR * s.machine.xddpPU * toBase + s.feeder.rOhm / zBaseOhm,
    xPU: s.machine.xddpPU * toBase + s.feeder.xOhm / zBaseOhm,
  };
}

/** Short-circuit kVA of an impedance at 1 pu voltage on the incoming base, or null for zero impedance. */
function shortCircuitKVA(z: ImpedancePU, basis: SyncBasis): number | null {
  const m = Math.hypot(z.rPU, z.xPU);
  return m > 0 ? basis.incomingKVA / m : null;
}

/**
 * The bus equivalent for `c` on the bases `basis`. With a plant: every online set except the incoming one,
 * in parallel (Z = 1 / Σ 1/Z_i, complex). With `busSource`: its X (and R, default R_Gf / X''d ratio) moved to
 * the incoming base by S_in / S_bus. Otherwise an infinite bus (zero impedance).
 * @throws InvalidInput when a plant is given but none of its other sets is online to form the bus.
 */
export function busEquivalent(c: SyncCase, basis: SyncBasis): BusEquivalent {
  if (c.plant) {
    const sets = c.plant.sets.filter((s) => s.online && s.id !== c.incomingSetId);
    if (sets.length === 0) {
      throw new InvalidInput(
        `plant: no set other than ${c.incomingSetId ?? 'the incoming one'} is online, so there is no running bus to synchronize to (for a dead-bus close give the bus as 0 V).`,
      );
    }
    let gRe = 0;
    let gIm = 0;
    for (const s of sets) {
      const z = setBranch(s, basis);
      const d = z.rPU * z.rPU + z.xPU * z.xPU;
      gRe += z.rPU / d;
      gIm -= z.xPU / d;
    }
    const d = gRe * gRe + gIm * gIm;
    const z = { rPU: gRe / d, xPU: -gIm / d };
    return { from: 'plant', ...z, shortCircuitKVA: shortCircuitKVA(z, basis), setIds: sets.map((s) => s.id) };
  }
  if (c.busSource) {
    const toBase = basis.incomingKVA / c.busSource.ratedKVA;
    const z = {
      rPU: (c.busSource.rPU ?? fictitiousROverX(basis.voltageV) * c.busSource.xPU) * toBase,
      xPU: c.busSource.xPU * toBase,
    };
    return { from: 'bus-source', ...z, shortCircuitKVA: shortCircuitKVA(z, basis), setIds: [] };
  }
  return { from: 'infinite', rPU: 0, xPU: 0, shortCircuitKVA: null, setIds: [] };
}

/**
 * The incoming branch on its own base: X''d with R_Gf, plus its feeder when it is a plant set.
 * @throws InvalidInput when `incomingSetId` names no set of the plant.
 */
export function incomingBranch(c: SyncCase, basis: SyncBasis): ImpedancePU {
  const kR = fictitiousROverX(basis.voltageV);
  if (c.plant && c.incomingSetId !== undefined) {
    const set = c.plant.sets.find((s) => s.id === c.incomingSetId);
    if (!set) throw new InvalidInput(`incomingSetId: "${c.incomingSetId}" is not a set of the plant (sets: ${c.plant.sets.map((s) => s.id).join(', ')}).`);
    const zBaseOhm = (basis.voltageV * basis.voltageV) / (basis.incomingKVA * 1000);
    return { rPU: kR * c.incoming.xddpPU + set.feeder.rOhm / zBaseOhm, xPU: c.incoming.xddpPU + set.feeder.xOhm / zBaseOhm };
  }
  return { rPU: kR * c.incoming.xddpPU, xPU: c.incoming.xddpPU };
}
