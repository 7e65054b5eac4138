/**
 * The plant store: the current (last valid) plant, its rated figures, and the
 * problems of the last candidate that was refused. A refused plant never replaces
 * the current one.
 */
import { defineStore } from 'pinia';
import { ref, shallowRef } from 'vue';
import type { FieldIssue, Plant, PlantDescription } from '../../shared-types';
import demoPlant from '../demo/water-works.plant.json';
import { EngineCallError, engine, messageOf } from '../transport';

export const usePlantStore = defineStore('plant', () => {
  /** The last valid plant (defaults filled in by the schema). */
  const plant = shallowRef<Plant | null>(null);
  const description = shallowRef<PlantDescription | null>(null);
  /** Field problems of the last refused candidate. */
  const issues = ref<FieldIssue[]>([]);
  /** A sentence about the last failure, or null. */
  const error = ref<string | null>(null);
  const source = ref('');

  /** Validates `candidate`; on success it becomes the plant, otherwise the current plant stays. */
  async function load(candidate: unknown, from: string): Promise<boolean> {
    try {
      const valid = await engine().call('validatePlant', { plant: candidate });
      plant.value = valid;
      source.value = from;
      issues.value = [];
      error.value = null;
      description.value = await engine().call('describePlant', { plant: valid });
      return true;
    } catch (e) {
      issues.value = e instanceof EngineCallError ? e.issues : [];
      error.value = `${from}: ${messageOf(e)}`;
      return false;
    }
  }

  /** Loads the shipped demo plant. */
  function loadDemo(): Promise<boolean> {
    return load(structuredClone(demoPlant), 'demo plant');
  }

  return { plant, description, issues, error, source, load, loadDemo };
});
