/**
 * Each set's characteristics as the droop charts draw them (see `SetCharacteristics` in shared-types/describe.ts):
 * the speed line (frequency against kW) and the voltage line (terminal voltage against kVAR), with their ends at the
 * set's limits. The laws are those of shared-types/laws.ts; the limits those of the steady state
 * (`sharing/set-limits.ts`, `capability.ts`). `describePlant` returns them per set, and the plan returns them for the
 * plant now and as proposed, so the renderer and the report map them to chart lines without computing anything.
 */
import type { GenSet, Plant, SetCharacteristics, SpeedCharacteristic, VoltageCharacteristic } from '../../shared-types';
import { kVARBase, reactiveDroopV, speedDroopHz, tanPhi } from '../../shared-types';
import { fieldLimitKVAR, leadingLimitKVAR } from './capability';
import { lowerLimitKW, overloadLimitKW } from './sharing/set-limits';

/**
 * The speed characteristic of `set`: from its lower limit (zero fuel, i.e. −motoring power, in droop; the lower of
 * 0 and `minKW` otherwise) to its overload (fuel) limit; base load holds `baseKW` at any frequency.
 */
export function speedDroopLine(set: GenSet, plant: Plant): SpeedCharacteristic {
  const g = set.governor;
  if (g.mode === 'baseload') return { kind: 'vertical', x: g.baseKW };
  const highKW = overloadLimitKW(set);
  const lowKW = g.mode === 'droop' ? lowerLimitKW(set) : Math.min(0, lowerLimitKW(set));
  if (g.mode === 'isochronous') {
    return {
      kind: 'segment',
      points: [
        { x: lowKW, y: g.setpointHz },
        { x: highKW, y: g.setpointHz },
      ],
    };
  }
  const f = (kW: number) => speedDroopHz(g.noLoadHz, g.droopPct, plant.ratedFrequencyHz, set.ratedKW, kW);
  return {
    kind: 'segment',
    points: [
      { x: lowKW, y: f(lowKW) },
      { x: highKW, y: f(highKW) },
    ],
  };
}

/** The kVAR span of a set's voltage characteristic: its leading (under-excitation) limit to its field-heating limit at zero kW. */
export function reactiveSpanKVAR(set: GenSet): [number, number] {
  return [leadingLimitKVAR(set), fieldLimitKVAR(set, 0)];
}

/**
 * The voltage characteristic of `set` over `reactiveSpanKVAR`: reactive droop on its reactive base; cross-current and
 * voltage control flat at `setpointV`; power-factor control holds `kVAR = kW tan φ`.
 */
export function reactiveDroopLine(set: GenSet, plant: Plant): VoltageCharacteristic {
  const r = set.regulator;
  if (r.mode === 'power-factor') return { kind: 'power-factor', pf: r.pf, kVARPerKW: tanPhi(r.pf) };
  const [fromKVAR, toKVAR] = reactiveSpanKVAR(set);
  if (r.mode !== 'reactive-droop') {
    return {
      kind: 'segment',
      points: [
        { x: fromKVAR, y: r.setpointV },
        { x: toKVAR, y: r.setpointV },
      ],
    };
  }
  const qBase = kVARBase(set.ratedKVA, set.ratedPF);
  const v = (q: number) => reactiveDroopV(r.noLoadV, r.droopPct, plant.ratedVoltageV, qBase, q);
  return {
    kind: 'segment',
    points: [
      { x: fromKVAR, y: v(fromKVAR) },
      { x: toKVAR, y: v(toKVAR) },
    ],
  };
}

/** Both characteristics of `set`. */
export function setCharacteristics(set: GenSet, plant: Plant): SetCharacteristics {
  return { speed: speedDroopLine(set, plant), voltage: reactiveDroopLine(set, plant) };
}
