/** `droopline solve plant.json [--json] [--load-kw N --load-kvar N]`: where the plant settles. */
import { CAUTION, flagWords } from '../../../shared-types';
import type { SharingResult } from '../../../shared-types';
import { numberFlag } from '../args';
import { callEngine } from '../call';
import { impliedPowerFactor } from '../../handlers';
import { CliInputError } from '../io';
import type { CliCommand } from '../io';
import { readJson } from '../read-json';
import { fmt, formatTable } from '../table';

/** The JSON the command prints: the issue's fields first, then everything else the engine returns. */
function toJson(r: SharingResult): unknown {
  return {
    bus: r.bus,
    sets: r.sets.map((s) => {
      const { id, kW, kVAR, kVA, pf, currentA, terminalV, circulatingA, loadingPct, flags, ...rest } = s;
      return { id, kW, kVAR, kVA, pf, currentA, terminalV, circulatingA, loadingPct, flags, ...rest };
    }),
    warnings: r.warnings,
    totals: r.totals,
    method: r.method,
    iterations: r.iterations,
    caution: CAUTION,
  };
}

/** Below this total kVA, % of the online kVA rating, the plant's total PF means nothing and prints "—". */
const PF_SHOWN_ABOVE_PCT = 0.5;

/** Total PF of the sets' output, or "—" at (near) zero output. */
function totalPF(r: SharingResult, onlineKVA: number): string {
  const t = r.totals;
  if (!(t.kVA > (PF_SHOWN_ABOVE_PCT / 100) * onlineKVA)) return '—';
  return `${fmt(Math.abs(t.kW) / t.kVA, 3)} ${t.kVAR >= 0 ? 'lag' : 'lead'}`;
}

function table(r: SharingResult, loadNote: string, onlineKVA: number): string {
  const rows = r.sets.map((s) =>
    s.online
      ? [
          s.id,
          fmt(s.kW, 1),
          fmt(s.kVAR, 1),
          fmt(s.kVA, 1),
          s.loadingKVAPct > 1e-6 ? `${fmt(s.pf, 3)} ${s.kVAR >= 0 ? 'lag' : 'lead'}` : '—',
          fmt(s.currentA, 0),
          fmt(s.terminalV, 1),
          fmt(s.loadingPct, 1),
          fmt(s.loadingKVAPct, 1),
          fmt(s.circulatingA, 0),
          fmt(s.feederLossKW, 2),
          s.flags.map((f) => flagWords(f).words).join(', ') || 'ok',
        ]
      : [s.id, '—', '—', '—', '—', '—', '—', '—', '—', '—', '—', 'offline'],
  );
  const t = r.totals;
  return (
    `bus: ${fmt(r.bus.frequencyHz, 3)} Hz, ${fmt(r.bus.voltageV, 1)} V   (${r.method === 'closed-form' ? 'closed forms' : `Newton–Raphson, ${r.iterations} iterations`})\n\n` +
    formatTable(['set', 'kW', 'kVAR', 'kVA', 'PF', 'A', 'terminal V', 'kW %', 'kVA %', 'circ. A', 'loss kW', 'flags'], rows) +
    `\ntotal ${fmt(t.kW, 1)} kW, ${fmt(t.kVAR, 1)} kVAR, PF ${totalPF(r, onlineKVA)}; load ${fmt(t.loadKW, 1)} kW, ${fmt(t.loadKVAR, 1)} kVAR; feeder losses ${fmt(t.feederLossKW, 2)} kW, ${fmt(t.feederLossKVAR, 2)} kVAR\n` +
    loadNote +
    (r.warnings.length ? `\nwarnings:\n${r.warnings.map((w) => `  - ${w}`).join('\n')}\n` : '') +
    `\n${CAUTION}\n`
  );
}

/** Σ ratedKVA of the online sets of a plant file the engine has just accepted. */
function onlineKVA(plant: unknown): number {
  const sets = (plant as { sets?: { online?: boolean; ratedKVA?: number }[] }).sets ?? [];
  return sets.reduce((sum, s) => sum + (s.online !== false && typeof s.ratedKVA === 'number' ? s.ratedKVA : 0), 0);
}

export const solveCommand: CliCommand = {
  name: 'solve',
  summary: 'steady-state kW/kVAR sharing, bus frequency and voltage',
  usage: 'droopline solve plant.json [--json] [--load-kw N --load-kvar N]',
  example: 'renderer/demo/water-works.plant.json (a plant file)',
  valueFlags: ['load-kw', 'load-kvar'],
  async run(args, io) {
    const plant = await readJson(io, args.positional[0], 'plant');
    const loadKW = numberFlag(args, 'load-kw');
    const loadKVAR = numberFlag(args, 'load-kvar');
    if (loadKVAR !== undefined && loadKW === undefined) throw new CliInputError('--load-kvar: needs --load-kw as well');
    let load: { kW: number; kVAR: number } | undefined;
    let loadNote = '';
    if (loadKW !== undefined && loadKVAR !== undefined) load = { kW: loadKW, kVAR: loadKVAR };
    else if (loadKW !== undefined) {
      // kW alone: the plant loads' own power factor (never a silent unity PF).
      const valid = await callEngine(io, 'validatePlant', { plant });
      if (!valid.ok) return valid.exitCode;
      const implied = impliedPowerFactor(valid.value);
      load = { kW: loadKW, kVAR: loadKW * implied.kVARPerKW };
      loadNote = `load: ${fmt(loadKW, 1)} kW at PF ${fmt(implied.pf, 3)} ${implied.kVARPerKW >= 0 ? 'lagging' : 'leading'} (the ${implied.source}; give --load-kvar to choose): ${fmt(load.kVAR, 1)} kVAR\n`;
    }
    const r = await callEngine(io, 'solveSharing', load ? { plant, load } : { plant });
    if (!r.ok) return r.exitCode;
    io.out(
      args.flags.has('json')
        ? JSON.stringify({ ...(toJson(r.value) as object), ...(load ? { load: { ...load, note: loadNote.trim() || undefined } } : {}) }, null, 2) + '\n'
        : table(r.value, loadNote, onlineKVA(plant)),
    );
    return 0;
  },
};
