/**
 * Handlers for synchronizing: the sync-check verdict, the preset list and the closing map (in chunks, with progress
 * and cancelling). Their schemas are in `electron/schemas/sync-schema.ts`.
 */
import { z } from 'zod';
import { evaluateSync, listSyncPresets } from '../engine';
import { runClosingMap } from './long-jobs';
import type { HandlerGroup } from './handler';
import { closingMapRequestSchema, syncCaseSchema } from '../schemas/sync-schema';

// The closing map's chunked run is shared with the report (long-jobs.ts).
export { runClosingMap };

export const syncHandlers: HandlerGroup<'evaluateSync' | 'listSyncPresets' | 'closingMap'> = {
  evaluateSync: { schema: syncCaseSchema, run: (c) => evaluateSync(c) },
  listSyncPresets: { schema: z.object({}).strict(), run: () => listSyncPresets() },
  closingMap: { schema: closingMapRequestSchema, run: (req, ctx) => runClosingMap(req, ctx) },
};
