/**
 * Reading and writing the model parameters a commissioning fit may change (the catalogue,
 * `FIT_PARAMETERS`, lives in `shared-types/commissioning.ts` so the screens list it too).
 */
import type { FitParameterInfo, FitParameterKey, GenSet } from '../../../shared-types';
import { FIT_PARAMETERS, SET_DEFAULTS } from '../../../shared-types';
import { fieldCeiling } from '../simulation/excitation';

const BY_KEY = new Map(FIT_PARAMETERS.map((p) => [p.key, p]));

export function fitParameterInfo(key: FitParameterKey): FitParameterInfo | undefined {
  return BY_KEY.get(key);
}

/** The set's own value of a parameter (a left-out ceiling or knee as the simulator takes it). */
export function parameterValue(set: GenSet, key: FitParameterKey): number {
  switch (key) {
    case 'governor.actuatorLagS':
      return set.governor.actuatorLagS;
    case 'governor.engineLagS':
      return set.governor.engineLagS;
    case 'governor.droopPct':
      return set.governor.droopPct;
    case 'governor.isoResetS':
      return set.governor.isoResetS;
    case 'machine.inertiaS':
      return set.machine.inertiaS;
    case 'machine.dampingPU':
      return set.machine.dampingPU;
    case 'machine.tdopS':
      return set.machine.tdopS;
    case 'regulator.gainPU':
      return set.regulator.gainPU;
    case 'regulator.exciterLagS':
      return set.regulator.exciterLagS;
    case 'regulator.ceilingPU':
      return set.regulator.ceilingPU ?? fieldCeiling(set).ceilingPU;
    case 'regulator.vhzKneeBelowHz':
      return set.regulator.vhzKneeBelowHz ?? SET_DEFAULTS.vhzKneeBelowHz;
  }
}

/** A copy of `set` with the parameters set (the set itself is not touched). */
export function withParameters(set: GenSet, keys: readonly FitParameterKey[], values: ArrayLike<number>): GenSet {
  const s: GenSet = { ...set, governor: { ...set.governor }, regulator: { ...set.regulator }, machine: { ...set.machine } };
  keys.forEach((key, k) => {
    const v = values[k]!;
    const [part, field] = key.split('.') as ['governor' | 'machine' | 'regulator', string];
    (s[part] as unknown as Record<string, number>)[field] = v;
  });
  return s;
}
