/** Handlers for synchronizing. (Filled in by the synchronizing engine.) */
import { z } from 'zod';
import { EngineError } from '../engine';
import type { ClosingMap, ClosingMapRequest, SyncCase, SyncPreset, SyncResult } from '../../shared-types';
import type { HandlerGroup } from './handler';

const notYet = (what: string): never => {
  throw new EngineError('INTERNAL', `${what} is not available in this build yet.`);
};

export const syncHandlers: HandlerGroup<'evaluateSync' | 'listSyncPresets' | 'closingMap'> = {
  evaluateSync: { schema: z.custom<SyncCase>(), run: (): SyncResult => notYet('Sync-check') },
  listSyncPresets: { schema: z.object({}).strict(), run: (): SyncPreset[] => [] },
  closingMap: { schema: z.custom<ClosingMapRequest>(), run: (): ClosingMap => notYet('The closing map') },
};
