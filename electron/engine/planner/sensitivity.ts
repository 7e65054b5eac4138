/**
 * The sensitivity matrix: kW and kVAR each set gains per 0.1 Hz of speed-setpoint error and
 * per 1 % (of rated voltage) of voltage-setpoint error on any set, at the operating point.
 *
 * Closed form (sets in droop and reactive droop, no feeders, constant-power loads that do not
 * vary with frequency, no set at a limit): with slopes `k_i = ratedKW_i / (droop_i · f_rated)`
 * kW/Hz and `b_i = Qbase_i / (droop_i · V_rated)` kVAR/V, a step Δf0 on set j moves the bus by
 * `k_j / Σk · Δf0` and set i by `k_i (δ_ij − k_j / Σk) Δf0`; the same with b for voltage.
 * Otherwise central finite differences of `solveSharing` (the solver's Jacobian).
 */
import type { LoadOverride, Plant, SensitivityEntry, SensitivityResult, SharingResult } from '../../../shared-types';
import { kVARBase, reactiveDroopKVARPerV, speedDroopKWPerHz } from '../../../shared-types';
import { solveSharing } from '../sharing';
import { nudgeSpeed, nudgeVoltage, workingSet } from './setpoint-knobs';

/** The speed-setpoint error the matrix is quoted per, Hz. */
export const SPEED_STEP_HZ = 0.1;
/** The voltage-setpoint error the matrix is quoted per, % of rated voltage. */
export const VOLTAGE_STEP_PCT = 1;
/** Half-steps of the central differences (a tenth of the quoted steps). */
const FD_FRACTION = 0.1;

const zeros = (n: number) => Array.from({ length: n }, () => new Array<number>(n).fill(0));

function closedFormApplies(plant: Plant, base: SharingResult, load?: LoadOverride): boolean {
  for (const s of plant.sets) {
    if (!s.online) continue;
    if (s.governor.mode !== 'droop' || s.regulator.mode !== 'reactive-droop') return false;
    if (s.feeder.rOhm !== 0 || s.feeder.xOhm !== 0) return false;
  }
  if (!load && plant.loads.some((l) => l.online && (l.model !== 'constant-power' || l.frequencySensitivity !== 0 || (l.kVARFrequencySensitivity ?? 0) !== 0)))
    return false;
  return base.sets.every((r) => !r.flags.includes('at-max-kW') && !r.flags.includes('at-min-kW'));
}

function closedForm(plant: Plant): Omit<SensitivityResult, 'largest' | 'setIds' | 'method'> {
  const n = plant.sets.length;
  const k = plant.sets.map((s) => (s.online ? speedDroopKWPerHz(s.ratedKW, s.governor.droopPct, plant.ratedFrequencyHz) : 0));
  const b = plant.sets.map((s) => (s.online ? reactiveDroopKVARPerV(kVARBase(s.ratedKVA, s.ratedPF), s.regulator.droopPct, plant.ratedVoltageV) : 0));
  const K = k.reduce((x, y) => x + y, 0);
  const B = b.reduce((x, y) => x + y, 0);
  const dV = (VOLTAGE_STEP_PCT / 100) * plant.ratedVoltageV;
  const kWPerSpeed = zeros(n);
  const kVARPerVoltage = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (!plant.sets[j]!.online) continue;
      kWPerSpeed[i]![j] = k[i]! * ((i === j ? 1 : 0) - k[j]! / K) * SPEED_STEP_HZ;
      kVARPerVoltage[i]![j] = b[i]! * ((i === j ? 1 : 0) - b[j]! / B) * dV;
    }
  }
  return {
    kWPerSpeed,
    kVARPerSpeed: zeros(n),
    kWPerVoltage: zeros(n),
    kVARPerVoltage,
    busHzPerSpeed: k.map((kj) => (kj / K) * SPEED_STEP_HZ),
    busVPerVoltage: b.map((bj) => (bj / B) * dV),
  };
}

