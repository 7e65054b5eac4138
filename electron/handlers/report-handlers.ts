/**
 * Handler for the plant report. The report's engine calls go through the other groups'
 * own handlers (schema, then engine), so each section gets the same validation and the same
 * numbers as the app's views and the CLI.
 */
import { z } from 'zod';
import type { BuildReportRequest, EngineMethod, EngineRequest, EngineResponse } from '../../shared-types';
import { buildReport } from '../engine/report';
import type { ReportEngine } from '../engine/report';
import { breathe } from './handler';
import type { Handler, HandlerContext, HandlerGroup } from './handler';
import { plantSchema } from '../schemas/plant-schema';
import { projectScenarioSchema, projectSyncSettingsSchema } from '../schemas/project-schema';
import { id, num, positive, text } from '../schemas/schema-kit';
import { sharingHandlers } from './sharing-handlers';
import { simulationHandlers } from './simulation-handlers';
import { syncHandlers } from './sync-handlers';
import { parseOrThrow } from '../schemas/validate';

const requestSchema: z.ZodType<BuildReportRequest> = z.object({
  project: z.object({
    name: text().optional(),
    plant: plantSchema,
    scenarios: z.array(projectScenarioSchema).optional(),
    sync: projectSyncSettingsSchema.nullable().optional(),
  }),
  date: id(),
  loadsPct: z
    .array(positive('%').max(200, { message: 'must be at most 200' }))
    .min(1, { message: 'must list at least one load' })
    .max(12, { message: 'must list at most 12 loads' })
    .optional(),
  loadPF: positive('').max(1, { message: 'must be at most 1' }).optional(),
  closingMap: z
    .object({
      angleSteps: num('steps').int().min(3).max(361).optional(),
      slipSteps: num('steps').int().min(3).max(201).optional(),
      slipRangeHz: positive('Hz').max(5, { message: 'must be at most 5' }).optional(),
    })
    .optional(),
});

/** Runs another method's handler (its schema, then its engine call) with a sub-context. */
async function via<K extends EngineMethod>(handler: Handler<K>, request: EngineRequest<K>, ctx: HandlerContext): Promise<EngineResponse<K>> {
  await breathe();
  return handler.run(parseOrThrow(handler.schema, request), ctx);
}

/** The report's engine port over the handler table. */
function reportEngine(ctx: HandlerContext): ReportEngine {
  const sub = (progress: (f: number) => void): HandlerContext => ({ progress: (f) => progress(f), signal: ctx.signal });
  const quiet = sub(() => undefined);
  return {
    solveSharing: (r) => via(sharingHandlers.solveSharing, r, quiet),
    listSyncPresets: () => via(syncHandlers.listSyncPresets, {}, quiet),
    evaluateSync: (c) => via(syncHandlers.evaluateSync, c, quiet),
    closingMap: (r, progress) => via(syncHandlers.closingMap, r, sub(progress)),
    simulate: (s, progress) => via(simulationHandlers.simulate, s, sub(progress)),
    progress: (fraction, label) => ctx.progress(fraction, label),
    isCancelled: () => ctx.signal.aborted,
  };
}

export const reportHandlers: HandlerGroup<'buildReport'> = {
  buildReport: {
    schema: requestSchema,
    run: (request, ctx) => buildReport(request, reportEngine(ctx)),
  },
};
