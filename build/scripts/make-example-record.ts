/**
 * Writes `renderer/demo/example.load-bank.csv`: an invented load-bank test record of the demo
 * plant's set G1, made by the simulator from dynamics a little unlike the demo's (so a fit has
 * something to find), sampled every 20 ms with seeded noise. Run: `npx tsx build/scripts/make-example-record.ts`.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { plantSchema } from '../../electron/handlers';
import { simulate, withParameters } from '../../electron/engine';
import { CSV_CAUTION_LINE } from '../../shared-types';
import type { FitParameterKey, Plant } from '../../shared-types';

const plant = plantSchema.parse(JSON.parse(readFileSync('renderer/demo/water-works.plant.json', 'utf8'))) as Plant;
const keys: FitParameterKey[] = ['machine.inertiaS', 'governor.engineLagS', 'regulator.gainPU', 'regulator.exciterLagS'];
const onSite = [1.6, 0.45, 35, 0.18];
const g1 = withParameters(plant.sets[0]!, keys, onSite);
const test: Plant = {
  ...plant,
  sets: [g1],
  loads: [{ id: 'bank', name: 'load bank', online: true, kW: 250, kVAR: 150, model: 'constant-power', frequencySensitivity: 0 }],
};
// The step falls between two samples (2.00 s and 2.02 s), as a real record has it: no sample is taken at the
// very instant the load bank closes, so record and model agree on which samples come before the step.
const STEP_AT_S = 2.01;
const r = simulate({
  plant: test,
  durationS: 8.01,
  stepMs: 1,
  outputPoints: 8010,
  events: [{ atS: STEP_AT_S, type: 'load-step', kW: 500, kVAR: 300, model: 'constant-power' }],
});
const s = r.series;
const rng = xoroshiro128plus(20261202);
const noise = (a: number) => a * (2 * uniformFloat64(rng) - 1);
const lines = [
  CSV_CAUTION_LINE,
  '# Example load-bank test record (invented data): set G1 of the demo plant alone on the bus,',
  '# load bank at 250 kW / 150 kVAR, a step of 500 kW / 300 kVAR at 2.01 s (between the 2.00 s and 2.02 s samples), sampled every 20 ms.',
  'time_s,frequency_Hz,voltage_V,P_kW,Q_kVAR',
];
let j = 0;
for (let k = 0; k <= 400; k++) {
  const t = k * 0.02;
  while (j < s.t.length - 2 && s.t[j + 1]! < t) j++;
  const w = Math.min(1, Math.max(0, (t - s.t[j]!) / (s.t[j + 1]! - s.t[j]!)));
  const at = (y: number[]) => y[j]! + (y[j + 1]! - y[j]!) * w;
  lines.push(
    [
      t.toFixed(2),
      (at(s.setSpeedHz[0]!) + noise(0.005)).toFixed(3),
      (at(s.setTerminalV[0]!) + noise(0.3)).toFixed(1),
      (at(s.setKW[0]!) + noise(2)).toFixed(0),
      (at(s.setKVAR[0]!) + noise(2)).toFixed(0),
    ].join(','),
  );
}
writeFileSync('renderer/demo/example.load-bank.csv', lines.join('\n') + '\n');
