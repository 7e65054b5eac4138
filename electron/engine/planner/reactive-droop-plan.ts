/**
 * Closed-form reactive-droop plan with feeders. A set in reactive droop holds its terminal at
 * `V_t = V_nl − droop · V_rated · Q / Qbase`; its feeder drops about `(R·P + X·Q) / V` more
 * (P, Q three-phase, R, X per phase, V line-to-line). Seen from the bus the set's line is
 * `V_bus = V_nl − R·P/V − Q · (droop · V_rated / Qbase + X / V)`: its slope is its reactive
 * droop plus its feeder's reactance. kVAR shares in proportion to kVA at every load only when
 * that slope times ratedKVA (the slope "per kVA") is the same for every set, so the planner
 * picks one slope per kVA σ and gives each set the droop `(σ / ratedKVA − X/V) · Qbase / V_rated`;
 * At the load's power factor each set's kW is a fixed multiple of its kVAR, so the feeder's
 * resistive drop `R·P/V` is folded into the slope too (skipped near unity power factor, where
 * it is left to the no-load trim). Then every set has the same no-load voltage, the one that
 * puts the bus at the band's centre in the middle of the range. Trimming no-load voltages
 * alone would balance one load point and leave the unequal slopes to spread the split apart
 * at every other.
 */
import type { Band, PlanLimits, Plant } from '../../../shared-types';
import { kVARBase } from '../../../shared-types';
import type { LoadPoint } from './load-points';
import { clamp, fmt } from './plan-limits';
import { overrunsBand, pickSlope, planByLaw, weightedDroop } from './plan-shape';
import type { PlanFound, PlanInput, PlanLaw } from './plan-shape';

/** What the planner chose for the regulators. */
export interface ReactivePlan {
  /** Indices (into `plant.sets`) of the sets whose regulator is planned. */
  planned: number[];
  /** Common slope per kVA, V per (kVAR per kVA). */
  slopePerKVA: number;
  /** Reactive droop of each planned set, % (same order as `planned`). */
  droopPct: number[];
  /** No-load voltage of each planned set, V. */
  noLoadV: number[];
  slopeFree: boolean;
  levelFree: boolean;
  /** Each planned set's feeder reactance seen as V per kVAR, and its bus slope per kVAR. */
  feeder: number[];
  reasons: string[];
  tradeoffs: string[];
  notes: string[];
}

/** V per kVAR of droop per unit droop fraction: `V_rated / Qbase`. */
function droopGain(plant: Plant, i: number): number {
  const s = plant.sets[i]!;
  return plant.ratedVoltageV / kVARBase(s.ratedKVA, s.ratedPF);
}

/** Below this tan φ of the load the resistive drop is not folded into the slope. */
const MIN_TAN_PHI = 0.05;

/**
 * Each set's feeder seen as V per kVAR of its own output when the sets share in proportion at
 * the load's power factor: reactance `X/V`, plus the resistive drop `R·P/V` carried over to
 * kVAR through `P_i / Q_i = (ratedKW_i / ΣratedKW) · (ΣratedKVA / ratedKVA_i) / tan φ`.
 */
export function feederVPerKVAR(plant: Plant, planned: readonly number[], tanPhi: number): number[] {
  const vr = plant.ratedVoltageV;
  let kwSum = 0;
  let kvaSum = 0;
  for (const s of plant.sets) if (s.online) kwSum += s.ratedKW;
  for (const i of planned) kvaSum += plant.sets[i]!.ratedKVA;
  return planned.map((i) => {
    const s = plant.sets[i]!;
    const x = (1000 * s.feeder.xOhm) / vr;
    if (tanPhi < MIN_TAN_PHI) return x;
    const kWPerKVAR = ((s.ratedKW / kwSum) * (kvaSum / s.ratedKVA)) / tanPhi;
    return x + ((1000 * s.feeder.rOhm) / vr) * kWPerKVAR;
  });
}

/** Reactive droop (%) that gives set `i` (feeder term `feeder`, V per kVAR) the bus slope per kVA `sigma`. */
export function droopForSlope(plant: Plant, i: number, feeder: number, sigma: number): number {
  return (100 * (sigma / plant.sets[i]!.ratedKVA - feeder)) / droopGain(plant, i);
}

