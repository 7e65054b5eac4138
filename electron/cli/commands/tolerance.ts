/**
 * `droopline tolerance plant.json --samples N --seed S [--hz-tol HZ] [--v-tol-pct P]
 * [--droop-tol-pct P] [--normal] [--load-kw N --load-kvar N] [--json]`: seeded Monte-Carlo of
 * setpoint tolerances. The same seed prints byte-identical JSON.
 */
import type { Distribution, ToleranceResult } from '../../../shared-types';
import { numberFlag } from '../args';
import { callEngine } from '../call';
import { CLI_CAUTION } from '../caution';
import { CliInputError } from '../io';
import type { CliCommand } from '../io';
import { readJson } from '../read-json';
import { fmt, formatTable } from '../table';
import { formatPercent } from '../../../shared-types';

const stats = (d: Distribution) => ({ mean: d.mean, std: d.std, p5: d.p5, p50: d.p50, p95: d.p95 });

function toJson(r: ToleranceResult): unknown {
  return {
    sets: r.sets.map((s) => ({ id: s.id, kW: stats(s.kW), kVAR: stats(s.kVAR), circulatingA: stats(s.circulatingA) })),
    bus: { frequencyHz: stats(r.bus.frequencyHz), voltageV: stats(r.bus.voltageV) },
    probabilities: {
      overload: r.probabilities.overload,
      reversePower: r.probabilities.reversePower,
      exceedsRating: r.probabilities.exceedsRating,
      noSteadyState: r.probabilities.noSteadyState,
    },
    samples: r.samples,
    seed: r.seed,
    solved: r.solved,
    ...(r.noSteadyStateReason === undefined ? {} : { noSteadyStateReason: r.noSteadyStateReason }),
    caution: CLI_CAUTION,
  };
}

function table(r: ToleranceResult): string {
  const row = (name: string, d: Distribution, digits: number) => [
    name,
    fmt(d.mean, digits),
    fmt(d.std, digits),
    fmt(d.p5, digits),
    fmt(d.p50, digits),
    fmt(d.p95, digits),
  ];
  const rows = [
    row('bus Hz', r.bus.frequencyHz, 4),
    row('bus V', r.bus.voltageV, 2),
    ...r.sets.flatMap((s) => [row(`${s.id} kW`, s.kW, 1), row(`${s.id} kVAR`, s.kVAR, 1), row(`${s.id} circ. A`, s.circulatingA, 1)]),
  ];
  const p = r.probabilities;
  const pct = (x: number) => formatPercent(100 * x, 2);
  return (
    `${r.samples} samples, seed ${r.seed}; ${r.solved} with a steady state\n\n` +
    formatTable(['figure', 'mean', 'std', 'p5', 'p50', 'p95'], rows) +
    `\nprobability that any set exceeds its rating ${pct(p.exceedsRating)}, its overload ${pct(p.overload)}, trips on reverse power ${pct(p.reversePower)}; no steady state ${pct(p.noSteadyState)}\n` +
    (r.noSteadyStateReason ? `(no steady state, e.g.: ${r.noSteadyStateReason})\n` : '') +
    `\n${CLI_CAUTION}\n`
  );
}

export const toleranceCommand: CliCommand = {
  name: 'tolerance',
  summary: 'seeded Monte-Carlo of speed, voltage and droop setpoint tolerances',
  usage:
    'droopline tolerance plant.json --samples N --seed S [--hz-tol HZ] [--v-tol-pct P] [--droop-tol-pct P] [--normal] [--load-kw N --load-kvar N] [--json]',
  valueFlags: ['samples', 'seed', 'hz-tol', 'v-tol-pct', 'droop-tol-pct', 'load-kw', 'load-kvar'],
  async run(args, io) {
    const plant = await readJson(io, args.positional[0], 'plant');
    const loadKW = numberFlag(args, 'load-kw');
    const loadKVAR = numberFlag(args, 'load-kvar');
    if (loadKVAR !== undefined && loadKW === undefined) throw new CliInputError('--load-kvar: needs --load-kw as well');
    const opt = (key: string, flag: string) => {
      const v = numberFlag(args, flag);
      return v === undefined ? {} : { [key]: v };
    };
    const request = {
      plant,
      ...opt('samples', 'samples'),
      ...opt('seed', 'seed'),
      ...opt('speedTolHz', 'hz-tol'),
      ...opt('voltageTolPct', 'v-tol-pct'),
      ...opt('droopTolPct', 'droop-tol-pct'),
      ...(args.flags.has('normal') ? { distribution: 'normal' } : {}),
      ...(loadKW === undefined ? {} : { load: { kW: loadKW, kVAR: loadKVAR ?? 0 } }),
    };
    const r = await callEngine(io, 'toleranceAnalysis', request);
    if (!r.ok) return r.exitCode;
    io.out(args.flags.has('json') ? JSON.stringify(toJson(r.value), null, 2) + '\n' : table(r.value));
    return 0;
  },
};
