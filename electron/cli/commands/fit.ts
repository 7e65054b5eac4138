/**
 * `droopline fit plant.json record.csv --set G1 --step-kw N --step-at S [...] [--json]`: fits
 * chosen parameters of one set to a load-bank test record and prints the fitted values, the
 * residual, the record's own ISO 8528-5 verdict and (with --json) the fitted plant. Exit 2 on
 * a bad record, with the line and the reason.
 */
import { EXIT_CODES, FIT_PARAMETERS, isoClassName } from '../../../shared-types';
import type { FitParameterChoice, FitParameterKey, FitResult, RecordColumns, RecordUnits } from '../../../shared-types';
import { dispatch } from '../../handlers';
import { numberFlag } from '../args';
import { callEngine } from '../call';
import { CLI_CAUTION } from '../caution';
import { readTextOrExplain } from '../file-errors';
import { CliInputError } from '../io';
import type { CliArgs, CliCommand, CliIO } from '../io';
import { readJson } from '../read-json';
import { fmt, formatTable } from '../table';

/** Parameters fitted when --params is not given. */
export const DEFAULT_FIT_KEYS: FitParameterKey[] = ['machine.inertiaS', 'governor.engineLagS', 'regulator.gainPU', 'regulator.exciterLagS'];

function paramKey(name: string): FitParameterKey {
  const n = name.trim();
  const hit = FIT_PARAMETERS.find((p) => p.key === n || p.key.split('.')[1] === n);
  if (!hit) throw new CliInputError(`--params: "${n}" is not a parameter a fit may change (one of ${FIT_PARAMETERS.map((p) => p.key).join(', ')})`);
  return hit.key;
}

/** `--bounds inertiaS=0.5:3,gainPU=10:100`. */
function boundsFlag(args: CliArgs): Map<FitParameterKey, [number, number]> {
  const out = new Map<FitParameterKey, [number, number]>();
  const v = args.flags.get('bounds');
  if (v === undefined) return out;
  if (v === true) throw new CliInputError('--bounds: needs NAME=MIN:MAX[,NAME=MIN:MAX…]');
  for (const item of v.split(',')) {
    const m = /^([^=]+)=([^:]+):(.+)$/.exec(item.trim());
    const lo = m ? Number(m[2]) : NaN;
    const hi = m ? Number(m[3]) : NaN;
    if (!m || !Number.isFinite(lo) || !Number.isFinite(hi)) throw new CliInputError(`--bounds: "${item}" must be NAME=MIN:MAX with numbers`);
    out.set(paramKey(m[1]!), [lo, hi]);
  }
  return out;
}

/** `--columns time=t_s,frequency=3,...` or `--units time=ms,voltage=kV`: pairs NAME=VALUE. */
function pairs(args: CliArgs, flag: string, names: readonly string[]): Record<string, string> {
  const v = args.flags.get(flag);
  const out: Record<string, string> = {};
  if (v === undefined) return out;
  if (v === true) throw new CliInputError(`--${flag}: needs NAME=VALUE[,NAME=VALUE…]`);
  for (const item of v.split(',')) {
    const eq = item.indexOf('=');
    const name = item.slice(0, eq).trim();
    if (eq <= 0 || !names.includes(name)) throw new CliInputError(`--${flag}: "${item}" must be NAME=VALUE with NAME one of ${names.join(', ')}`);
    out[name] = item.slice(eq + 1).trim();
  }
  return out;
}

function required(args: CliArgs, name: string): number {
  const n = numberFlag(args, name);
  if (n === undefined) throw new CliInputError(`--${name}: is required`);
  return n;
}

function toJson(r: FitResult): unknown {
  return {
    setId: r.setId,
    parameters: r.parameters,
    residual: r.residual,
    startResidual: r.startResidual,
    iterations: r.iterations,
    maxIterations: r.maxIterations,
    stoppedAtCap: r.stoppedAtCap,
    simulations: r.simulations,
    measuredVerdict: r.measuredVerdict,
    modelVerdict: r.modelVerdict,
    plant: r.fittedPlant,
    notes: r.notes,
    warnings: r.warnings,
    caution: CLI_CAUTION,
  };
}

