/**
 * `planDroop`: droop and no-load settings that share kW and kVAR in proportion across a load
 * range and keep the bus in the frequency and voltage bands — or the plain reason why not.
 * The closed forms (`speed-droop-plan.ts`, `reactive-droop-plan.ts`) give the settings; the
 * sharing solver then checks them at 0, 25, 50, 75 and 100 % of the range, and a few trims
 * from the solver's own figures take out what the closed forms leave (feeder losses, the
 * feeders' non-linear drop): the no-load frequency and voltages are re-centred in the bands,
 * and each no-load voltage is nudged by its set's kVAR sharing error at the middle point.
 */
import type { GenSet, PlanField, PlanRequest, PlanResult, PlanSetting, Plant } from '../../../shared-types';
import { setCharacteristics } from '../characteristics';
import { InvalidInput } from '../errors';
import { planLoadPoints } from './load-points';
import { checkPlan, extent, judgeBand } from './plan-check';
import { planLimits } from './plan-limits';
import { droopForSlope, planReactiveDroop, slopeForDroop } from './reactive-droop-plan';
import { planSpeedDroop } from './speed-droop-plan';

/** Solver-driven trims after the closed forms. */
const TRIM_ROUNDS = 6;

function copyPlant(plant: Plant): Plant {
  return {
    ...plant,
    sets: plant.sets.map((s) => ({ ...s, governor: { ...s.governor }, regulator: { ...s.regulator } })),
    loads: plant.loads.map((l) => ({ ...l })),
  };
}

/** Plans the droop settings of `request.plant`. Pure. */
export function planDroop(request: PlanRequest): PlanResult {
  const { plant, frequencyBandHz: fBand, voltageBandV: vBand } = request;
  const range = request.loadRangePct ?? { min: 0, max: 100 };
  const pf = request.pf ?? 0.8;
  const limits = planLimits(request.limits);
  const fixedFields = new Map<string, Set<PlanField>>();
  for (const f of request.fixed ?? []) {
    if (!plant.sets.some((s) => s.id === f.setId)) throw new InvalidInput(`fixed: there is no set "${f.setId}" in the plant.`);
    fixedFields.set(f.setId, new Set([...(fixedFields.get(f.setId) ?? []), ...f.fields]));
  }
  const isFixed = (i: number, field: PlanField) => fixedFields.get(plant.sets[i]!.id)?.has(field) ?? false;
  if (!plant.sets.some((s) => s.online)) throw new InvalidInput('plant.sets: no set is online, so there is nothing to plan.');

  const points = planLoadPoints(plant, range, pf);
  const speed = planSpeedDroop(plant, points, fBand, limits, isFixed);
  const reactive = planReactiveDroop(plant, points, vBand, limits, isFixed);

  const proposal = copyPlant(plant);
  let droopPct = speed.droopPct;
  let noLoadHz = speed.noLoadHz;
  let sigma = reactive.slopePerKVA;
  const noLoadV = [...reactive.noLoadV];
  const apply = () => {
    for (const i of speed.planned) {
      const g = proposal.sets[i]!.governor;
      if (!isFixed(i, 'droopPct')) g.droopPct = droopPct;
      if (!isFixed(i, 'noLoadHz')) g.noLoadHz = noLoadHz;
    }
    reactive.planned.forEach((i, k) => {
      const r = proposal.sets[i]!.regulator;
      if (!isFixed(i, 'reactiveDroopPct')) r.droopPct = droopForSlope(plant, i, reactive.feeder[k]!, sigma);
      if (!isFixed(i, 'noLoadV')) r.noLoadV = noLoadV[k]!;
    });
  };
  apply();

  let check = checkPlan(proposal, points);
  for (let round = 0; round < TRIM_ROUNDS; round++) {
    if (check.points.some((p) => p.error !== undefined)) break;
    const f = extent(check.points.map((p) => p.frequencyHz))!;
    const v = extent(check.points.map((p) => p.voltageV))!;
    if (speed.planned.length > 0) {
      const width = fBand.max - fBand.min;
      if (speed.droopFree && f.hi - f.lo > width * (1 + 1e-9)) {
        droopPct = Math.max(limits.speedDroopPct.min, (droopPct * 0.98 * width) / (f.hi - f.lo));
      }
      if (speed.noLoadFree) noLoadHz += (fBand.min + fBand.max) / 2 - (f.lo + f.hi) / 2;
    }
    if (reactive.planned.length > 0) {
      const width = vBand.max - vBand.min;
      if (reactive.slopeFree && v.hi - v.lo > width * (1 + 1e-9)) {
        let sMin = 0;
        reactive.planned.forEach((i, k) => (sMin = Math.max(sMin, slopeForDroop(plant, i, reactive.feeder[k]!, limits.reactiveDroopPct.min))));
        sigma = Math.max(sMin, (sigma * 0.98 * width) / (v.hi - v.lo));
      }
      // Nudge each no-load voltage by its kVAR sharing error at the middle point.
      const mid = check.points[Math.floor(check.points.length / 2)]!;
      let qSum = 0;
      let kvaSum = 0;
      for (const i of reactive.planned) {
        qSum += mid.setKVAR[i]!;
        kvaSum += plant.sets[i]!.ratedKVA;
      }
      const trims = reactive.planned.map((i) => {
        const s = plant.sets[i]!;
        const excess = mid.setKVAR[i]! - (qSum * s.ratedKVA) / kvaSum;
        return isFixed(i, 'noLoadV') ? 0 : -excess * (sigma / s.ratedKVA);
      });
      const centre = reactive.levelFree ? (vBand.min + vBand.max) / 2 - (v.lo + v.hi) / 2 : 0;
      reactive.planned.forEach((i, k) => {
        if (!isFixed(i, 'noLoadV')) noLoadV[k]! += trims[k]! + centre;
      });
    }
    apply();
    check = checkPlan(proposal, points);
  }

  const bands = [judgeBand('frequency', fBand, check), judgeBand('voltage', vBand, check)];
  const reasons = [...speed.reasons, ...reactive.reasons];
  for (const b of bands)
    if (!b.met && !reasons.some((r) => r.startsWith(b.quantity === 'frequency' ? 'Frequency band' : 'Voltage band'))) reasons.push(b.sentence);
  const settings: PlanSetting[] = proposal.sets.map((s: GenSet, i) => {
    const k = reactive.planned.indexOf(i);
    return {
      id: s.id,
      name: s.name,
      governorPlanned: speed.planned.includes(i),
      regulatorPlanned: k >= 0,
      droopPct: s.governor.droopPct,
      noLoadHz: s.governor.noLoadHz,
      reactiveDroopPct: s.regulator.droopPct,
      noLoadV: s.regulator.noLoadV,
      busSlopeVPerKVARPerKVA: k >= 0 ? slopeForDroop(plant, i, reactive.feeder[k]!, s.regulator.droopPct) : null,
    };
  });
  return {
    feasible: reasons.length === 0 && bands.every((b) => b.met),
    plant: proposal,
    settings,
    current: checkPlan(plant, points),
    proposal: check,
    bands,
    reasons,
    tradeoffs: [...speed.tradeoffs, ...reactive.tradeoffs],
    notes: [...speed.notes, ...reactive.notes],
    setIds: plant.sets.map((s) => s.id),
    characteristics: {
      current: plant.sets.map((s) => setCharacteristics(s, plant)),
      proposal: proposal.sets.map((s) => setCharacteristics(s, proposal)),
    },
  };
}
