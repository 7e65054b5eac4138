/**
 * The rows of the set sheet, grouped as the trade thinks of a set: rating, limits,
 * governor, regulator, machine data, feeder, and the simulator's dynamics and protection. Each row names the field by its path inside
 * a set (the engine's issue path is `sets[i].` + this key) and shows its unit.
 */
import { SET_DEFAULTS } from '../../../shared-types';
import { TYPICAL_RANGES } from '../../stores';

/** The modes of a set, which decide which of its fields are in use. */
export interface SetModes {
  governorMode: string;
  regulatorMode: string;
}

/** A choice of a select row. */
export interface Choice {
  value: string;
  label: string;
}

/** One row of the sheet. */
export interface SheetRow {
  /** Path inside the set, e.g. `governor.droopPct`. */
  key: string;
  label: string;
  /** Unit shown beside the label ("–" for a plain number). */
  unit: string;
  kind: 'number' | 'text' | 'select' | 'online' | 'check';
  /** Words for a check row: [checked, unchecked]. */
  words?: [string, string];
  choices?: Choice[];
  /** Input step for the arrow keys. */
  step?: number;
  /** Typical range shown in the last column. */
  typical?: string;
  /** When the field is not used by the set's current modes: a note saying when it is. */
  unusedWhen?: (s: SetModes) => string | null;
  /** A hint (title) explaining the field. */
  hint?: string;
}

/** A titled group of rows. */
export interface SheetGroup {
  id: string;
  title: string;
  note?: string;
  rows: SheetRow[];
}

const governorModes: Choice[] = [
  { value: 'droop', label: 'droop' },
  { value: 'isochronous', label: 'isochronous' },
  { value: 'baseload', label: 'base load' },
];

const regulatorModes: Choice[] = [
  { value: 'reactive-droop', label: 'reactive droop' },
  { value: 'cross-current', label: 'cross-current' },
  { value: 'voltage', label: 'voltage control' },
  { value: 'power-factor', label: 'power factor' },
];

const govUnused =
  (used: string, ...modes: string[]) =>
  (s: SetModes) =>
    modes.includes(s.governorMode) ? null : `used in ${used} mode`;
const regUnused =
  (used: string, ...modes: string[]) =>
  (s: SetModes) =>
    modes.includes(s.regulatorMode) ? null : `used in ${used} mode`;

