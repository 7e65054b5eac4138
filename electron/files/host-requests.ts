/** Schemas of the host requests: main treats every payload as unknown until it passes. */
import { z } from 'zod';
import type { HostMethod, HostRequest } from '../../shared-types';

const empty = z.object({}).strict();
/** Longest text the renderer may send (a project is far smaller). */
const MAX_TEXT = 50_000_000;
const text = z.string({ error: 'must be text' }).max(MAX_TEXT, `must be at most ${MAX_TEXT} characters`);
const path = z.string({ error: 'must be text' }).min(1, 'must not be empty').max(4096, 'must be at most 4096 characters');
const name = z.string({ error: 'must be text' }).max(400, 'must be at most 400 characters');

/** The preload's drop channel (`HOST_OPEN_DROPPED`). */
export const dropRequestSchema = z.object({ path }).strict();

/** The schema of every host method's request. */
export const hostRequestSchemas: { [K in HostMethod]: z.ZodType<HostRequest<K>> } = {
  fileOpenDialog: empty,
  fileOpenPath: z.object({ path }).strict(),
  fileSave: z.object({ path, text }).strict(),
  fileSaveAs: z.object({ suggestedName: name, text }).strict(),
  recentList: empty,
  recentClear: empty,
  recoveryRead: empty,
  recoveryWrite: z.object({ projectName: name, path: path.nullable(), fileName: name.nullable(), text }).strict(),
  recoveryDiscard: empty,
  documentState: z
    .object({ projectName: name, fileName: name.nullable(), path: path.nullable(), dirty: z.boolean({ error: 'must be true or false' }) })
    .strict(),
  windowClose: empty,
  reportSavePdf: z.object({ html: text, suggestedName: name }).strict(),
};