function verdict(v: boolean | null): string {
  return v === null ? '—' : v ? 'pass' : 'FAIL';
}

function summary(r: FitResult): string {
  const m = r.measuredVerdict;
  const lines = [
    `set ${r.setId}: ${r.iterations} of at most ${r.maxIterations} iterations, ${r.simulations} simulations${r.stoppedAtCap ? ' (stopped at the cap)' : ''}`,
    '',
    formatTable(
      ['parameter', 'unit', 'start', 'fitted', 'bounds', 'error rise at ±10 % of span', 'confidence'],
      r.parameters.map((q) => [
        q.key,
        q.unit,
        fmt(q.start, 4),
        fmt(q.value, 4) + (q.atBound ? ' (on a bound)' : ''),
        `${q.min}–${q.max}`,
        `${fmt(q.sensitivityPct, 1)} %`,
        q.confidence,
      ]),
    ),
    `RMS error (% of rated): frequency ${fmt(r.residual.frequencyPct, 4)}, voltage ${fmt(r.residual.voltagePct, 4)} (start values: ${fmt(r.startResidual.frequencyPct, 4)}, ${fmt(r.startResidual.voltagePct, 4)})`,
    '',
    `measured record: ${fmt(m.initialFrequencyHz, 3)} Hz → nadir ${fmt(m.frequencyNadirHz, 3)} Hz → settled ${fmt(m.settledFrequencyHz, 3)} Hz; ${fmt(m.initialVoltageV, 1)} V → lowest ${fmt(m.voltageMinV, 1)} V → settled ${fmt(m.settledVoltageV, 1)} V`,
    'ISO 8528-5 verdict of the measured record:',
    formatTable(
      ['quantity', 'measured', isoClassName('G1'), isoClassName('G2'), isoClassName('G3')],
      m.classes.map((c) => {
        const cell = (k: 'G1' | 'G2' | 'G3') =>
          `${c.limits[k]} ${verdict(c.pass[k])}${c.measuredByClass ? ` (${c.measuredByClass[k] === null ? 'not settled' : fmt(c.measuredByClass[k], 2)})` : ''}`;
        return [`${c.quantity} (${c.unit})`, c.measuredByClass ? 'per class:' : fmt(c.measured, 2), cell('G1'), cell('G2'), cell('G3')];
      }),
    ),
    ...m.notes.map((n) => `  - ${n}`),
    ...r.notes.map((n) => `  - ${n}`),
  ];
  if (r.warnings.length) lines.push('', 'warnings:', ...r.warnings.map((w) => `  - ${w}`));
  lines.push('', 'The fitted plant: --json prints it as "plant".', '', CLI_CAUTION, '');
  return lines.join('\n');
}

async function readRecord(io: CliIO, args: CliArgs, path: string | undefined, plant: unknown) {
  if (!path) throw new CliInputError('missing record file argument (a CSV test record)');
  const text = await readTextOrExplain((p) => io.readFile(p), path);
  const inspected = await dispatch('inspectTestRecord', { text });
  if (!inspected.ok) return { ok: false as const, message: `${path}: ${inspected.error.message}` };
  const g = inspected.value.guess;
  const cols = pairs(args, 'columns', ['time', 'frequency', 'voltage', 'kW', 'kVAR', 'current']);
  const columns: Record<string, string | number> = { ...g.columns };
  for (const [k, v] of Object.entries(cols)) columns[k] = /^\d+$/.test(v) ? Number(v) : v;
  for (const k of ['time', 'frequency', 'voltage'])
    if (columns[k] === undefined)
      throw new CliInputError(
        `--columns: the ${k} column could not be guessed from the header (${inspected.value.headers.join(', ')}); name it, e.g. --columns ${k}=NAME`,
      );
  const units = { ...g.units, ...pairs(args, 'units', ['time', 'frequency', 'voltage', 'kW', 'kVAR', 'current']) };
  const p = plant as { ratedFrequencyHz?: unknown; ratedVoltageV?: unknown };
  const parsed = await dispatch('parseTestRecord', {
    text,
    columns: columns as unknown as RecordColumns,
    units: units as RecordUnits,
    ratedFrequencyHz: typeof p.ratedFrequencyHz === 'number' ? p.ratedFrequencyHz : 50,
    ratedVoltageV: typeof p.ratedVoltageV === 'number' ? p.ratedVoltageV : 400,
  });
  if (!parsed.ok)
    return {
      ok: false as const,
      message: `${path}: ${parsed.error.message}${parsed.error.issues?.length ? `\n${parsed.error.issues.map((i) => `${i.path}: ${i.message}`).join('\n')}` : ''}`,
    };
  return { ok: true as const, value: parsed.value };
}

