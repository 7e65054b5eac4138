/** Trainer costs: one live frame (engine alone and through the handler's validation), and the verdict of a close. */
import { judgeClose, startExercise, stepTrainer } from '../../electron/engine/trainer';
import { dispatch } from '../../electron/handlers';
import type { TrainerState } from '../../shared-types';
import { demoPlant } from '../helpers/plants';
import { bench } from './harness';
import type { BenchResult } from './harness';

function closed(s0: TrainerState): TrainerState {
  let s = stepTrainer(s0, { speed: 0, voltage: 0, close: true }, 0.01);
  while (s.phase !== 'closed') s = stepTrainer(s, { speed: 0, voltage: 0 }, 0.05);
  return s;
}

export async function run(): Promise<BenchResult[]> {
  const plant = demoPlant();
  let s = startExercise({ seed: 1, levelId: 'drifting-bus' });
  const frame = bench(
    'trainerStep engine, one 1/60 s frame (17 substeps)',
    () => {
      s = stepTrainer(s, { speed: 1, voltage: 0 }, 1 / 60);
      if (s.incomingFrequencyHz > 54) s = startExercise({ seed: 1, levelId: 'drifting-bus' });
    },
    { batch: 200 },
  );
  // Through the handler table as the worker runs it: JSON copy + schema check + step.
  let d = startExercise({ seed: 2, levelId: 'steady' });
  const samples: number[] = [];
  for (let i = 0; i < 300; i++) {
    const t0 = performance.now();
    const r = await dispatch('trainerStep', JSON.parse(JSON.stringify({ state: d, inputs: { speed: 0, voltage: 0 }, dtS: 1 / 60 })));
    samples.push(performance.now() - t0);
    if (r.ok) d = r.value;
  }
  samples.sort((a, b) => a - b);
  const viaHandler: BenchResult = { name: 'trainerStep through the handler (validation included), one frame', medianMs: samples[150]!, runs: samples.length };
  const standard = closed(startExercise({ seed: 3, levelId: 'steady' }));
  const fromPlant = closed(startExercise({ seed: 3, levelId: 'steady', plant, incomingSetId: 'G3' }));
  return [
    frame,
    viaHandler,
    bench('trainerClose, two-machine traces (3 s, twice: attempt and edge reference)', () => judgeClose(standard), { batch: 5 }),
    bench('trainerClose, plant simulator traces (demo plant, 3 s, twice)', () => judgeClose(fromPlant, {}, plant), { minMs: 1500 }),
  ];
}
