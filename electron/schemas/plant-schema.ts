/**
 * The plant-file schema: the definition of a valid plant and the source of every
 * "field: rule" message. Optional simulator fields get documented defaults.
 */
import { z } from 'zod';
import { GOVERNOR_MODES, LOAD_MODELS, PLANT_DEFAULTS, PLANT_FORMAT, PLANT_VERSION, REGULATOR_MODES, SET_DEFAULTS } from '../../shared-types';
import type { Plant } from '../../shared-types';
import { between, flag, id, nonNegative, num, oneOf, positive, powerFactor, text, whole } from './schema-kit';

/*
 * Plausible bounds. They are wide enough for every real engine-driven set (a few kVA to a few tens of MVA,
 * low and medium voltage) and exist so that an extreme but finite number (5e-324 V, 1e308 kVA) is refused
 * with its rule instead of producing NaN or Infinity downstream. Ranges are common practice, chosen wide.
 */
/** Largest set rating accepted, kVA and kW (covers textbook examples of 1000 MW units as well). */
export const MAX_SET_RATING = 2_000_000;
/** Largest load accepted, kW and kVAR (magnitude). */
export const MAX_LOAD_KW = 10_000_000;
/** Largest feeder resistance or reactance accepted, Ω. */
export const MAX_FEEDER_OHM = 100;
/** Largest damping accepted, pu. */
export const MAX_DAMPING_PU = 500;
/** Setpoints (no-load and setpoint frequency and voltage) must lie within this fraction of rated. */
export const SETPOINT_FRACTION = 0.5;

const governorSchema = z
  .object({
    mode: oneOf(GOVERNOR_MODES),
    droopPct: nonNegative('%').lte(20, 'must be 20 % or less').default(4),
    noLoadHz: positive('Hz').optional(),
    setpointHz: positive('Hz').optional(),
    baseKW: between('kW', -MAX_SET_RATING, MAX_SET_RATING).default(0),
    loadSharingLink: flag().default(true),
    actuatorLagS: nonNegative('s').lte(10, 'must be 10 s or less').default(0.05),
    engineLagS: nonNegative('s').lte(30, 'must be 30 s or less').default(0.3),
    isoResetS: between('s', 0.01, 600).default(2),
    isoGainPU: between('pu', 0.01, 200).default(SET_DEFAULTS.isoGainPU),
  })
  .strict();

const regulatorSchema = z
  .object({
    mode: oneOf(REGULATOR_MODES),
    droopPct: nonNegative('%').lte(20, 'must be 20 % or less').default(4),
    noLoadV: positive('V').optional(),
    setpointV: positive('V').optional(),
    pf: powerFactor().default(0.9),
    exciterLagS: nonNegative('s').lte(10, 'must be 10 s or less').default(0.1),
    gainPU: between('pu', 0.01, 10_000).default(50),
    // Empty (null) or left out: derived from the machine data (`fieldCeiling`).
    ceilingPU: positive('pu').lte(20, 'must be 20 pu or less').nullish(),
    shuntExcited: flag().default(false),
    residualPU: nonNegative('pu').lte(0.5, 'must be 0.5 pu or less').default(0.03),
    vhzKneeBelowHz: nonNegative('Hz').lte(10, 'must be 10 Hz or less').default(SET_DEFAULTS.vhzKneeBelowHz),
    vhzSlopePctPerHz: nonNegative('% per Hz').lte(20, 'must be 20 % per Hz or less').default(SET_DEFAULTS.vhzSlopePctPerHz),
    oelPct: num('%')
      .refine((v) => v === 0 || (v >= 100 && v <= 200), 'must be 0 (off) or from 100 to 200 %')
      .default(SET_DEFAULTS.oelPct),
    oelDelayS: nonNegative('s').lte(120, 'must be 120 s or less').default(SET_DEFAULTS.oelDelayS),
    oelResetS: nonNegative('s').lte(600, 'must be 600 s or less').default(SET_DEFAULTS.oelResetS),
    resetS: between('s', 0.01, 60).default(SET_DEFAULTS.regulatorResetS),
    pfTrimS: between('s', 0.01, 120).default(SET_DEFAULTS.pfTrimS),
  })
  .strict();

