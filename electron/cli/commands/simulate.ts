/**
 * `droopline simulate scenario.json [--json | --csv]`: a time-domain run of a scenario.
 * A scenario may name its plant with `plantFile`, a path relative to the scenario file.
 */
import { posix, win32 } from 'node:path';
import { CAUTION, CSV_CAUTION_LINE, formatNumber, isoClassName } from '../../../shared-types';
import type { SimulationResult } from '../../../shared-types';
import { callEngine } from '../call';
import { CliInputError } from '../io';
import type { CliCommand, CliIO } from '../io';
import { readJson } from '../read-json';
import { fmt, formatTable } from '../table';

function isAbsolute(p: string): boolean {
  return posix.isAbsolute(p) || win32.isAbsolute(p);
}

/** Reads the scenario and, when it names `plantFile` instead of `plant`, the plant beside it. */
async function readScenario(io: CliIO, path: string | undefined): Promise<unknown> {
  const raw = await readJson(io, path, 'scenario');
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) return raw;
  const s = raw as Record<string, unknown>;
  if (s.plant !== undefined || s.plantFile === undefined) return raw;
  if (typeof s.plantFile !== 'string' || s.plantFile.length === 0) throw new CliInputError(`${path}: plantFile: must be the path of a plant file`);
  // The plant must sit in the scenario's folder or below it: a scenario from elsewhere must not
  // make the command read (and quote) any file it can reach.
  const inside = posix.normalize(s.plantFile.replace(/\\/g, '/'));
  if (isAbsolute(s.plantFile) || inside === '..' || inside.startsWith('../')) {
    throw new CliInputError(`${path}: plantFile: must name a file in the scenario's folder or below it (a relative path without "..")`);
  }
  const dir = path!.includes('/') || path!.includes('\\') ? path!.replace(/[/\\][^/\\]*$/, '') : '.';
  const plantPath = posix.normalize(`${dir}/${inside}`);
  const plant = await readJson(io, plantPath, 'plant');
  const format = plant !== null && typeof plant === 'object' ? (plant as { format?: unknown }).format : undefined;
  if (format !== 'droopline.plant') throw new CliInputError(`${plantPath}: plantFile: is not a Droopline plant file (it needs "format": "droopline.plant")`);
  const { plantFile: _drop, ...rest } = s;
  return { ...rest, plant };
}

/** The JSON the command prints: the issue's fields first. */
function toJson(r: SimulationResult): unknown {
  return { metrics: r.metrics, series: r.series, log: r.log, warnings: r.warnings, steps: r.steps, caution: CAUTION };
}

function csv(r: SimulationResult): string {
  const s = r.series;
  const head = ['t_s', 'frequency_Hz', 'voltage_V'];
  for (const id of s.setIds) head.push(`${id}_kW`, `${id}_kVAR`, `${id}_A`, `${id}_speed_Hz`, `${id}_terminal_V`);
  // The caution leads as a '#' comment line (pandas: comment='#'; R: comment.char='#'; spreadsheets show it as a first row).
  const lines = [CSV_CAUTION_LINE, head.join(',')];
  for (let k = 0; k < s.t.length; k++) {
    const row = [formatNumber(s.t[k]!, 4), formatNumber(s.frequencyHz[k]!, 5), formatNumber(s.voltageV[k]!, 3)];
    for (let i = 0; i < s.setIds.length; i++)
      row.push(
        formatNumber(s.setKW[i]![k]!, 3),
        formatNumber(s.setKVAR[i]![k]!, 3),
        formatNumber(s.setCurrentA[i]![k]!, 2),
        formatNumber(s.setSpeedHz[i]![k]!, 5),
        formatNumber(s.setTerminalV[i]![k]!, 3),
      );
    lines.push(row.join(','));
  }
  return lines.join('\n') + '\n';
}

function verdict(v: boolean | null): string {
  return v === null ? '—' : v ? 'pass' : 'FAIL';
}

