/** Handlers for steady-state sharing. (Filled in by the sharing engine.) */
import { z } from 'zod';
import { EngineError } from '../engine';
import type { SharingResult, LoadSweep } from '../../shared-types';
import { plantSchema } from './plant-schema';
import type { HandlerGroup } from './handler';

const notYet = (what: string): never => {
  throw new EngineError('INTERNAL', `${what} is not available in this build yet.`);
};

export const sharingHandlers: HandlerGroup<'solveSharing' | 'sweepLoad'> = {
  solveSharing: {
    schema: z.object({ plant: plantSchema, load: z.object({ kW: z.number(), kVAR: z.number() }).optional() }),
    run: (): SharingResult => notYet('The sharing solver'),
  },
  sweepLoad: {
    schema: z.object({ plant: plantSchema, steps: z.number().int().min(2), fromPct: z.number().optional(), toPct: z.number().optional(), pf: z.number().optional() }),
    run: (): LoadSweep => notYet('The load sweep'),
  },
};