const machineSchema = z
  .object({
    xdPU: between('pu', 0.1, 10).default(2.5),
    xdpPU: between('pu', 0.01, 5).default(0.25),
    xddpPU: between('pu', 0.01, 2).default(0.15),
    // Up to 10 000 s: a T'd0 far beyond the run freezes the field flux (the classical model).
    tdopS: between('s', 0.01, 10_000).default(2.5),
    inertiaS: between('s', 0.01, 60).default(1),
    dampingPU: nonNegative('pu').lte(MAX_DAMPING_PU, `must be ${MAX_DAMPING_PU} pu or less`).default(2),
    raPU: nonNegative('pu').lte(1, 'must be 1 pu or less').default(0.01),
    tddopS: between('s', 0.001, 0.5).default(SET_DEFAULTS.tddopS),
  })
  .strict();

const P = SET_DEFAULTS.protection;
const pickup = (lo: string, hi: number) => nonNegative('%').lte(hi, `must be ${hi} % or less (${lo})`);
const delay = () => nonNegative('s').lte(600, 'must be 600 s or less');
const protectionSchema = z
  .object({
    underFrequencyPct: pickup('0 switches it off', 100).default(P.underFrequencyPct),
    underFrequencyDelayS: delay().default(P.underFrequencyDelayS),
    overFrequencyPct: num('%')
      .refine((v) => v === 0 || (v >= 100 && v <= 150), 'must be 0 (off) or from 100 to 150 %')
      .default(P.overFrequencyPct),
    overFrequencyDelayS: delay().default(P.overFrequencyDelayS),
    underVoltagePct: pickup('0 switches it off', 100).default(P.underVoltagePct),
    underVoltageDelayS: delay().default(P.underVoltageDelayS),
    overVoltagePct: num('%')
      .refine((v) => v === 0 || (v >= 100 && v <= 200), 'must be 0 (off) or from 100 to 200 %')
      .default(P.overVoltagePct),
    overVoltageDelayS: delay().default(P.overVoltageDelayS),
  })
  .strict();

const feederOhm = () => nonNegative('Ω').lte(MAX_FEEDER_OHM, `must be ${MAX_FEEDER_OHM} Ω or less`).default(0);
const feederSchema = z.object({ rOhm: feederOhm(), xOhm: feederOhm() }).strict();

const setSchema = z
  .object({
    id: id(),
    name: text().optional(),
    online: flag().default(true),
    ratedKVA: positive('kVA').lte(MAX_SET_RATING, 'must be 2 000 000 kVA or less'),
    ratedKW: positive('kW').lte(MAX_SET_RATING, 'must be 2 000 000 kW or less'),
    ratedPF: num().gt(0, 'must be greater than 0').lt(1, 'must be less than 1').default(0.8),
    poles: whole().gte(2, 'must be 2 or more').multipleOf(2, 'must be even').default(4),
    minKW: between('kW', -MAX_SET_RATING, MAX_SET_RATING).default(0),
    reversePowerTripPct: nonNegative('%').lte(50, 'must be 50 % or less').default(10),
    reversePowerDelayS: nonNegative('s').lte(60, 'must be 60 s or less').default(SET_DEFAULTS.reversePowerDelayS),
    overloadPct: num('%').gte(100, 'must be 100 % or more').lte(150, 'must be 150 % or less').default(SET_DEFAULTS.overloadPct),
    motoringPct: nonNegative('%').lte(100, 'must be 100 % or less').default(SET_DEFAULTS.motoringPct),
    leadingKVARLimitPct: nonNegative('%').lte(100, 'must be 100 % or less').default(30),
    governor: governorSchema,
    regulator: regulatorSchema,
    machine: machineSchema.prefault({}),
    feeder: feederSchema.prefault({}),
    protection: protectionSchema.prefault({}),
  })
  .strict();

