/** Small plant builders for tests (fields not given take the schema's defaults). */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { plantSchema } from '../../electron/handlers';
import type { Plant } from '../../shared-types';

/** The shipped demo plant, as raw JSON. */
export function demoPlantJson(): unknown {
  return JSON.parse(readFileSync(join(process.cwd(), 'renderer/demo/water-works.plant.json'), 'utf8')) as unknown;
}

/** The demo plant, validated with defaults filled in. */
export function demoPlant(): Plant {
  return plantSchema.parse(demoPlantJson());
}

/** A raw set description in droop / reactive droop with sensible defaults; override freely. */
export function rawSet(id: string, over: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    id,
    ratedKVA: 1250,
    ratedKW: 1000,
    ratedPF: 0.8,
    poles: 4,
    governor: { mode: 'droop', droopPct: 4, noLoadHz: 52 },
    regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 416 },
    ...over,
  };
}

/** A raw plant file around the given sets and loads. */
export function rawPlant(sets: unknown[], loads: unknown[] = [], over: Record<string, unknown> = {}): Record<string, unknown> {
  return { format: 'droopline.plant', version: 1, name: 'test plant', ratedFrequencyHz: 50, ratedVoltageV: 400, sets, loads, ...over };
}

/** Builds and validates a plant (throws if the builder made an invalid one). */
export function makePlant(sets: unknown[], loads: unknown[] = [], over: Record<string, unknown> = {}): Plant {
  return plantSchema.parse(rawPlant(sets, loads, over));
}
