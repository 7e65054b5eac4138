/**
 * Handlers for the time-domain simulator: `simulate`, run in chunks with progress and cancelling. Its schema (the
 * `droopline.scenario` file) is in `electron/schemas/simulation-schema.ts`.
 */
import type { HandlerGroup } from './handler';
import { runScenario } from './long-jobs';
import { scenarioSchema } from '../schemas/simulation-schema';

export const simulationHandlers: HandlerGroup<'simulate'> = {
  simulate: {
    schema: scenarioSchema,
    run: (request, ctx) => runScenario(request, ctx),
  },
};
