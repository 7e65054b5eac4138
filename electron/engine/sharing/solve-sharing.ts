/**
 * `solveSharing`: where a plant settles. Closed forms when no online set has a feeder
 * impedance; otherwise the small AC network is solved by Newton–Raphson.
 */
import type { LoadOverride, Plant, SharingResult } from '../../../shared-types';
import { solveClosedForm } from './closed-form';
import { solveNetwork } from './network-solve';
import { buildSharingModel } from './sharing-model';
import type { SharingModel } from './sharing-model';
import { buildSharingResult } from './sharing-result';
import type { OperatingPoint } from './sharing-result';
import { Diverged, NoSteadyState } from '../errors';

/**
 * Steady-state kW/kVAR split, bus frequency and voltage of `plant` (validated, defaults
 * filled). `load` replaces the plant's loads by one constant-power load (kW, kVAR).
 * Pure: `plant` is not touched.
 * @throws NoSteadyState when no operating point exists (overload, undefined split, no reference).
 * @throws Diverged when the network iteration fails to converge within its bound.
 */
export function solveSharing(plant: Plant, load?: LoadOverride): SharingResult {
  const m = buildSharingModel(plant, load);
  try {
    return buildSharingResult(plant, m, solveModel(m));
  } catch (e) {
    if (!(e instanceof NoSteadyState || e instanceof Diverged)) throw e;
    // With every limited regulator held at its field-heating limit the reactive load may have
    // no home; solve again with the field limits not held and say so in the result.
    m.holdField = false;
    return buildSharingResult(plant, m, solveModel(m));
  }
}

function solveModel(m: SharingModel): OperatingPoint {
  const closed = solveClosedForm(m);
  if (!m.hasFeeders) return closed;
  return solveNetwork(m, {
    frequencyHz: closed.frequencyHz,
    voltageV: closed.busVoltageV,
    kW: closed.kW,
    kVAR: closed.kVAR,
    isoState: closed.isoState,
  });
}