/** Central differences of `solveSharing` for every set's speed and voltage setpoint. */
export function finiteDifferenceSensitivity(plant: Plant, load?: LoadOverride): Omit<SensitivityResult, 'largest' | 'setIds' | 'method'> {
  const n = plant.sets.length;
  const work: Plant = { ...plant, sets: plant.sets.map(workingSet) };
  const out = {
    kWPerSpeed: zeros(n),
    kVARPerSpeed: zeros(n),
    kWPerVoltage: zeros(n),
    kVARPerVoltage: zeros(n),
    busHzPerSpeed: new Array<number>(n).fill(0),
    busVPerVoltage: new Array<number>(n).fill(0),
  };
  const dV = (VOLTAGE_STEP_PCT / 100) * plant.ratedVoltageV;
  const steps = [
    {
      step: SPEED_STEP_HZ,
      nudge: nudgeSpeed,
      kW: out.kWPerSpeed,
      kVAR: out.kVARPerSpeed,
      bus: out.busHzPerSpeed,
      busOf: (r: SharingResult) => r.bus.frequencyHz,
    },
    { step: dV, nudge: nudgeVoltage, kW: out.kWPerVoltage, kVAR: out.kVARPerVoltage, bus: out.busVPerVoltage, busOf: (r: SharingResult) => r.bus.voltageV },
  ];
  for (const c of steps) {
    const h = c.step * FD_FRACTION;
    for (let j = 0; j < n; j++) {
      const s = work.sets[j]!;
      if (!s.online) continue;
      if (!c.nudge(s, h)) continue;
      const up = solveSharing(work, load);
      c.nudge(s, -2 * h);
      const down = solveSharing(work, load);
      c.nudge(s, h);
      const scale = c.step / (2 * h);
      for (let i = 0; i < n; i++) {
        c.kW[i]![j] = (up.sets[i]!.kW - down.sets[i]!.kW) * scale;
        c.kVAR[i]![j] = (up.sets[i]!.kVAR - down.sets[i]!.kVAR) * scale;
      }
      c.bus[j] = (c.busOf(up) - c.busOf(down)) * scale;
    }
  }
  return out;
}

/** The largest entries of each kind, biggest first: three kW and three kVAR. */
function rank(setIds: string[], m: Omit<SensitivityResult, 'largest' | 'setIds' | 'method'>): SensitivityEntry[] {
  const all: SensitivityEntry[] = [];
  const add = (cause: 'speed' | 'voltage', quantity: 'kW' | 'kVAR', mat: number[][]) =>
    mat.forEach((row, i) =>
      row.forEach((value, j) => {
        if (value !== 0) all.push({ cause, fromId: setIds[j]!, toId: setIds[i]!, quantity, value });
      }),
    );
  add('speed', 'kW', m.kWPerSpeed);
  add('voltage', 'kW', m.kWPerVoltage);
  add('speed', 'kVAR', m.kVARPerSpeed);
  add('voltage', 'kVAR', m.kVARPerVoltage);
  const top = (q: 'kW' | 'kVAR') =>
    all
      .filter((e) => e.quantity === q)
      .sort((a, b) => Math.abs(b.value) - Math.abs(a.value))
      .slice(0, 3);
  return [...top('kW'), ...top('kVAR')];
}

/**
 * kW and kVAR each set gains per +0.1 Hz of any set's speed setpoint and per +1 % of any set's
 * voltage setpoint, at the operating point of `plant` (with `load` if given). Pure.
 * @throws NoSteadyState / Diverged from the solver when the plant has no operating point.
 */
export function sharingSensitivity(plant: Plant, load?: LoadOverride): SensitivityResult {
  const base = solveSharing(plant, load);
  const setIds = plant.sets.map((s) => s.id);
  const cf = closedFormApplies(plant, base, load);
  const m = cf ? closedForm(plant) : finiteDifferenceSensitivity(plant, load);
  return { setIds, ...m, method: cf ? 'closed-form' : 'finite-difference', largest: rank(setIds, m) };
}