/** The groups of the set sheet, top to bottom. */
export const SET_GROUPS: readonly SheetGroup[] = [
  {
    id: 'identity',
    title: 'Set',
    rows: [
      { key: 'id', label: 'Id', unit: '', kind: 'text', hint: 'Unique short name, e.g. G1' },
      { key: 'name', label: 'Name', unit: '', kind: 'text' },
      { key: 'online', label: 'Breaker', unit: '', kind: 'online', hint: 'Online: breaker closed, set shares the load' },
    ],
  },
  {
    id: 'rating',
    title: 'Rating',
    rows: [
      { key: 'ratedKVA', label: 'Rated apparent power', unit: 'kVA', kind: 'number', step: 10 },
      { key: 'ratedKW', label: 'Rated active power', unit: 'kW', kind: 'number', step: 10 },
      { key: 'ratedPF', label: 'Rated power factor', unit: 'lag', kind: 'number', step: 0.01 },
      { key: 'poles', label: 'Poles', unit: '', kind: 'number', step: 2, hint: 'Rated speed n = 120 f / poles' },
    ],
  },
  {
    id: 'limits',
    title: 'Limits',
    rows: [
      {
        key: 'overloadPct',
        label: 'Overload limit (fuel limit)',
        unit: '% kW',
        kind: 'number',
        step: 5,
        typical: '110 prime (ISO 8528-1, from memory)',
        hint: 'The governor’s fuel limit in every mode: a prime-rated set may carry 110 % for one hour in twelve (ISO 8528-1, value from memory); 100 for a standby rating',
      },
      {
        key: 'motoringPct',
        label: 'Motoring power (zero fuel)',
        unit: '% kW',
        kind: 'number',
        step: 1,
        typical: '25 four-stroke diesel (IEEE C37.102, from memory)',
        hint: 'What the set draws from the bus at zero fuel: typical figure for a four-stroke diesel from the IEEE C37.102 table of motoring power (value from memory); verify with the engine maker',
      },
      {
        key: 'minKW',
        label: 'Minimum output',
        unit: 'kW',
        kind: 'number',
        step: 10,
        hint: 'Lower limit of the load controller (isochronous and base load); a droop set goes down to zero fuel and motors',
      },
      { key: 'reversePowerTripPct', label: 'Reverse-power trip (32)', unit: '% kW', kind: 'number', step: 1, typical: TYPICAL_RANGES.reversePowerTripPct },
      { key: 'reversePowerDelayS', label: 'Reverse-power delay (32)', unit: 's', kind: 'number', step: 0.5, typical: '2–10 (common practice)' },
      { key: 'leadingKVARLimitPct', label: 'Leading kVAR limit', unit: '% kVA', kind: 'number', step: 5 },
    ],
  },
  {
    id: 'governor',
    title: 'Governor (speed)',
    note: 'droop % = 100 × (f no-load − f at rated kW) / f rated',
    rows: [
      { key: 'governor.mode', label: 'Mode', unit: '', kind: 'select', choices: governorModes },
      {
        key: 'governor.droopPct',
        label: 'Speed droop',
        unit: '%',
        kind: 'number',
        step: 0.5,
        typical: TYPICAL_RANGES['governor.droopPct'],
        unusedWhen: govUnused('droop', 'droop'),
      },
      { key: 'governor.noLoadHz', label: 'No-load frequency', unit: 'Hz', kind: 'number', step: 0.1, unusedWhen: govUnused('droop', 'droop') },
      { key: 'governor.setpointHz', label: 'Setpoint frequency', unit: 'Hz', kind: 'number', step: 0.1, unusedWhen: govUnused('isochronous', 'isochronous') },
      { key: 'governor.baseKW', label: 'Base load', unit: 'kW', kind: 'number', step: 10, unusedWhen: govUnused('base-load', 'baseload') },
      {
        key: 'governor.loadSharingLink',
        label: 'Load-sharing link',
        unit: '',
        kind: 'check',
        words: ['linked', 'not linked'],
        hint: 'Isochronous sets on a load-sharing link share kW in proportion to rated kW',
        unusedWhen: govUnused('isochronous', 'isochronous'),
      },
    ],
  },
  {
    id: 'regulator',
    title: 'Voltage regulator',
    note: 'reactive droop: % of rated V at the kVAR of rated current and rated PF',
    rows: [
      { key: 'regulator.mode', label: 'Mode', unit: '', kind: 'select', choices: regulatorModes },
      {
        key: 'regulator.droopPct',
        label: 'Reactive droop',
        unit: '%',
        kind: 'number',
        step: 0.5,
        typical: TYPICAL_RANGES['regulator.droopPct'],
        unusedWhen: regUnused('reactive-droop', 'reactive-droop'),
      },
      { key: 'regulator.noLoadV', label: 'No-load voltage', unit: 'V', kind: 'number', step: 1, unusedWhen: regUnused('reactive-droop', 'reactive-droop') },
      {
        key: 'regulator.setpointV',
        label: 'Setpoint voltage',
        unit: 'V',
        kind: 'number',
        step: 1,
        unusedWhen: regUnused('voltage or cross-current', 'voltage', 'cross-current'),
      },
      { key: 'regulator.pf', label: 'Power factor held', unit: 'lag', kind: 'number', step: 0.01, unusedWhen: regUnused('power-factor', 'power-factor') },
    ],
  },
  {
    id: 'machine',
    title: 'Machine data',
    note: 'per unit on the set’s own kVA and the plant voltage; typical values, verify with the maker’s data',
    rows: [
      { key: 'machine.xdPU', label: 'X d synchronous', unit: 'pu', kind: 'number', step: 0.1, typical: TYPICAL_RANGES['machine.xdPU'] },
      { key: 'machine.xdpPU', label: "X'd transient", unit: 'pu', kind: 'number', step: 0.01, typical: TYPICAL_RANGES['machine.xdpPU'] },
      { key: 'machine.xddpPU', label: "X''d subtransient", unit: 'pu', kind: 'number', step: 0.01, typical: TYPICAL_RANGES['machine.xddpPU'] },
      { key: 'machine.tdopS', label: "T'd0 open-circuit", unit: 's', kind: 'number', step: 0.1, typical: TYPICAL_RANGES['machine.tdopS'] },
      { key: 'machine.inertiaS', label: 'H inertia (set + engine)', unit: 's', kind: 'number', step: 0.1, typical: TYPICAL_RANGES['machine.inertiaS'] },
    ],
  },
  {
    id: 'feeder',
    title: 'Feeder to the bus (per phase)',
    rows: [
      { key: 'feeder.rOhm', label: 'Resistance R', unit: 'Ω', kind: 'number', step: 0.0005 },
      { key: 'feeder.xOhm', label: 'Reactance X', unit: 'Ω', kind: 'number', step: 0.0005 },
    ],
  },
  {
    id: 'dynamics',
    title: 'Advanced: dynamics',
    note: 'used by the time-domain simulator; typical ranges are common practice for engine sets (values from memory) — verify with the makers’ data and the protection study',
    rows: [
      { key: 'governor.actuatorLagS', label: 'Governor actuator lag', unit: 's', kind: 'number', step: 0.01, typical: '0.02–0.1' },
      { key: 'governor.engineLagS', label: 'Engine torque lag', unit: 's', kind: 'number', step: 0.05, typical: '0.1–0.5' },
      {
        key: 'governor.isoResetS',
        label: 'Isochronous reset time',
        unit: 's',
        kind: 'number',
        step: 0.5,
        typical: '1–5',
        unusedWhen: govUnused('isochronous', 'isochronous'),
      },
      {
        key: 'governor.isoGainPU',
        label: 'Isochronous gain',
        unit: 'pu/pu',
        kind: 'number',
        step: 1,
        typical: `10–40 (${SET_DEFAULTS.isoGainPU}: 5 % transient droop, common practice)`,
        hint: 'Proportional gain of the isochronous governor, pu power per pu speed error; 20 is a 5 % transient droop (common practice, value from memory)',
        unusedWhen: govUnused('isochronous', 'isochronous'),
      },
      { key: 'regulator.gainPU', label: 'Regulator gain', unit: 'pu/pu', kind: 'number', step: 5, typical: '20–400' },
      { key: 'regulator.exciterLagS', label: 'Exciter lag', unit: 's', kind: 'number', step: 0.01, typical: '0.02–0.2' },
      {
        key: 'regulator.resetS',
        label: 'Regulator reset (integral) time',
        unit: 's',
        kind: 'number',
        step: 0.1,
        typical: `0.5–3 (${SET_DEFAULTS.regulatorResetS} common practice)`,
        hint: 'Integral time of the voltage regulator: how fast it removes a steady voltage error (common practice, value from memory)',
      },
      {
        key: 'regulator.pfTrimS',
        label: 'Power-factor trim time',
        unit: 's',
        kind: 'number',
        step: 0.5,
        typical: `2–20 (${SET_DEFAULTS.pfTrimS} common practice)`,
        hint: 'Time constant of the power-factor controller’s trim of the voltage reference (common practice, value from memory)',
        unusedWhen: regUnused('power-factor', 'power-factor'),
      },
      {
        key: 'regulator.ceilingPU',
        label: 'Field ceiling (empty: derived)',
        unit: 'pu',
        kind: 'number',
        step: 0.1,
        typical: '1.5–2 × rated-load field',
        hint: "Leave empty to use 1.6 × the field at rated load and rated power factor, worked out from X d and X'd",
      },
      {
        key: 'regulator.shuntExcited',
        label: 'Excitation supply',
        unit: '',
        kind: 'check',
        words: ['shunt (self)', 'separate'],
        hint: 'Shunt: the field ceiling follows the terminal voltage',
      },
      { key: 'regulator.residualPU', label: 'Residual voltage', unit: 'pu', kind: 'number', step: 0.01, typical: '0.01–0.05' },
      { key: 'regulator.vhzKneeBelowHz', label: 'V/Hz roll-off knee below rated', unit: 'Hz', kind: 'number', step: 0.5, typical: '1–2' },
      { key: 'regulator.vhzSlopePctPerHz', label: 'V/Hz roll-off slope (0: off)', unit: '% V/Hz', kind: 'number', step: 0.5, typical: 'a few % per Hz' },
      {
        key: 'regulator.oelPct',
        label: 'Over-excitation limit (0: off)',
        unit: '% field',
        kind: 'number',
        step: 5,
        typical: '105–120',
        hint: '% of the field at rated load',
      },
      { key: 'regulator.oelDelayS', label: 'Over-excitation delay', unit: 's', kind: 'number', step: 1, typical: '5–20' },
      {
        key: 'regulator.oelResetS',
        label: 'Over-excitation reset time',
        unit: 's',
        kind: 'number',
        step: 5,
        typical: `10–60 (${SET_DEFAULTS.oelResetS} common practice)`,
        hint: 'After the limiter acts, the field must stay below the limit this long before the limiter lets go and the field may force again (common practice, value from memory)',
      },
      { key: 'machine.dampingPU', label: 'Damping D', unit: 'pu', kind: 'number', step: 0.5, typical: '0–5' },
      { key: 'machine.raPU', label: 'Armature resistance Ra', unit: 'pu', kind: 'number', step: 0.005, typical: '0.005–0.02' },
      {
        key: 'machine.tddopS',
        label: "T''d0 subtransient open-circuit",
        unit: 's',
        kind: 'number',
        step: 0.005,
        typical: `0.01–0.05 (${SET_DEFAULTS.tddopS}, typical data, from memory)`,
        hint: "How fast the damper windings’ flux decays; must be less than T'd0",
      },
      { key: 'protection.underFrequencyPct', label: 'Under-frequency 81U pickup (0: off)', unit: '% f', kind: 'number', step: 0.5, typical: '90–96' },
      { key: 'protection.underFrequencyDelayS', label: 'Under-frequency 81U delay', unit: 's', kind: 'number', step: 0.5, typical: '2–10' },
      { key: 'protection.overFrequencyPct', label: 'Over-frequency 81O pickup (0: off)', unit: '% f', kind: 'number', step: 0.5, typical: '104–110' },
      { key: 'protection.overFrequencyDelayS', label: 'Over-frequency 81O delay', unit: 's', kind: 'number', step: 0.5, typical: '2–10' },
      { key: 'protection.underVoltagePct', label: 'Undervoltage 27 pickup (0: off)', unit: '% V', kind: 'number', step: 1, typical: '75–90' },
      { key: 'protection.underVoltageDelayS', label: 'Undervoltage 27 delay', unit: 's', kind: 'number', step: 0.5, typical: '2–10' },
      { key: 'protection.overVoltagePct', label: 'Overvoltage 59 pickup (0: off)', unit: '% V', kind: 'number', step: 1, typical: '110–120' },
      { key: 'protection.overVoltageDelayS', label: 'Overvoltage 59 delay', unit: 's', kind: 'number', step: 0.5, typical: '1–5' },
    ],
  },
];
