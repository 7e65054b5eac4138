/**
 * The parts of a project kept by other stores, each with `snapshot()` (plain data for the
 * file) and `restore()` (opening a file). A part whose store is missing here is kept by
 * the project store exactly as the opened file had it, so nothing is lost on save.
 */
import type { Project } from '../../shared-types';
import { useCommissioningStore } from './commissioning';
import { useSyncStore } from './sync';
import { useTrainerStore } from './trainer';
import { useTransientsStore } from './transients';

/** One part of the project owned by a store. */
export interface ProjectPart<K extends PartKey> {
  snapshot(): Project[K];
  restore(value: Project[K]): void;
}

/** The project's parts besides the plant (the plant store is wired in the project store). */
export type PartKey = 'scenarios' | 'sync' | 'trainerLog' | 'trainerExercises' | 'commissioning';

/** The stores that own parts (call inside a Pinia-enabled context). */
export function projectParts(): { [K in PartKey]?: ProjectPart<K> } {
  const transients = useTransientsStore();
  const sync = useSyncStore();
  const trainer = useTrainerStore();
  const commissioning = useCommissioningStore();
  return {
    scenarios: { snapshot: () => transients.snapshot(), restore: (list) => transients.restore(list) },
    sync: { snapshot: () => sync.snapshot(), restore: (settings) => sync.restore(settings) },
    trainerLog: { snapshot: () => trainer.snapshot(), restore: (log) => trainer.restore(log) },
    trainerExercises: { snapshot: () => trainer.snapshotExercises(), restore: (sets) => trainer.restoreExercises(sets) },
    commissioning: { snapshot: () => commissioning.snapshot(), restore: (work) => commissioning.restore(work) },
  };
}
