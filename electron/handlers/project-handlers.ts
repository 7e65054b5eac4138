/** Handlers for project files: reading a project's text (migration and validation) and writing it (with its checksum). */
import { z } from 'zod';
import { parseProject, serializeProject } from '../project';
import { projectSchema } from '../schemas/project-schema';
import type { HandlerGroup } from './handler';
import { text } from '../schemas/schema-kit';

export const projectHandlers: HandlerGroup<'parseProject' | 'serializeProject'> = {
  parseProject: {
    schema: z.object({ text: text() }).strict(),
    run: ({ text }) => parseProject(text),
  },
  serializeProject: {
    schema: z.object({ project: projectSchema }).strict(),
    run: ({ project }) => ({ text: serializeProject(project) }),
  },
};
