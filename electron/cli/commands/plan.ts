/**
 * `droopline plan plant.json --hz-band LO,HI --v-band LO,HI [--loads 0,100] [--pf 0.8] [--fix SET.FIELD,…] [--json]`:
 * droop and no-load settings that share in proportion and hold the bands. Exit 3 with the
 * reasons when no setting meets them.
 */
import type { PlanResult } from '../../../shared-types';
import { numberFlag } from '../args';
import { callEngine } from '../call';
import { CLI_CAUTION } from '../caution';
import { CliInputError } from '../io';
import type { CliCommand } from '../io';
import { pairFlag } from '../pair-flag';
import { readJson } from '../read-json';
import { fmt, formatTable } from '../table';

function toJson(r: PlanResult): unknown {
  return {
    plant: r.plant,
    feasible: r.feasible,
    settings: r.settings,
    bands: r.bands,
    worstSharingErrorPct: {
      current: { kW: r.current.worstKWErrorPct, kVAR: r.current.worstKVARErrorPct },
      proposal: { kW: r.proposal.worstKWErrorPct, kVAR: r.proposal.worstKVARErrorPct },
    },
    points: r.proposal.points,
    reasons: r.reasons,
    tradeoffs: r.tradeoffs,
    notes: r.notes,
    caution: CLI_CAUTION,
  };
}

function table(r: PlanResult): string {
  const rows = r.settings.map((s) => [
    s.id,
    s.governorPlanned ? fmt(s.droopPct, 2) : 'kept',
    s.governorPlanned ? fmt(s.noLoadHz, 3) : 'kept',
    s.regulatorPlanned ? fmt(s.reactiveDroopPct, 2) : 'kept',
    s.regulatorPlanned ? fmt(s.noLoadV, 1) : 'kept',
  ]);
  const pts = r.proposal.points.map((p) => [
    fmt(p.loadPct, 1),
    fmt(p.frequencyHz, 3),
    fmt(p.voltageV, 1),
    fmt(p.worstKWErrorPct, 2),
    fmt(p.worstKVARErrorPct, 2),
    p.error ?? p.note ?? '',
  ]);
  return (
    `${r.feasible ? 'proposal meets every band' : 'NO SETTING MEETS THE BANDS'}\n\n` +
    formatTable(['set', 'droop %', 'no-load Hz', 'reactive droop %', 'no-load V'], rows) +
    '\n' +
    formatTable(['load %', 'bus Hz', 'bus V', 'kW error %', 'kVAR error %', 'note'], pts) +
    `\nworst sharing error: now ${fmt(r.current.worstKWErrorPct, 2)} % kW, ${fmt(r.current.worstKVARErrorPct, 2)} % kVAR; proposed ${fmt(r.proposal.worstKWErrorPct, 2)} % kW, ${fmt(r.proposal.worstKVARErrorPct, 2)} % kVAR\n` +
    r.bands.map((b) => `${b.met ? 'met' : 'NOT MET'}: ${b.sentence}`).join('\n') +
    '\n' +
    (r.reasons.length ? `\nwhy not:\n${r.reasons.map((x) => `  - ${x}`).join('\n')}\n` : '') +
    `\n${r.tradeoffs.map((x) => `  - ${x}`).join('\n')}\n` +
    (r.notes.length ? `\n${r.notes.map((x) => `  - ${x}`).join('\n')}\n` : '') +
    `\n${CLI_CAUTION}\n`
  );
}

const FIELDS = ['droopPct', 'noLoadHz', 'reactiveDroopPct', 'noLoadV'] as const;
type Field = (typeof FIELDS)[number];

/** `--fix G1.droopPct,G2.noLoadV`: settings kept as they are. */
function fixedFlag(value: string | true | undefined): { setId: string; fields: Field[] }[] | undefined {
  if (value === undefined) return undefined;
  if (value === true) throw new CliInputError('--fix: needs SET.FIELD[,SET.FIELD…]');
  return value.split(',').map((item) => {
    const dot = item.lastIndexOf('.');
    const setId = item.slice(0, dot).trim();
    const field = item.slice(dot + 1).trim();
    if (dot <= 0 || !(FIELDS as readonly string[]).includes(field))
      throw new CliInputError(`--fix: "${item}" must be SET.FIELD with FIELD one of ${FIELDS.join(', ')}`);
    return { setId, fields: [field as Field] };
  });
}

export const planCommand: CliCommand = {
  name: 'plan',
  summary: 'droop and no-load settings for proportional sharing inside a frequency and voltage band',
  usage: 'droopline plan plant.json --hz-band LO,HI --v-band LO,HI [--loads 0,100] [--pf 0.8] [--fix SET.FIELD,…] [--json]',
  valueFlags: ['hz-band', 'v-band', 'loads', 'pf', 'fix'],
  async run(args, io) {
    const plant = await readJson(io, args.positional[0], 'plant');
    const frequencyBandHz = pairFlag(args, 'hz-band');
    const voltageBandV = pairFlag(args, 'v-band');
    if (!frequencyBandHz) throw new CliInputError('--hz-band: is required (LO,HI in Hz)');
    if (!voltageBandV) throw new CliInputError('--v-band: is required (LO,HI in V)');
    const loadRangePct = pairFlag(args, 'loads');
    const pf = numberFlag(args, 'pf');
    const fixed = fixedFlag(args.flags.get('fix'));
    const request = {
      plant,
      frequencyBandHz,
      voltageBandV,
      ...(loadRangePct ? { loadRangePct } : {}),
      ...(pf === undefined ? {} : { pf }),
      ...(fixed ? { fixed } : {}),
    };
    const r = await callEngine(io, 'planDroop', request);
    if (!r.ok) return r.exitCode;
    io.out(args.flags.has('json') ? JSON.stringify(toJson(r.value), null, 2) + '\n' : table(r.value));
    if (!r.value.feasible) {
      io.err(`droopline: no setting meets the bands:\n${r.value.reasons.map((x) => `  ${x}`).join('\n')}\n`);
      return 3;
    }
    return 0;
  },
};
