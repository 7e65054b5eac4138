/**
 * The model parameters a commissioning fit may change: each a field of one set, with its unit,
 * the widest bounds a fit accepts (the plant schema's plausible range or narrower) and a
 * default search range around typical values.
 */
import type { FitParameterKey, GenSet } from '../../../shared-types';
import { SET_DEFAULTS } from '../../../shared-types';
import { fieldCeiling } from '../simulation/excitation';

export interface FitParameterInfo {
  key: FitParameterKey;
  unit: string;
  /** Bounds no fit may pass (physical sense, within the plant schema). */
  lowest: number;
  highest: number;
  /** A default search range (typical engine sets; common practice, values from memory). */
  defaultMin: number;
  defaultMax: number;
}

/** Every fittable parameter, in a fixed order (the order the screens list them). */
export const FIT_PARAMETERS: readonly FitParameterInfo[] = [
  { key: 'governor.actuatorLagS', unit: 's', lowest: 0.005, highest: 5, defaultMin: 0.01, defaultMax: 0.5 },
  { key: 'governor.engineLagS', unit: 's', lowest: 0.005, highest: 10, defaultMin: 0.05, defaultMax: 2 },
  { key: 'governor.droopPct', unit: '%', lowest: 0.1, highest: 20, defaultMin: 1, defaultMax: 8 },
  { key: 'governor.isoResetS', unit: 's', lowest: 0.05, highest: 60, defaultMin: 0.2, defaultMax: 10 },
  { key: 'machine.inertiaS', unit: 's', lowest: 0.05, highest: 30, defaultMin: 0.3, defaultMax: 5 },
  { key: 'machine.dampingPU', unit: 'pu', lowest: 0, highest: 50, defaultMin: 0, defaultMax: 10 },
  { key: 'machine.tdopS', unit: 's', lowest: 0.1, highest: 20, defaultMin: 0.5, defaultMax: 8 },
  { key: 'regulator.gainPU', unit: 'pu', lowest: 0.5, highest: 1000, defaultMin: 5, defaultMax: 200 },
  { key: 'regulator.exciterLagS', unit: 's', lowest: 0.001, highest: 5, defaultMin: 0.01, defaultMax: 1 },
  { key: 'regulator.ceilingPU', unit: 'pu', lowest: 0.5, highest: 20, defaultMin: 1.2, defaultMax: 6 },
  { key: 'regulator.vhzKneeBelowHz', unit: 'Hz', lowest: 0, highest: 10, defaultMin: 0, defaultMax: 5 },
];

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