/** Set `i`'s bus slope per kVA, V per (kVAR per kVA), at reactive droop `droopPct`. */
export function slopeForDroop(plant: Plant, i: number, feeder: number, droopPct: number): number {
  return plant.sets[i]!.ratedKVA * ((droopPct / 100) * droopGain(plant, i) + feeder);
}

type ReactiveField = 'reactiveDroopPct' | 'noLoadV';

/** The reactive-droop law's part of the plan: the regulators of the online reactive-droop sets. */
const REACTIVE_LAW: PlanLaw<ReactiveField, ReactivePlan> = {
  sort: (s) =>
    s.regulator.mode === 'reactive-droop'
      ? true
      : s.regulator.mode === 'power-factor'
        ? `${s.name} holds a power factor of ${fmt(s.regulator.pf, 2)}: it is left as it is.`
        : `${s.name} holds the voltage (${s.regulator.mode}): the regulators are left as they are.`,
  holds: (s) => s.regulator.mode === 'voltage' || s.regulator.mode === 'cross-current',
  none: ({ reasons, notes }) => ({
    planned: [],
    slopePerKVA: 0,
    droopPct: [],
    noLoadV: [],
    slopeFree: false,
    levelFree: false,
    feeder: [],
    reasons,
    tradeoffs: [],
    notes,
  }),
  solve: solveReactive,
};

/** Plans reactive droop and no-load voltage for the online reactive-droop sets. */
export function planReactiveDroop(
  plant: Plant,
  points: readonly LoadPoint[],
  band: Band,
  limits: PlanLimits,
  fixed: (i: number, field: ReactiveField) => boolean,
): ReactivePlan {
  return planByLaw({ plant, points, band, limits, fixed }, REACTIVE_LAW);
}

