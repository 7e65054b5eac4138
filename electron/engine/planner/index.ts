/** The droop planner, sensitivity matrix and tolerance analysis. */
export { planDroop } from './plan-droop';
export { PLAN_LIMITS } from './plan-limits';
export { PLAN_CHECK_FRACTIONS } from './load-points';
