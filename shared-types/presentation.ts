/**
 * Words and numbers, one home for the renderer, the CLI and the report: the caution sentence,
 * number formats (one formatter per kind of figure), the chart palette, the flag vocabulary, field names in words
 * and the ISO 8528-5 class names.
 * Pure constants and tiny pure functions only (no DOM, no Node, no clock).
 */
import type { SetFlag } from './sharing';
import type { TrainerFaults } from './trainer';

/** The caution every screen, report, export and CLI output carries. */
export const CAUTION =
  "Planning and training only. Verify against makers' data, protection studies, local codes and licensed practice. Closing out of phase can damage machines and injure people.";

/** The caution after a bold "Caution:" label (first letter lower case). */
export const CAUTION_AFTER_LABEL = CAUTION.charAt(0).toLowerCase() + CAUTION.slice(1);

/** A `#` comment line carrying the caution, placed first in CSV files (common CSV readers skip it with a comment option). */
export const CSV_CAUTION_LINE = `# Caution: ${CAUTION_AFTER_LABEL}`;

/** Escapes the five HTML-special characters so user text (names, ids) cannot become markup (the report, the commissioning record). */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}

/** `value` with `decimals` decimals; "—" for null, NaN or infinite (never "NaN"); "-0.0" prints as "0.0". */
export function formatNumber(value: number | null | undefined, decimals = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toFixed(decimals);
  // "-0" and "-0.0" read as a sign error: show zero.
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

/**
 * A bound as the rules write it: 2 000 000, 0.01 (groups of three split by a space, up to ten decimals). One formatter
 * for every bound: `toLocaleString` with options builds a new one per call, and the schemas ask for hundreds of bounds
 * when the engine loads.
 */
const boundFormat = new Intl.NumberFormat('en', { maximumFractionDigits: 10 });
export function formatBound(n: number): string {
  return boundFormat.format(n).replace(/,/g, ' ');
}

/**
 * A signed figure ("+1.2", "−0.4", "0.0") for errors and deviations: true minus sign by default; `{ ascii: true }`
 * writes "-0.4" where a readout has always shown the keyboard minus. Zero (and what rounds to it) has no sign, unless
 * `{ plusAtZero: true }` (an axis whose every tick is signed): then a value of zero or more that rounds to zero is "+0.00".
 */
export function formatSigned(
  value: number | null | undefined,
  decimals = 1,
  { ascii = false, plusAtZero = false }: { ascii?: boolean; plusAtZero?: boolean } = {},
): string {
  const s = formatNumber(value, decimals);
  if (s === '—') return s;
  if (Number(s) === 0) return plusAtZero && value! >= 0 ? `+${s}` : s;
  return s.startsWith('-') ? `${ascii ? '-' : '−'}${s.slice(1)}` : `+${s}`;
}

/** A figure with its unit after a space ("12.5 %", "50.000 Hz", "80 ms", "1.05 pu"); a blank is "—" without the unit. */
function withUnit(value: number | null | undefined, decimals: number, unit: string): string {
  const s = formatNumber(value, decimals);
  return s === '—' ? s : `${s} ${unit}`;
}

/** A percentage: "12.5 %". */
export function formatPercent(value: number | null | undefined, decimals = 1): string {
  return withUnit(value, decimals, '%');
}

/** A frequency: "50.000 Hz" (three decimals by default: slip and bus frequency are read to the mHz). */
export function formatHz(value: number | null | undefined, decimals = 3): string {
  return withUnit(value, decimals, 'Hz');
}

/** An angle in degrees, the sign kept: "12.3°", "-7.2°" (no space before the degree sign). */
export function formatAngleDeg(value: number | null | undefined, decimals = 1): string {
  const s = formatNumber(value, decimals);
  return s === '—' ? s : `${s}°`;
}

/** A time in milliseconds: "80 ms". */
export function formatMs(value: number | null | undefined, decimals = 0): string {
  return withUnit(value, decimals, 'ms');
}

/** A time in seconds: "1.25 s". */
export function formatSeconds(value: number | null | undefined, decimals = 2): string {
  return withUnit(value, decimals, 's');
}

/** A per-unit figure: "1.05 pu". */
export function formatPU(value: number | null | undefined, decimals = 2): string {
  return withUnit(value, decimals, 'pu');
}

/** A power factor with its sense: "0.85 lag", "0.97 lead", "1.00". */
export function formatPF(pf: number | null | undefined, lagging: boolean): string {
  const s = formatNumber(pf, 2);
  if (s === '—' || s === '1.00') return s;
  return `${s} ${lagging ? 'lag' : 'lead'}`;
}

/** A current to the ampere ("1057"), the resolution a setting or a meter is read to. */
export function formatCurrentA(value: number | null | undefined): string {
  return formatNumber(value, 0);
}

/**
 * The chart palette, one home for the report's SVG charts and the app's charts (`renderer/components/charts/theme.ts`
 * falls back to these where the CSS variables of `renderer/styles/base.css` cannot be read; the light theme's
 * variables hold the same values). Print-safe: text colours keep 4.5:1 on white.
 */
export const CHART_PALETTE = {
  fg: '#1d2329',
  muted: '#5b6670',
  grid: '#d4d9de',
  panel: '#ffffff',
  accent: '#1f6f8b',
  good: '#1b7a43',
  warn: '#8a5a00',
  bad: '#b02a2a',
  /** The plot frame and the faint grid lines of the printed charts. */
  frame: '#9aa6b0',
  gridLine: '#e3e7ea',
  gridMinor: '#eef1f3',
  /** The sets' colours, in plant order (wrapping around). */
  series: ['#1f6f8b', '#a85a12', '#6b4c9a', '#2e7d32', '#8d2f4f'],
} as const;

/** How a per-set flag reads: short words for tables, a sentence for tooltips, and its weight. */
export interface FlagWords {
  /** Short words for tables (screens, CLI, report). */
  words: string;
  /** A sentence explaining the flag. */
  explain: string;
  /** `bad`: act on it; `warn`: watch it; `info`: a state. */
  level: 'bad' | 'warn' | 'info';
}

/** One vocabulary for the per-set flags, used by the screens, the CLI and the report. */
export const FLAG_WORDS: Readonly<Record<SetFlag, FlagWords>> = {
  'overload-kW': {
    words: 'kW overload',
    explain: 'Output above the set’s rated kW, inside its overload allowance (a prime-rated set: 110 % for one hour in twelve, ISO 8528-1, value from memory).',
    level: 'bad',
  },
  'overload-kVA': {
    words: 'kVA overload',
    explain: 'Apparent power above the set’s rated kVA: stator current above rating (alternator heating).',
    level: 'bad',
  },
  motoring: { words: 'motoring', explain: 'The set absorbs kW from the bus: its engine is turned by the alternator.', level: 'warn' },
  'reverse-power': {
    words: 'reverse power: 32 trips',
    explain: 'The set absorbs more kW than its reverse-power setting (device 32): the relay would trip it after its delay.',
    level: 'bad',
  },
  'at-max-kW': {
    words: 'at fuel limit',
    explain: 'The governor is at the set’s fuel limit (its overload limit); it no longer follows its droop line.',
    level: 'warn',
  },
  'at-min-kW': {
    words: 'at lowest output',
    explain: 'The governor is at the set’s lowest output: zero fuel in droop, the minimum output in isochronous or base load.',
    level: 'warn',
  },
  'field-limit': { words: 'field limit', explain: 'Lagging kVAR at (held by the regulator) or beyond the set’s field-heating limit.', level: 'warn' },
  'under-excited': { words: 'under-excited', explain: 'Leading kVAR at (held by the regulator) or beyond the set’s under-excitation limit.', level: 'warn' },
  offline: { words: 'offline', explain: 'Breaker open: the set takes no share.', level: 'info' },
};

/** The words of `flag` (an unknown flag from a newer engine is shown by its name). */
export function flagWords(flag: string): FlagWords {
  return (FLAG_WORDS as Record<string, FlagWords | undefined>)[flag] ?? { words: flag, explain: flag, level: 'warn' };
}

/**
 * Field names of the plant, scenario and sync-check files in words, as the screens speak them.
 * The CLI and JSON keep the field paths (`sets[0].ratedKW`), which a file editor needs.
 */
export const FIELD_WORDS: Readonly<Record<string, string>> = {
  name: 'name',
  id: 'id',
  online: 'breaker',
  ratedFrequencyHz: 'rated frequency',
  ratedVoltageV: 'rated voltage',
  ratedKVA: 'rated apparent power',
  ratedKW: 'rated active power',
  ratedPF: 'rated power factor',
  poles: 'number of poles',
  minKW: 'minimum output',
  reversePowerTripPct: 'reverse-power trip setting',
  reversePowerDelayS: 'reverse-power trip delay',
  overloadPct: 'overload capability',
  motoringPct: 'motoring power',
  leadingKVARLimitPct: 'leading kVAR limit',
  governor: 'governor',
  regulator: 'voltage regulator',
  machine: 'machine data',
  feeder: 'feeder',
  mode: 'mode',
  droopPct: 'droop',
  noLoadHz: 'no-load frequency',
  setpointHz: 'setpoint frequency',
  baseKW: 'base load',
  loadSharingLink: 'load-sharing link',
  noLoadV: 'no-load voltage',
  setpointV: 'setpoint voltage',
  pf: 'power factor',
  shuntExcited: 'shunt excitation',
  residualPU: 'residual voltage',
  xdPU: 'synchronous reactance Xd',
  xdpPU: "transient reactance X'd",
  xddpPU: "subtransient reactance X''d",
  tdopS: "open-circuit time constant T'd0",
  raPU: 'armature resistance Ra',
  inertiaS: 'inertia constant H',
  dampingPU: 'damping',
  actuatorLagS: 'actuator lag',
  engineLagS: 'engine lag',
  isoResetS: 'isochronous reset time',
  exciterLagS: 'exciter lag',
  ceilingPU: 'exciter ceiling',
  gainPU: 'regulator gain',
  vhzKneeBelowHz: 'V/Hz knee below rated',
  vhzSlopePctPerHz: 'V/Hz slope',
  startKW: 'load before the step',
  startKVAR: 'reactive load before the step',
  stepKW: 'load step',
  stepKVAR: 'reactive load step',
  stepAtS: 'step time',
  onlineSetIds: 'sets on line',
  measuredAt: 'measured at',
  maxIterations: 'iteration cap',
  params: 'parameters',
  min: 'lowest',
  max: 'highest',
  start: 'start value',
  record: 'test record',
  test: 'test',
  columns: 'column of',
  units: 'unit of',
  fileName: 'file name',
  fit: 'fit',
  result: 'result',
  residual: 'RMS error',
  totalPct: 'both together',
  chosen: 'chosen',
  signOff: 'sign-off',
  by: 'commissioned by',
  remarks: 'remarks',
  recordSetId: 'set of the commissioning record',
  rOhm: 'resistance R',
  xOhm: 'reactance X',
  kW: 'active power',
  kVAR: 'reactive power',
  kVA: 'apparent power',
  model: 'load model',
  frequencySensitivity: 'frequency sensitivity',
  kVARFrequencySensitivity: 'kVAR frequency sensitivity',
  kWImpedancePct: 'constant-impedance share of kW',
  kWCurrentPct: 'constant-current share of kW',
  kVARImpedancePct: 'constant-impedance share of kVAR',
  kVARCurrentPct: 'constant-current share of kVAR',
  shedFrequencyPct: 'load-shedding frequency',
  shedDelayS: 'load-shedding delay',
  powerLoadBreakPct: 'constant-power break voltage',
  isoGainPU: 'isochronous gain',
  resetS: 'regulator reset time',
  pfTrimS: 'power-factor trim time',
  tddopS: "subtransient time constant T''d0",
  oelPct: 'over-excitation limit',
  oelDelayS: 'over-excitation delay',
  oelResetS: 'over-excitation reset time',
  protection: 'protection',
  underFrequencyPct: 'under-frequency (81U) pickup',
  underFrequencyDelayS: 'under-frequency (81U) delay',
  overFrequencyPct: 'over-frequency (81O) pickup',
  overFrequencyDelayS: 'over-frequency (81O) delay',
  underVoltagePct: 'undervoltage (27) pickup',
  underVoltageDelayS: 'undervoltage (27) delay',
  overVoltagePct: 'overvoltage (59) pickup',
  overVoltageDelayS: 'overvoltage (59) delay',
  durationS: 'length',
  stepMs: 'time step',
  atS: 'time',
  setId: 'set',
  loadId: 'load',
  frequencyHz: 'frequency',
  voltageV: 'voltage',
  angleDeg: 'phase angle',
  toKW: 'target output',
  slipHz: 'slip',
  voltagePct: 'voltage difference',
  breakerClosingMs: 'breaker closing time',
  livePct: 'live threshold',
  deadPct: 'dead threshold',
};

/** What a list in a field path holds, for "set 2", "load 1", "event 3". */
const LIST_WORDS: Readonly<Record<string, string>> = { sets: 'set', loads: 'load', events: 'event', scenarios: 'scenario' };

/** A field path in words: `sets[1].governor.droopPct` → "set 2, governor droop". */
export function pathInWords(path: string): string {
  if (path === '' || path === '(file)') return 'the file';
  const parts: string[] = [];
  const words: string[] = [];
  for (const piece of path.split('.')) {
    const m = /^([A-Za-z]+)\[(\d+)\]$/.exec(piece);
    if (m) {
      if (words.length) parts.push(words.splice(0).join(' '));
      parts.push(`${LIST_WORDS[m[1]!] ?? FIELD_WORDS[m[1]!] ?? m[1]!} ${Number(m[2]) + 1}`);
    } else words.push(FIELD_WORDS[piece] ?? piece);
  }
  if (words.length) parts.push(words.join(' '));
  return parts.join(', ');
}

/** A rule message in words: field names inside it ("must not exceed ratedKVA") become words. */
export function messageInWords(message: string): string {
  // Field names start with two lower-case letters (ratedKVA, minKW); units (kW, kVAR) are left alone.
  return message.replace(/\b[a-z]{2,}(?:[A-Z][A-Za-z]*)+\b/g, (name) => FIELD_WORDS[name] ?? name);
}

/** A field problem as the screens say it: "set 2, governor droop: must be 20 % or less". */
export function issueInWords(issue: { path: string; message: string }): string {
  return `${pathInWords(issue.path)}: ${messageInWords(issue.message)}`;
}

/**
 * The name of an ISO 8528-5 performance class ("class G1"): always with the word "class", so it
 * never reads as a set id (the demo's sets are G1–G3 too).
 */
export function isoClassName(cls: string): string {
  return `class ${cls}`;
}

/** An instructor's trainer faults in words, joined by "; " ("" when none): the session log, its CSV and the screens. */
export function faultWords(f: TrainerFaults | undefined): string {
  if (!f) return '';
  const out: string[] = [];
  if (f.breakerSlowMs) out.push(`breaker ${f.breakerSlowMs} ms slower than its setting`);
  if (f.wrongWindow) out.push(`window shown wrong (±${f.wrongWindow.angleDeg}°, ${f.wrongWindow.slipHz} Hz, ${f.wrongWindow.voltagePct} %)`);
  if (f.busDriftHz !== undefined) out.push(`droop bus drifting ±${f.busDriftHz} Hz`);
  if (f.deadBus) out.push('dead bus to energise');
  if (f.voltageMismatchPct !== undefined) out.push(`incoming voltage ${f.voltageMismatchPct > 0 ? '+' : ''}${f.voltageMismatchPct} % off the bus`);
  return out.join('; ');
}

/** One CSV field (RFC 4180): numbers in full precision, blanks empty, text quoted when it holds a quote, comma or line end. */
export function csvField(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  return /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}
