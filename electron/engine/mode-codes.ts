/**
 * Small integer codes of governor and regulator modes, for the hot loops of the sharing solvers and the simulator
 * (one list for both; the modes themselves are `GOVERNOR_MODES` and `REGULATOR_MODES` in shared-types/plant.ts).
 */

export const GOV_DROOP = 0;
export const GOV_ISO = 1;
export const GOV_BASE = 2;

export const REG_DROOP = 0;
export const REG_CROSS = 1;
export const REG_VOLTAGE = 2;
export const REG_PF = 3;