// Optional load fields: empty (null) or left out mean the same (the default, or never shed).
const share = () => nonNegative('%').lte(100, 'must be 100 % or less').nullish();

const loadSchema = z
  .object({
    id: id(),
    name: text().optional(),
    online: flag().default(true),
    kW: nonNegative('kW').lte(MAX_LOAD_KW, 'must be 10 000 000 kW or less'),
    kVAR: between('kVAR', -MAX_LOAD_KW, MAX_LOAD_KW),
    model: oneOf(LOAD_MODELS).default('constant-power'),
    kWImpedancePct: share(),
    kWCurrentPct: share(),
    kVARImpedancePct: share(),
    kVARCurrentPct: share(),
    frequencySensitivity: nonNegative('%/%').lte(10, 'must be 10 or less').default(0),
    kVARFrequencySensitivity: num('%/%').gte(-10, 'must be −10 or more').lte(10, 'must be 10 or less').nullish(),
    shedFrequencyPct: positive('%').gte(50, 'must be 50 % or more').lt(100, 'must be below 100 %').nullish(),
    shedDelayS: nonNegative('s').lte(60, 'must be 60 s or less').nullish(),
  })
  .strict();

/** A load without its emptied (null) optional fields: they read as left out. */
function withoutNulls<T extends object>(l: T): { [K in keyof T]: Exclude<T[K], null> } {
  return Object.fromEntries(Object.entries(l).filter(([, v]) => v !== null)) as { [K in keyof T]: Exclude<T[K], null> };
}

/** The regulator without a `ceilingPU` of null (an emptied field: the ceiling is derived). */
function withoutNullCeiling<T extends { ceilingPU?: number | null }>(r: T): Omit<T, 'ceilingPU'> & { ceilingPU?: number } {
  const { ceilingPU, ...rest } = r;
  return ceilingPU === null || ceilingPU === undefined ? rest : { ...rest, ceilingPU };
}

/**
 * Zod schema of a plant file; parsing fills defaults and checks cross-field rules.
 * Defaults for setpoints: `noLoadHz = f_rated (1 + droop)` and `noLoadV = V_rated (1 + droop)`
 * (rated output at rated frequency / voltage); `setpointHz`, `setpointV` = rated.
 */
