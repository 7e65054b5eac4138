import { describePlant } from '../../electron/engine';
import { demoPlant } from '../helpers/plants';
import { bench } from './harness';
import type { BenchResult } from './harness';

export function run(): BenchResult[] {
  const plant = demoPlant();
  return [bench('describePlant, demo plant (3 sets)', () => describePlant(plant), { batch: 1000 })];
}