function solveReactive({ plant, points, band, limits, fixed }: PlanInput<ReactiveField>, { planned, reasons, notes }: PlanFound): ReactivePlan {
  const vr = plant.ratedVoltageV;
  let kvaSum = 0;
  for (const i of planned) kvaSum += plant.sets[i]!.ratedKVA;
  const last = points[points.length - 1]!;
  const tanPhi = last.load.kW > 0 ? last.load.kVAR / last.load.kW : 0;
  const feeder = feederVPerKVAR(plant, planned, tanPhi);
  // kVAR per kVA each planned set carries at each point when sharing in proportion.
  const q = points.map((p) => p.load.kVAR / kvaSum);
  const qLo = Math.min(...q);
  const qHi = Math.max(...q);
  const mid = points[Math.floor(points.length / 2)]!;
  const qMid = mid.load.kVAR / kvaSum;
  const width = band.max - band.min;

  const fixedDroop = planned.filter((i) => fixed(i, 'reactiveDroopPct'));
  const fixedLevel = planned.filter((i) => fixed(i, 'noLoadV'));
  if (fixedDroop.length > 1)
    notes.push('More than one set has its reactive droop fixed: the planner matches the first, so the others may not share kVAR in proportion.');

  // Preferred: the kVA-weighted mean reactive droop of today's settings, within the limits.
  const m0 = clamp(
    weightedDroop(
      planned,
      (i) => plant.sets[i]!.ratedKVA,
      (i) => plant.sets[i]!.regulator.droopPct,
    ),
    limits.reactiveDroopPct.min,
    limits.reactiveDroopPct.max,
  );
  // σ with that kVA-weighted mean droop: Σ S_i m_i(σ) = m0 Σ S_i, m_i linear in σ.
  let a = 0;
  let b = 0;
  planned.forEach((i, k) => {
    const s = plant.sets[i]!;
    a += 100 / droopGain(plant, i);
    b += (s.ratedKVA * 100 * feeder[k]!) / droopGain(plant, i);
  });
  const sigma0 = (m0 * kvaSum + b) / a;
  let sMin = 0;
  let sMax = Number.POSITIVE_INFINITY;
  planned.forEach((i, k) => {
    sMin = Math.max(sMin, slopeForDroop(plant, i, feeder[k]!, limits.reactiveDroopPct.min));
    sMax = Math.min(sMax, slopeForDroop(plant, i, feeder[k]!, limits.reactiveDroopPct.max));
  });
  const sBand = qHi > qLo ? width / (qHi - qLo) : Number.POSITIVE_INFINITY;

  const f = fixedDroop[0];
  const sigma = pickSlope(
    f === undefined ? null : slopeForDroop(plant, f, feeder[planned.indexOf(f)]!, plant.sets[f]!.regulator.droopPct),
    sigma0,
    sMin,
    Math.min(sMax, sBand),
    sMin,
  );

  const droopPct = planned.map((i, k) => droopForSlope(plant, i, feeder[k]!, sigma));
  planned.forEach((i, k) => {
    const d = droopPct[k]!;
    const name = plant.sets[i]!.name;
    if (d < limits.reactiveDroopPct.min - 1e-9) {
      reasons.push(
        `${name} would need ${fmt(d, 2)} % reactive droop to match the others' slope at the bus (its feeder alone gives more), ${fmt(limits.reactiveDroopPct.min - d, 2)} % below the allowed minimum.`,
      );
    } else if (d > limits.reactiveDroopPct.max + 1e-9) {
      reasons.push(
        `${name} would need ${fmt(d, 2)} % reactive droop to match the others' slope at the bus, ${fmt(d - limits.reactiveDroopPct.max, 2)} % above the allowed maximum.`,
      );
    }
  });
  const swing = sigma * (qHi - qLo);
  if (overrunsBand(swing, width)) {
    reasons.push(
      `Voltage band: the smallest common slope the feeders and the droop limits allow swings the bus about ${fmt(swing, 1)} V over the load range, ${fmt(swing - width, 1)} V more than the ${fmt(width, 1)} V band allows.`,
    );
  }

  // No-load voltages: the bus at the middle point sits at the band's centre. Near unity power
  // factor the resistive drop is not in the slope, so each set adds its own there.
  const vMid = (band.min + band.max) / 2;
  let kwSum = 0;
  for (const s of plant.sets) if (s.online) kwSum += s.ratedKW;
  const noLoadV = planned.map((i) => {
    const s = plant.sets[i]!;
    const resistive = tanPhi < MIN_TAN_PHI ? (1000 * s.feeder.rOhm * mid.load.kW * s.ratedKW) / (kwSum * vr) : 0;
    return vMid + sigma * qMid + resistive;
  });
  if (fixedLevel.length > 0) {
    const k = planned.indexOf(fixedLevel[0]!);
    const shift = plant.sets[fixedLevel[0]!]!.regulator.noLoadV - noLoadV[k]!;
    for (let j = 0; j < noLoadV.length; j++) noLoadV[j]! += shift;
    if (fixedLevel.length > 1) notes.push('More than one set has its no-load voltage fixed: the planner keeps the first and trims the others around it.');
  }
  const vLo = (limits.noLoadVPct.min / 100) * vr;
  const vHi = (limits.noLoadVPct.max / 100) * vr;
  planned.forEach((i, k) => {
    const v = noLoadV[k]!;
    if (v < vLo || v > vHi)
      reasons.push(
        `${plant.sets[i]!.name}: no-load voltage ${fmt(v, 1)} V is outside the allowed ${fmt(vLo, 1)}–${fmt(vHi, 1)} V, by ${fmt(Math.max(vLo - v, v - vHi), 1)} V.`,
      );
  });
  const tradeoffs = [
    `Reactive droop chosen so every set shows the bus the same slope per kVA (${fmt((sigma / vr) * 100, 2)} % of rated voltage per kVAR-per-kVA), its own droop plus its feeder's drop: more slope holds the kVAR split steadier against voltage-setpoint error, less narrows the voltage swing (here about ${fmt(swing, 1)} V of the ${fmt(width, 1)} V band).`,
    `No-load voltages ${fixedLevel.length > 0 ? 'follow the fixed set' : 'centre the bus in the voltage band'}, each trimmed by its own kVAR sharing error at the middle of the range: a set with a higher no-load voltage takes more kVAR, so equal lines at the bus share in proportion.`,
  ];
  return {
    planned,
    slopePerKVA: sigma,
    droopPct,
    noLoadV,
    slopeFree: fixedDroop.length === 0,
    levelFree: fixedLevel.length === 0,
    feeder,
    reasons,
    tradeoffs,
    notes,
  };
}