export const plantSchema = z
  .object({
    format: z.literal(PLANT_FORMAT, { error: `must be "${PLANT_FORMAT}"` }),
    version: z.literal(PLANT_VERSION, { error: `must be ${PLANT_VERSION} (this version of Droopline reads plant files of version ${PLANT_VERSION})` }),
    name: id(),
    ratedFrequencyHz: z.union([z.literal(50), z.literal(60)], { error: 'must be 50 or 60 (Hz)' }),
    ratedVoltageV: num('V').gte(100, 'must be 100 V or more').lte(35000, 'must be 35 000 V or less'),
    sets: z.array(setSchema, { error: 'must be a list of sets' }).min(1, 'must hold at least one set').max(256, 'must hold 256 sets or fewer'),
    loads: z.array(loadSchema, { error: 'must be a list of loads' }).default([]),
    powerLoadBreakPct: positive('%').gte(10, 'must be 10 % or more').lte(95, 'must be 95 % or less').default(PLANT_DEFAULTS.powerLoadBreakPct),
  })
  .strict()
  .superRefine((p, ctx) => {
    const seen = new Set<string>();
    p.sets.forEach((s, i) => {
      if (seen.has(s.id)) ctx.addIssue({ code: 'custom', path: ['sets', i, 'id'], message: `must be unique ("${s.id}" is used twice)` });
      seen.add(s.id);
      if (s.ratedKW > s.ratedKVA) ctx.addIssue({ code: 'custom', path: ['sets', i, 'ratedKW'], message: 'must not exceed ratedKVA' });
      const g = s.governor;
      if (g.mode === 'droop' && !(g.droopPct > 0))
        ctx.addIssue({ code: 'custom', path: ['sets', i, 'governor', 'droopPct'], message: 'must be greater than 0 in droop mode' });
      if (s.minKW > s.ratedKW) ctx.addIssue({ code: 'custom', path: ['sets', i, 'minKW'], message: 'must not exceed ratedKW' });
      // minKW is the load controller's lower limit (isochronous and base load); below zero fuel
      // (−motoring power) no governor can go.
      if (s.minKW < (-s.motoringPct / 100) * s.ratedKW)
        ctx.addIssue({ code: 'custom', path: ['sets', i, 'minKW'], message: 'must not be below the motoring power (−motoringPct % of ratedKW: zero fuel)' });
      const r = s.regulator;
      // Setpoints far from rated are typing errors (5 Hz for 50 Hz, 4 V for 400 V), not settings.
      const within = (v: number | undefined, rated: number, path: string[], unit: string) => {
        // A rated value that is itself refused says so once; no second message here.
        if (v === undefined || !(rated >= 100 || unit === 'Hz')) return;
        const lo = rated * (1 - SETPOINT_FRACTION);
        const hi = rated * (1 + SETPOINT_FRACTION);
        if (v < lo || v > hi)
          ctx.addIssue({
            code: 'custom',
            path: ['sets', i, ...path],
            message: `must be within ${SETPOINT_FRACTION * 100} % of the rated ${rated} ${unit} (${lo}–${hi} ${unit})`,
          });
      };
      within(g.noLoadHz, p.ratedFrequencyHz, ['governor', 'noLoadHz'], 'Hz');
      within(g.setpointHz, p.ratedFrequencyHz, ['governor', 'setpointHz'], 'Hz');
      within(r.noLoadV, p.ratedVoltageV, ['regulator', 'noLoadV'], 'V');
      within(r.setpointV, p.ratedVoltageV, ['regulator', 'setpointV'], 'V');
      if (r.mode === 'reactive-droop' && !(r.droopPct > 0))
        ctx.addIssue({ code: 'custom', path: ['sets', i, 'regulator', 'droopPct'], message: 'must be greater than 0 in reactive-droop mode' });
      if (s.machine.tddopS >= s.machine.tdopS)
        ctx.addIssue({
          code: 'custom',
          path: ['sets', i, 'machine', 'tddopS'],
          message: "must be less than T'd0 (machine.tdopS): the damper decays faster than the field",
        });
    });
    const loadIds = new Set<string>();
    p.loads.forEach((l, i) => {
      if (loadIds.has(l.id)) ctx.addIssue({ code: 'custom', path: ['loads', i, 'id'], message: `must be unique ("${l.id}" is used twice)` });
      loadIds.add(l.id);
      if ((l.kWImpedancePct ?? 0) + (l.kWCurrentPct ?? 0) > 100)
        ctx.addIssue({
          code: 'custom',
          path: ['loads', i, 'kWCurrentPct'],
          message: 'with kWImpedancePct must not exceed 100 % (the rest of the kW is constant power)',
        });
      if ((l.kVARImpedancePct ?? 0) + (l.kVARCurrentPct ?? 0) > 100)
        ctx.addIssue({
          code: 'custom',
          path: ['loads', i, 'kVARCurrentPct'],
          message: 'with kVARImpedancePct must not exceed 100 % (the rest of the kVAR is constant power)',
        });
    });
  })
  .transform((p): Plant => ({
    ...p,
    sets: p.sets.map((s) => ({
      ...s,
      name: s.name ?? s.id,
      governor: {
        ...s.governor,
        noLoadHz: s.governor.noLoadHz ?? p.ratedFrequencyHz * (1 + s.governor.droopPct / 100),
        setpointHz: s.governor.setpointHz ?? p.ratedFrequencyHz,
      },
      regulator: {
        ...withoutNullCeiling(s.regulator),
        noLoadV: s.regulator.noLoadV ?? p.ratedVoltageV * (1 + s.regulator.droopPct / 100),
        setpointV: s.regulator.setpointV ?? p.ratedVoltageV,
      },
    })),
    loads: p.loads.map((l) => ({ ...withoutNulls(l), name: l.name ?? l.id })),
  }));