export const fitCommand: CliCommand = {
  name: 'fit',
  summary: 'fit set parameters to a load-bank test record (CSV): fitted values, residual, measured ISO 8528-5 verdict',
  usage:
    'droopline fit plant.json record.csv --set ID --step-kw N --step-at S [--step-kvar N] [--start-kw N] [--start-kvar N] [--online ID,ID] [--params a,b,c] [--bounds NAME=MIN:MAX,…] [--columns time=NAME,frequency=NAME,voltage=NAME] [--units time=s|ms,frequency=Hz|pu|%,voltage=V|kV|pu|%] [--measured-at set|bus] [--max-iterations N] [--json]',
  example:
    'renderer/demo/example.load-bank.csv with renderer/demo/water-works.plant.json: --set G1 --start-kw 250 --start-kvar 150 --step-kw 500 --step-kvar 300 --step-at 2.01',
  valueFlags: [
    'set',
    'step-kw',
    'step-kvar',
    'step-at',
    'start-kw',
    'start-kvar',
    'online',
    'params',
    'bounds',
    'columns',
    'units',
    'measured-at',
    'max-iterations',
  ],
  async run(args, io) {
    const plant = await readJson(io, args.positional[0], 'plant');
    const setId = args.flags.get('set');
    if (typeof setId !== 'string') throw new CliInputError('--set: is required (the id of the set the record is of)');
    const stepKW = required(args, 'step-kw');
    const stepAtS = required(args, 'step-at');
    const online = args.flags.get('online');
    if (online === true) throw new CliInputError('--online: needs ID[,ID…]');
    const measuredAt = args.flags.get('measured-at');
    if (measuredAt !== undefined && measuredAt !== 'set' && measuredAt !== 'bus') throw new CliInputError('--measured-at: must be "set" or "bus"');
    const paramsFlag = args.flags.get('params');
    if (paramsFlag === true) throw new CliInputError('--params: needs NAME[,NAME…]');
    const keys = paramsFlag === undefined ? DEFAULT_FIT_KEYS : paramsFlag.split(',').map(paramKey);
    const bounds = boundsFlag(args);
    const params: FitParameterChoice[] = keys.map((key) => {
      const info = FIT_PARAMETERS.find((p) => p.key === key)!;
      const b = bounds.get(key) ?? [info.defaultMin, info.defaultMax];
      return { key, min: b[0], max: b[1] };
    });
    const record = await readRecord(io, args, args.positional[1], plant);
    if (!record.ok) {
      io.err(`droopline: invalid input:\n  ${record.message.split('\n').join('\n  ')}\n`);
      return EXIT_CODES.INVALID_INPUT;
    }
    const maxIterations = numberFlag(args, 'max-iterations');
    const request = {
      plant,
      record: record.value.record,
      test: {
        setId,
        onlineSetIds: typeof online === 'string' ? online.split(',').map((s) => s.trim()) : [setId],
        startKW: numberFlag(args, 'start-kw') ?? 0,
        startKVAR: numberFlag(args, 'start-kvar') ?? 0,
        stepKW,
        stepKVAR: numberFlag(args, 'step-kvar') ?? 0,
        stepAtS,
        ...(measuredAt ? { measuredAt } : {}),
      },
      params,
      ...(maxIterations === undefined ? {} : { maxIterations }),
    };
    const r = await callEngine(io, 'fitTestRecord', request);
    if (!r.ok) return r.exitCode;
    io.out(args.flags.has('json') ? JSON.stringify(toJson(r.value), null, 2) + '\n' : summary(r.value));
    return 0;
  },
};
