/**
 * Reads a project file's text: checks it is whole, readable JSON, migrates older
 * Droopline files forward and validates the result. The one way any part of Droopline
 * (the app through the `parseProject` engine method, the CLI) reads a project.
 */
import { issueInWords } from '../../shared-types';
import type { ParsedProject, Project } from '../../shared-types';
import { z } from 'zod';
import { COMMISSIONING_PART_WORDS, COMMISSIONING_PARTS } from '../schemas/commissioning-schema';
import { projectSchema } from '../schemas/project-schema';
import { checkEvents } from '../schemas/scenario-events';
import { parseOrThrow, ValidationError } from '../schemas/validate';
import { checkAndStrip, contentChecksum, INTEGRITY_KEY } from './checksum';
import { findJsonSyntaxProblem } from './json-syntax';
import { migrateToCurrent } from './migrate-project';
import { ProjectFileError } from './project-file-error';

/** Largest project text accepted, characters (a large project is well under 1 MB). */
export const MAX_PROJECT_CHARS = 50_000_000;

function jsonOf(text: string): unknown {
  if (text.trim().length === 0) throw new ProjectFileError('empty', 'The file is empty: it holds no project. The file was not changed.');
  if (text.includes('\u0000')) {
    throw new ProjectFileError(
      'binary',
      'The file holds binary data (zero bytes), not project text. Files cut off by a power loss during writing often look like this. The file was not changed.',
    );
  }
  if (text.length > MAX_PROJECT_CHARS) {
    throw new ProjectFileError('corrupted', `The file is too large to be a project (${text.length} characters; the limit is ${MAX_PROJECT_CHARS}).`);
  }
  try {
    return JSON.parse(text) as unknown;
  } catch {
    const p = findJsonSyntaxProblem(text);
    if (p?.truncated) {
      throw new ProjectFileError(
        'truncated',
        `The file stops in the middle of the project (line ${p.line}, column ${p.column}, where ${p.expected} should follow): ` +
          'it was cut short, perhaps by a crash or a full disk while it was written. The file was not changed.',
      );
    }
    const where = p ? `line ${p.line}, column ${p.column}: expected ${p.expected}, found ${p.found}` : 'an unknown place';
    throw new ProjectFileError('corrupted', `The file is damaged: it is not valid JSON (${where}). The file was not changed.`);
  }
}

// Validated inside a wrapper so field paths read `plant.sets[1].governor.droopPct`
// (the shared formatter drops a leading `plant`, which is right for plant files only).
const wrapped = z.object({ project: projectSchema });

function validate(raw: unknown): Project {
  try {
    return parseOrThrow(wrapped, { project: raw }).project;
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    const issues = e.issues.map((i) => ({ path: i.path === 'project' ? '(root)' : i.path.replace(/^project\./, ''), message: i.message }));
    const list = issues.map((i) => `${i.path}: ${i.message}`).join('\n');
    throw new ProjectFileError(
      'invalid',
      `The project has ${issues.length === 1 ? 'a problem' : `${issues.length} problems`}; the file was not changed.\n${list}`,
      issues,
    );
  }
}

/**
 * Parses a project file. Accepts current project files, older project versions, and bare
 * plant, scenario and sync-check case files (which open as new projects).
 *
 * @throws ProjectFileError — empty, binary, truncated or damaged text; JSON that is not a
 *   Droopline file; a file from a newer Droopline; fields that break the schema (each named
 *   by path and rule). The message always says the file was not changed.
 */
export function parseProject(text: string): ParsedProject {
  const json = jsonOf(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  const { content, check } = checkAndStrip(json);
  const migrated = migrateToCurrent(content);
  const notes = [...migrated.notes];
  if (check === 'mismatch') notes.push(CHECKSUM_MISMATCH);
  const project = validate(readableCommissioning(migrated.raw, notes));
  notes.push(...scenarioNotes(project));
  return { project, migratedFrom: migrated.migratedFrom, notes };
}

/**
 * Scenario events that no longer fit the project's plant (a set or load deleted since, an event
 * beyond a shortened run): the project opens — the plant is the user's work — and the note says
 * which event will be refused when that scenario runs.
 */
function scenarioNotes(project: Project): string[] {
  const notes: string[] = [];
  for (const s of project.scenarios)
    checkEvents(s.events, s.durationS, project.plant, (path, message) =>
      notes.push(
        `Scenario "${s.name || s.id}", event ${Number(path[1]) + 1} (${String(path[2])}): ${message}; it will be refused when the scenario runs until it is changed.`,
      ),
    );
  return notes;
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const AFTER_LEFT_OUT = 'The rest of the project opened; saving writes it without that part (Save As keeps this file as it is).';

/**
 * The commissioning section is the Commissioning view's work in progress, not the plant: a damaged part of it (the
 * record, the test, the parameter choice, the iteration cap, the fit, the sign-off, the record's set) is left out
 * with a note naming the field and the rule, and the rest — of the section and of the project — opens.
 */
function readableCommissioning(raw: Record<string, unknown>, notes: string[]): Record<string, unknown> {
  const section = raw.commissioning;
  if (section === undefined || section === null) return raw;
  if (!isObject(section)) {
    const { commissioning: _left, ...rest } = raw;
    notes.push(`The commissioning work was left out (commissioning: must be an object). ${AFTER_LEFT_OUT}`);
    return rest;
  }
  const kept: Record<string, unknown> = { ...section };
  for (const key of Object.keys(COMMISSIONING_PARTS) as (keyof typeof COMMISSIONING_PARTS)[]) {
    if (!(key in kept)) continue;
    try {
      parseOrThrow(COMMISSIONING_PARTS[key] as z.ZodType, kept[key], ['commissioning', key]);
    } catch (e) {
      if (!(e instanceof ValidationError)) throw e;
      delete kept[key];
      // In words for the screen, with the field path for whoever edits the file.
      const first = e.issues.slice(0, 3).map((i) => `${issueInWords({ ...i, path: i.path.replace(/^commissioning\./, '') })} [${i.path}]`);
      const more = e.issues.length > 3 ? `, and ${e.issues.length - 3} more` : '';
      notes.push(`Commissioning: ${COMMISSIONING_PART_WORDS[key]} was left out (${first.join('; ')}${more}). ${AFTER_LEFT_OUT}`);
    }
  }
  return { ...raw, commissioning: kept };
}

/** The note of a project whose content no longer matches the checksum it was saved with. */
export const CHECKSUM_MISMATCH =
  'Check the figures before relying on them: this file was changed after Droopline saved it (its content does not match its checksum) — by hand, by another program, or by damage on the disk. Saving it again writes a new checksum.';

/**
 * The file text of a project: JSON with two-space indent and a final newline, ending with
 * its content checksum (`integrity.sha256`, see `checksum.ts`). Saving what `parseProject`
 * returned and reading it again gives an identical project.
 */
export function serializeProject(project: Project): string {
  const { [INTEGRITY_KEY]: _old, ...content } = project as Project & { [INTEGRITY_KEY]?: unknown };
  return `${JSON.stringify({ ...content, [INTEGRITY_KEY]: { sha256: contentChecksum(content) } }, null, 2)}\n`;
}
