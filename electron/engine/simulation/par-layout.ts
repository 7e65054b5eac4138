/**
 * Column layout of the simulator's per-set parameters and status (`SimModel.par`): one
 * `Float64Array` of `PAR_COLUMNS × n`, column `k` holding one value per set in plant order at
 * `k·n + i`. The named fields of `SimModel` (`m.kwPU`, `m.online`, …) are views of these
 * columns, so events and set-up code keep using them, while the step's hot loops read the one
 * array with constant offsets (one array, no per-field look-up). Status flags and mode codes
 * are stored as 0/1 and the `codes.ts` numbers.
 */

export const P_RATED_KVA = 0;
export const P_KW_PU = 1;
export const P_Q_BASE_PU = 2;
export const P_INERTIA_S = 3;
export const P_DAMPING_PU = 4;
export const P_XD_PU = 5;
export const P_XD1_PU = 6;
export const P_XD2_PU = 7;
export const P_TD0_S = 8;
export const P_TD20_S = 9;
export const P_RESIDUAL_PU = 10;
export const P_Y_RE = 11;
export const P_Y_IM = 12;
export const P_ZF_RE = 13;
export const P_ZF_IM = 14;
export const P_GOV_MODE = 15;
export const P_ISO_LINKED = 16;
export const P_DROOP = 17;
export const P_NO_LOAD_PU = 18;
export const P_SETPOINT_PU = 19;
export const P_BASE_PU = 20;
export const P_MIN_PU = 21;
export const P_MAX_PU = 22;
export const P_ACTUATOR_S = 23;
export const P_ENGINE_S = 24;
export const P_RESET_S = 25;
export const P_RAMP_T0 = 26;
export const P_RAMP_T1 = 27;
export const P_RAMP_FROM = 28;
export const P_RAMP_TO = 29;
export const P_REVERSE_TRIP_PU = 30;
export const P_REVERSE_DELAY_S = 31;
export const P_MOTORING_PU = 32;
export const P_REG_MODE = 33;
export const P_REG_DROOP = 34;
export const P_NO_LOAD_VPU = 35;
export const P_SETPOINT_VPU = 36;
export const P_TAN_PHI = 37;
export const P_GAIN_PU = 38;
export const P_EXCITER_S = 39;
export const P_AVR_RESET_S = 40;
export const P_CEILING_PU = 41;
export const P_SHUNT = 42;
export const P_VHZ_KNEE_PU = 43;
export const P_VHZ_SLOPE_PU = 44;
export const P_OEL_PU = 45;
export const P_OEL_DELAY_S = 46;
export const P_OEL_ACTIVE = 47;
export const P_ONLINE = 48;
export const P_SHUTDOWN = 49;
export const P_INV2_H = 50;
export const P_INERTIA_KVA = 51;
export const P_OWN_SCALE = 52;
export const P_XD_MINUS_XD1 = 53;
export const P_XD1_MINUS_XD2 = 54;
export const P_INV_TD0 = 55;
export const P_INV_TD20 = 56;
export const P_INV_DROOP = 57;
export const P_INV_ACTUATOR_S = 58;
export const P_INV_ENGINE_S = 59;
export const P_INV_RESET_S = 60;
export const P_CROSS_GAIN = 61;
export const P_INV_AVR_RESET_S = 62;
export const P_INV_EXCITER_S = 63;
export const P_ISO_GAIN_PU = 64;
export const P_PF_TRIM_S = 65;
export const P_INV_PF_TRIM_S = 66;
export const P_OEL_RESET_S = 67;
export const P_REG_DROOP_PER_QBASE = 68;
/** Number of columns. */
export const PAR_COLUMNS = 69;

