import type { BuildReportRequest } from '../../../shared-types';
import type { CliCommand } from '../io';
import { CliInputError } from '../io';
import { numberFlag } from '../args';
import { callEngine } from '../call';
import { fileProblem, readTextOrExplain } from '../file-errors';

/** Reads `--loads 25,50,75,100` as a list of numbers, or throws naming the flag. */
function loadsFlag(value: string | true | undefined): number[] | undefined {
  if (value === undefined) return undefined;
  if (value === true) throw new CliInputError('--loads: needs a value such as 25,50,75,100');
  const list = value.split(',').map((s) => Number(s.trim()));
  if (list.length === 0 || list.some((n) => !Number.isFinite(n))) throw new CliInputError('--loads: must be numbers separated by commas, e.g. 25,50,75,100');
  return list;
}

/** Today's date from the host clock (the engine has none), or `--date`. */
function dateFlag(value: string | true | undefined): string {
  if (value === undefined) return new Date().toISOString().slice(0, 10);
  if (value === true || !/^\d{4}-\d{2}-\d{2}/.test(value)) throw new CliInputError('--date: must be an ISO date such as 2026-12-02');
  return value;
}

export const reportCommand: CliCommand = {
  name: 'report',
  summary: 'printable HTML report: sets, settings, sharing, droop lines, sync-check, transients',
  usage: 'droopline report project.json --out report.html [--loads 25,50,75,100] [--pf 0.8] [--date YYYY-MM-DD] [--strict]',
  example: 'renderer/demo/example.droopline.json (a project file; a plain plant file works too)',
  valueFlags: ['out', 'loads', 'pf', 'date'],
  async run(args, io) {
    if (args.flags.has('pdf')) {
      io.err(
        "droopline report: --pdf needs Electron's print-to-PDF, and Electron is not present here (this command runs on Node).\n" +
          '  Write the HTML with --out report.html and print it to PDF from a browser, or use Report → Save as PDF in the desktop app.\n',
      );
      return 2;
    }
    const path = args.positional[0];
    if (!path) throw new CliInputError('missing project or plant file argument');
    const out = args.flags.get('out');
    if (out === true) throw new CliInputError('--out: needs the path of the HTML file to write, e.g. --out report.html');
    if (typeof out === 'string' && (out === path || (await io.sameFile(out, path)))) {
      throw new CliInputError(`--out: ${out} is the input file; the report would replace it. Choose another name, e.g. --out report.html`);
    }
    const text = await readTextOrExplain((p) => io.readFile(p), path);
    // parseProject reads project files and migrates plain plant, scenario and sync-check files.
    const parsed = await callEngine(io, 'parseProject', { text });
    if (!parsed.ok) return parsed.exitCode;
    const { project, notes } = parsed.value;
    for (const n of notes) io.err(`note: ${n}\n`);
    const request: BuildReportRequest = {
      project: {
        name: project.name,
        plant: project.plant,
        // Without scenarios the report runs its own block-load step (and says so).
        scenarios: project.scenarios.length ? project.scenarios : undefined,
        sync: project.sync,
      },
      date: dateFlag(args.flags.get('date')),
      loadsPct: loadsFlag(args.flags.get('loads')),
      loadPF: numberFlag(args, 'pf'),
    };
    const r = await callEngine(io, 'buildReport', request);
    if (!r.ok) return r.exitCode;
    if (typeof out === 'string') {
      try {
        await io.writeFile(out, r.value.html);
      } catch (e) {
        throw new CliInputError(fileProblem(out, e, 'write'));
      }
      io.out(`wrote ${out} (${r.value.tables.length} tables, ${r.value.charts.length} charts)\n`);
    } else io.out(r.value.html);
    const missing = r.value.sections.filter((s) => s.problem);
    for (const s of missing) io.err(`not computed: ${s.title}: ${s.problem}\n`);
    return missing.length && args.flags.has('strict') ? 3 : 0;
  },
};
