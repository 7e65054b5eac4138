/**
 * The simulator against the speed yardstick, in the same run on the same machine: 8 sets, 60 s at 1 ms.
 *
 * - The simulator is measured as it ships: the engine bundled by Vite (as the app's worker and the CLI are) into
 *   `out/bench/engine.mjs`, each round in a fresh Node process of its own (`simulator-run.mjs`), as the yardstick
 *   runs, timed on CPU time (what the run costs one core, whatever else shares the machine) and on wall time. Not in
 *   this process: it holds the bundler's heap, and the run's own garbage collection then walks that too (the same
 *   run measured here came out about a fifth slower). The child times the engine warm (see `simulator-run.mjs`) and
 *   also prints its first, cold run's rate.
 * - `test/bench/yardstick.mjs` (JavaScript) runs as a child process; `test/bench/yardstick.c` is compiled with `cc`
 *   when a C compiler is on the path, else skipped with a line that says so.
 * - `--reference "<command>"` times any other command the same way (it must print `set-steps/s=<number>` or
 *   `set_steps_per_s=<number>`); its figure is wall time, compared with the simulator's wall time.
 * Rounds alternate (simulator, yardsticks, reference) so a busy machine slows all alike; medians of the rounds.
 */
import { execFileSync, execSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { build } from 'vite';
import type { Scenario } from '../../shared-types';
import { benchScenario } from './simulation.bench';
import type { BenchResult } from './harness';

const SETS = 8;
const STEPS = 60_000;
// Each round is a fresh process, and a process runs either fast or markedly slower (both the simulator and the
// JavaScript yardstick, with the same inlining; placement in memory is the likely cause): nine rounds, the median,
// and the range beside it.
const ROUNDS = 9;

interface Rate {
  wall: number;
  cpu: number | null;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

function parseRate(text: string): Rate {
  const cpu = /cpu_set_steps_per_s=([0-9.e+]+)/.exec(text);
  const wall = /set[-_]steps(?:\/s|_per_s)=([0-9.e+]+)/.exec(text.replace(/cpu_set_steps_per_s=[0-9.e+]+/, ''));
  if (!wall) throw new Error(`no set-steps/s in the output: ${text.trim().slice(0, 200)}`);
  return { wall: Number(wall[1]), cpu: cpu ? Number(cpu[1]) : null };
}

/** Bundles the engine the way the app and the CLI are bundled; returns the bundle's path. */
async function shippedEngine(): Promise<string> {
  const outDir = join(process.cwd(), 'out/bench');
  await build({
    logLevel: 'warn',
    configFile: false,
    build: {
      ssr: 'electron/engine/index.ts',
      outDir,
      emptyOutDir: true,
      target: 'node20',
      minify: false,
      rolldownOptions: { output: { entryFileNames: 'engine.mjs', format: 'es' } },
    },
    ssr: { noExternal: true },
  });
  return join(outDir, 'engine.mjs');
}

/** Writes `sc` as JSON beside the bundle for the child process; returns the path. */
function scenarioFile(name: string, sc: Scenario): string {
  const path = join(process.cwd(), 'out/bench', name);
  writeFileSync(path, JSON.stringify(sc));
  return path;
}

function compileC(): string | null {
  try {
    execSync('command -v cc', { stdio: 'ignore' });
  } catch {
    return null;
  }
  mkdirSync('out/bench', { recursive: true });
  const exe = join(process.cwd(), 'out/bench/yardstick');
  execFileSync('cc', ['-O3', '-march=native', '-ffast-math', 'test/bench/yardstick.c', '-lm', '-o', exe]);
  return exe;
}

function referenceArg(): string | null {
  const i = process.argv.indexOf('--reference');
  if (i < 0) return null;
  const cmd = process.argv[i + 1];
  if (!cmd) throw new Error('--reference needs a command in quotes, e.g. --reference "node my-loop.mjs 8 60000"');
  return cmd;
}

export async function run(): Promise<BenchResult[]> {
  const engine = await shippedEngine();
  const scPath = scenarioFile('scenario-60s.json', benchScenario(SETS, STEPS / 1000));
  const warmPath = scenarioFile('scenario-5s.json', benchScenario(SETS, 5));
  const cExe = compileC();
  const reference = referenceArg();
  const sim: Rate[] = [];
  const js: Rate[] = [];
  const c: Rate[] = [];
  const ref: Rate[] = [];
  const cold: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    const text = execFileSync(process.execPath, ['test/bench/simulator-run.mjs', engine, scPath, warmPath], { encoding: 'utf8' });
    sim.push(parseRate(text));
    cold.push(Number(/cold_cpu_set_steps_per_s=([0-9.e+]+)/.exec(text)?.[1]));
    js.push(parseRate(execFileSync(process.execPath, ['test/bench/yardstick.mjs', String(SETS), String(STEPS)], { encoding: 'utf8' })));
    if (cExe) c.push(parseRate(execFileSync(cExe, [String(SETS), String(STEPS)], { encoding: 'utf8' })));
    if (reference) ref.push(parseRate(execSync(reference, { encoding: 'utf8' })));
  }
  const M = (xs: Rate[], k: 'wall' | 'cpu') => median(xs.map((x) => x[k] ?? Number.NaN));
  const fmt = (v: number) => `${(v / 1e6).toFixed(2)} M`;
  const range = (xs: Rate[]) => {
    const v = xs.map((x) => x.cpu ?? Number.NaN);
    return `${fmt(Math.min(...v))}–${fmt(Math.max(...v))}`;
  };
  const simCpu = M(sim, 'cpu');
  const simWall = M(sim, 'wall');
  const out: BenchResult[] = [];
  const row = (name: string, rate: Rate[], extra: Record<string, string>): BenchResult => ({
    name,
    medianMs: ((SETS * STEPS) / M(rate, 'wall')) * 1000,
    runs: rate.length,
    extra: { 'set-steps/s (wall)': fmt(M(rate, 'wall')), ...(rate[0]?.cpu != null ? { 'set-steps/s (CPU time)': fmt(M(rate, 'cpu')) } : {}), ...extra },
  });
  out.push(
    row(`simulate as shipped (bundled, own process, warm), ${SETS} sets, 60 s at 1 ms`, sim, {
      'range over the rounds (CPU time)': range(sim),
      'cold first run of 5 s (CPU time)': fmt(median(cold)),
    }),
  );
  out.push(
    row('yardstick, JavaScript (test/bench/yardstick.mjs)', js, {
      'range over the rounds (CPU time)': range(js),
      'simulator ÷ yardstick (CPU time)': `${(simCpu / M(js, 'cpu')).toFixed(2)}×`,
    }),
  );
  if (cExe)
    out.push(
      row('yardstick, C (test/bench/yardstick.c, cc -O3 -march=native -ffast-math)', c, {
        'simulator ÷ C (CPU time)': `${(simCpu / M(c, 'cpu')).toFixed(2)}×`,
      }),
    );
  else out.push({ name: 'yardstick, C: skipped (no C compiler `cc` on the path)', medianMs: Number.NaN, runs: 0 });
  if (reference) out.push(row(`reference: ${reference}`, ref, { 'simulator ÷ reference (wall)': `${(simWall / M(ref, 'wall')).toFixed(2)}×` }));
  return out;
}