function summary(r: SimulationResult): string {
  const m = r.metrics;
  const lines = [
    `frequency: initial ${fmt(m.initial.frequencyHz, 3)} Hz, nadir ${fmt(m.frequencyNadirHz, 3)} Hz, peak ${fmt(m.frequencyPeakHz, 3)} Hz, deviation ${fmt(m.frequencyDeviationPct, 2)} %, recovery into ±${m.frequencyBandPct} % ${m.frequencyRecoveryS === null ? 'not within the run' : `${fmt(m.frequencyRecoveryS, 2)} s`}`,
    `voltage:   initial ${fmt(m.initial.voltageV, 1)} V, dip ${fmt(m.voltageDipPct, 2)} %, rise ${fmt(m.voltagePeakPct, 2)} %, recovery into ±${m.voltageBandPct} % ${m.voltageRecoveryS === null ? 'not within the run' : `${fmt(m.voltageRecoveryS, 2)} s`}`,
    `final:     ${fmt(m.final.frequencyHz, 3)} Hz, ${fmt(m.final.voltageV, 1)} V; steady state of the final load ${m.steadyState ? `${fmt(m.steadyState.frequencyHz, 3)} Hz, ${fmt(m.steadyState.voltageV, 1)} V` : `none (${m.steadyStateNote ?? ''})`}`,
    `load not served: ${fmt(m.unservedKWh, 3)} kWh (largest ${fmt(m.maxUnservedKW, 0)} kW); protection operations ${m.trips.length}; closes outside the sync-check window ${m.closes.filter((c) => !c.insideWindow).length}`,
    '',
    formatTable(
      ['set', 'on line', 'kW', 'kVAR'],
      m.final.sets.map((s) => [s.id, s.online ? 'yes' : 'no', fmt(s.kW, 1), fmt(s.kVAR, 1)]),
    ),
    'ISO 8528-5 performance classes (the verdicts apply the class limits to the events simulated):',
    formatTable(
      ['quantity', 'measured', isoClassName('G1'), isoClassName('G2'), isoClassName('G3')],
      m.classes.map((c) => {
        // Recovery times are measured into each class's own band: show each class's figure.
        const cell = (k: 'G1' | 'G2' | 'G3') =>
          `${c.limits[k]} ${verdict(c.pass[k])}${c.measuredByClass ? ` (${c.measuredByClass[k] === null ? 'not settled' : fmt(c.measuredByClass[k], 2)})` : ''}`;
        return [`${c.quantity} (${c.unit})`, c.measuredByClass ? 'per class:' : fmt(c.measured, 2), cell('G1'), cell('G2'), cell('G3')];
      }),
    ),
    ...m.classes.filter((c) => c.note).map((c) => `${c.quantity}: ${c.note}`),
    `limits: ${[...new Set(m.classes.map((c) => c.source))].join('; ')}`,
    '',
    'log:',
    ...r.log.map((l) => `  ${fmt(l.atS, 3)} s  ${l.text}`),
  ];
  if (r.warnings.length) lines.push('', 'warnings:', ...r.warnings.map((w) => `  - ${w}`));
  lines.push('', CAUTION, '');
  return lines.join('\n');
}

export const simulateCommand: CliCommand = {
  name: 'simulate',
  summary: 'time-domain run of a scenario: frequency and voltage, ISO 8528-5 classes',
  usage: 'droopline simulate scenario.json [--json | --csv]',
  example: 'renderer/demo/example.scenario.json (a scenario; --csv starts with a "#" caution line)',
  async run(args, io) {
    if (args.flags.has('json') && args.flags.has('csv')) throw new CliInputError('--json and --csv: choose one');
    const scenario = await readScenario(io, args.positional[0]);
    const r = await callEngine(io, 'simulate', scenario);
    if (!r.ok) return r.exitCode;
    if (args.flags.has('json')) io.out(JSON.stringify(toJson(r.value)) + '\n');
    else if (args.flags.has('csv')) io.out(csv(r.value));
    else io.out(summary(r.value));
    return 0;
  },
};
