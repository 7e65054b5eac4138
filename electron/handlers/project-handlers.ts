/** Handlers for project files: reading a project's text (migration and validation). */
import { z } from 'zod';
import { parseProject } from '../project';
import type { HandlerGroup } from './handler';

export const projectHandlers: HandlerGroup<'parseProject'> = {
  parseProject: {
    schema: z.object({ text: z.string({ error: 'must be text' }) }).strict(),
    run: ({ text }) => parseProject(text),
  },
};
