// Times the bundled simulator in a fresh Node process, as `yardstick.mjs` times itself, and prints one line. The
// bench writes the bundle (`out/bench/engine.mjs`) and the scenarios beside it first.
//
// The engine is timed warm, as it works in the app (the engine worker stays up over many runs) and in a CLI batch:
// a cold run of the short scenario (its rate is printed too), one untimed run of the bench scenario (V8 still
// optimises the 60 s path on its background threads during the first one: about a third more CPU time), then three
// timed runs of it, of which the line gives the median.
//
//   node test/bench/simulator-run.mjs <engine.mjs> <scenario.json> <warm-up scenario.json>
// prints: simulator=js sets=… steps=… wall_s=… cpu_s=… set_steps_per_s=… cpu_set_steps_per_s=… cold_cpu_set_steps_per_s=…
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';

const [enginePath, scenarioPath, warmPath] = process.argv.slice(2);
const { simulate } = await import(pathToFileURL(enginePath).href);
const scenario = JSON.parse(readFileSync(scenarioPath, 'utf8'));
const warm = JSON.parse(readFileSync(warmPath, 'utf8'));
const sets = scenario.plant.sets.length;
const steps = Math.round((scenario.durationS * 1000) / scenario.stepMs);

function timed(sc) {
  const cpu0 = process.cpuUsage();
  const t0 = process.hrtime.bigint();
  simulate(sc);
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  const c = process.cpuUsage(cpu0);
  return { wall, cpu: (c.user + c.system) / 1e6 };
}

const cold = timed(warm);
const coldRate = (sets * Math.round((warm.durationS * 1000) / warm.stepMs)) / cold.cpu;
timed(scenario);
const runs = [timed(scenario), timed(scenario), timed(scenario)];
const mid = (k) => runs.map((r) => r[k]).sort((a, b) => a - b)[1];
const wall = mid('wall');
const cpu = mid('cpu');
const work = sets * steps;
console.log(
  `simulator=js sets=${sets} steps=${steps} wall_s=${wall.toFixed(4)} cpu_s=${cpu.toFixed(4)} set_steps_per_s=${(work / wall).toPrecision(4)} cpu_set_steps_per_s=${(work / cpu).toPrecision(4)} cold_cpu_set_steps_per_s=${coldRate.toPrecision(4)}`,
);
