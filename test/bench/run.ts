/**
 * `npm run bench`: runs every suite and prints a Markdown table with the machine.
 * Add a suite by writing `test/bench/<name>.bench.ts` exporting `run(): BenchResult[]`
 * and listing it below.
 */
import { cpus, totalmem } from 'node:os';
import { formatResult } from './harness';
import type { BenchResult } from './harness';
import * as describeSuite from './describe.bench';
import * as syncSuite from './sync.bench';
import * as simulationSuite from './simulation.bench';
import * as trainerSuite from './trainer.bench';
import * as sharingSuite from './sharing.bench';
import * as plannerSuite from './planner.bench';
import * as poolSuite from './pool.bench';
import * as yardstickSuite from './yardstick.bench';
import * as browserSuite from './browser.bench';
import * as commissioningSuite from './commissioning.bench';

const suites: { name: string; run(): BenchResult[] | Promise<BenchResult[]> }[] = [
  { name: 'plant', run: describeSuite.run },
  { name: 'sync', run: syncSuite.run },
  { name: 'simulation', run: simulationSuite.run },
  { name: 'trainer', run: trainerSuite.run },
  { name: 'sharing', run: sharingSuite.run },
  { name: 'planner', run: plannerSuite.run },
  { name: 'pool', run: poolSuite.run },
  { name: 'yardstick', run: yardstickSuite.run },
  { name: 'browser', run: browserSuite.run },
  { name: 'commissioning', run: commissioningSuite.run },
];

// `BENCH_SUITES=pool,planner npm run bench` or `npm run bench -- --only pool,planner` runs only the suites named.
const onlyAt = process.argv.indexOf('--only');
const only = (onlyAt >= 0 ? (process.argv[onlyAt + 1] ?? '') : (process.env.BENCH_SUITES ?? '')).split(',').filter((a) => a !== '');
const chosen = only.length > 0 ? suites.filter((s) => only.includes(s.name)) : suites;
const cpu = cpus()[0]?.model ?? 'unknown CPU';
process.stdout.write(`Machine: ${cpu}, ${cpus().length} cores, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}\n\n`);
process.stdout.write('| case | median per call | calls |\n| --- | --- | --- |\n');
for (const s of chosen) {
  for (const r of await s.run()) process.stdout.write(formatResult(r) + '\n');
}