/** Column of each named per-set field of `SimModel`. */
export const PAR_FIELDS = {
  ratedKVA: P_RATED_KVA,
  kwPU: P_KW_PU,
  qBasePU: P_Q_BASE_PU,
  inertiaS: P_INERTIA_S,
  dampingPU: P_DAMPING_PU,
  xdPU: P_XD_PU,
  xd1PU: P_XD1_PU,
  xd2PU: P_XD2_PU,
  td0S: P_TD0_S,
  td20S: P_TD20_S,
  residualPU: P_RESIDUAL_PU,
  yRe: P_Y_RE,
  yIm: P_Y_IM,
  zfRe: P_ZF_RE,
  zfIm: P_ZF_IM,
  govMode: P_GOV_MODE,
  isoLinked: P_ISO_LINKED,
  droop: P_DROOP,
  noLoadPU: P_NO_LOAD_PU,
  setpointPU: P_SETPOINT_PU,
  basePU: P_BASE_PU,
  minPU: P_MIN_PU,
  maxPU: P_MAX_PU,
  actuatorS: P_ACTUATOR_S,
  engineS: P_ENGINE_S,
  resetS: P_RESET_S,
  rampT0: P_RAMP_T0,
  rampT1: P_RAMP_T1,
  rampFrom: P_RAMP_FROM,
  rampTo: P_RAMP_TO,
  reverseTripPU: P_REVERSE_TRIP_PU,
  reverseDelayS: P_REVERSE_DELAY_S,
  motoringPU: P_MOTORING_PU,
  regMode: P_REG_MODE,
  regDroop: P_REG_DROOP,
  noLoadVPU: P_NO_LOAD_VPU,
  setpointVPU: P_SETPOINT_VPU,
  tanPhi: P_TAN_PHI,
  gainPU: P_GAIN_PU,
  exciterS: P_EXCITER_S,
  avrResetS: P_AVR_RESET_S,
  ceilingPU: P_CEILING_PU,
  shunt: P_SHUNT,
  vhzKneePU: P_VHZ_KNEE_PU,
  vhzSlopePU: P_VHZ_SLOPE_PU,
  oelPU: P_OEL_PU,
  oelDelayS: P_OEL_DELAY_S,
  oelActive: P_OEL_ACTIVE,
  online: P_ONLINE,
  shutdown: P_SHUTDOWN,
  inv2H: P_INV2_H,
  inertiaKVA: P_INERTIA_KVA,
  ownScale: P_OWN_SCALE,
  xdMinusXd1: P_XD_MINUS_XD1,
  xd1MinusXd2: P_XD1_MINUS_XD2,
  invTd0: P_INV_TD0,
  invTd20: P_INV_TD20,
  invDroop: P_INV_DROOP,
  invActuatorS: P_INV_ACTUATOR_S,
  invEngineS: P_INV_ENGINE_S,
  invResetS: P_INV_RESET_S,
  crossGain: P_CROSS_GAIN,
  invAvrResetS: P_INV_AVR_RESET_S,
  invExciterS: P_INV_EXCITER_S,
  isoGainPU: P_ISO_GAIN_PU,
  pfTrimS: P_PF_TRIM_S,
  invPfTrimS: P_INV_PF_TRIM_S,
  oelResetS: P_OEL_RESET_S,
  regDroopPerQBase: P_REG_DROOP_PER_QBASE,
} as const;

/** A named per-set field of `SimModel`. */
export type ParField = keyof typeof PAR_FIELDS;

/**
 * Columns of `Outputs.buf` (`plant-dynamics.ts`) (each `n` long, value of set `i` at `k·n + i`); the named per-set
 * arrays of `Outputs` are views of them.
 */
export const O_E_RE = 0;
export const O_E_IM = 1;
export const O_SIN_D = 2;
export const O_COS_D = 3;
export const O_I_RE = 4;
export const O_I_IM = 5;
export const O_VT_RE = 6;
export const O_VT_IM = 7;
export const O_VT = 8;
export const O_P_OWN = 9;
export const O_Q_OWN = 10;
export const O_ID = 11;
export const O_IQ = 12;
export const O_V_SENSED = 13;
/** Anchor angle of each rotor's sine and cosine, and those (`rotor-trig.ts`). */
export const O_ANCHOR_D = 14;
export const O_ANCHOR_SIN = 15;
export const O_ANCHOR_COS = 16;
export const OUT_COLUMNS = 17;
