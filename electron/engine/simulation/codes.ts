/** Small integer codes of governor and regulator modes, for the simulator's hot loops. */

export const GOV_DROOP = 0;
export const GOV_ISO = 1;
export const GOV_BASE = 2;

export const REG_DROOP = 0;
export const REG_CROSS = 1;
export const REG_VOLTAGE = 2;
export const REG_PF = 3;
