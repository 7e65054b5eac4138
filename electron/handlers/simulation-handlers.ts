/** Handlers for the time-domain simulator. (Filled in by the simulator.) */
import { z } from 'zod';
import { EngineError } from '../engine';
import type { Scenario, SimulationResult } from '../../shared-types';
import type { HandlerGroup } from './handler';

export const simulationHandlers: HandlerGroup<'simulate'> = {
  simulate: {
    schema: z.custom<Scenario>(),
    run: (): SimulationResult => {
      throw new EngineError('INTERNAL', 'The simulator is not available in this build yet.');
    },
  },
};
