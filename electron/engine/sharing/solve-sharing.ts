/**
 * `solveSharing`: where a plant settles. Closed forms when no online set has a feeder
 * impedance; otherwise the small AC network is solved by Newton–Raphson.
 */
import type { LoadOverride, Plant, SharingResult } from '../../../shared-types';
import { solveClosedForm } from './closed-form';
import { solveNetwork } from './network-solve';
import { buildSharingModel } from './sharing-model';
import { buildSharingResult } from './sharing-result';

/**
 * Steady-state kW/kVAR split, bus frequency and voltage of `plant` (validated, defaults
 * filled). `load` replaces the plant's loads by one constant-power load (kW, kVAR).
 * Pure: `plant` is not touched.
 * @throws NoSteadyState when no operating point exists (overload, undefined split, no reference).
 * @throws Diverged when the network iteration fails to converge within its bound.
 */
export function solveSharing(plant: Plant, load?: LoadOverride): SharingResult {
  const m = buildSharingModel(plant, load);
  const closed = solveClosedForm(m);
  if (!m.hasFeeders) return buildSharingResult(plant, m, closed);
  const op = solveNetwork(m, {
    frequencyHz: closed.frequencyHz,
    voltageV: closed.busVoltageV,
    kW: closed.kW,
    kVAR: closed.kVAR,
    isoState: closed.isoState,
  });
  return buildSharingResult(plant, m, op);
}
