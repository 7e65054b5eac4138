/**
 * The shape every droop plan shares, whatever the law (speed droop on the governors, reactive droop on the
 * regulators): sort the online sets into those the law plans and those it leaves as they are (each with a note),
 * plan nothing while a set holds the quantity for the whole plant (isochronous, voltage, cross-current), prefer the
 * rating-weighted mean of today's droops, take a fixed setting where the user fixed one, else the preferred slope
 * within the interval the limits and the band allow, and say when the swing overruns the band. The law supplies the
 * sorting, the empty plan and the arithmetic of its own line (`speed-droop-plan.ts`, `reactive-droop-plan.ts`).
 */
import type { Band, GenSet, PlanLimits, Plant } from '../../../shared-types';
import type { LoadPoint } from './load-points';
import { clamp } from './plan-limits';

/** What a plan works from. */
export interface PlanInput<Field extends string> {
  plant: Plant;
  points: readonly LoadPoint[];
  band: Band;
  limits: PlanLimits;
  /** True when the user fixed `field` of set `i`. */
  fixed: (i: number, field: Field) => boolean;
}

/** The sets the law plans (indices into `plant.sets`), and the reasons and notes the plan gathers. */
export interface PlanFound {
  planned: number[];
  reasons: string[];
  notes: string[];
}

/** One droop law's part of the plan. */
export interface PlanLaw<Field extends string, Plan> {
  /** `true` when the law plans this online set, else the note that says why it is left as it is. */
  sort(s: GenSet): true | string;
  /** True for an online set that holds the quantity for the whole plant: nothing is then planned. */
  holds(s: GenSet): boolean;
  /** The plan that changes nothing. */
  none(found: PlanFound): Plan;
  /** The plan over the planned sets. */
  solve(input: PlanInput<Field>, found: PlanFound): Plan;
}

/** Plans the sets `law` governs: the one routine behind the speed-droop and the reactive-droop plans. */
export function planByLaw<Field extends string, Plan>(input: PlanInput<Field>, law: PlanLaw<Field, Plan>): Plan {
  const found: PlanFound = { planned: [], reasons: [], notes: [] };
  input.plant.sets.forEach((s, i) => {
    if (!s.online) return;
    const sorted = law.sort(s);
    if (sorted === true) found.planned.push(i);
    else found.notes.push(sorted);
  });
  if (found.planned.length === 0 || input.plant.sets.some((s) => s.online && law.holds(s))) return law.none(found);
  return law.solve(input, found);
}

/** Today's droop weighted by rating over the planned sets (`weight` the rating, `droop` the setting). */
export function weightedDroop(planned: readonly number[], weight: (i: number) => number, droop: (i: number) => number): number {
  let sum = 0;
  let weighted = 0;
  for (const i of planned) {
    sum += weight(i);
    weighted += weight(i) * droop(i);
  }
  return weighted / sum;
}

/** The fixed value where there is one, else `preferred` within [lo, hi], else (an empty interval) `otherwise`. */
export function pickSlope(fixed: number | null, preferred: number, lo: number, hi: number, otherwise: number): number {
  if (fixed !== null) return fixed;
  return lo <= hi ? clamp(preferred, lo, hi) : otherwise;
}

/** True when a swing overruns the band's width (beyond rounding). */
export function overrunsBand(swing: number, width: number): boolean {
  return swing > width * (1 + 1e-9);
}
