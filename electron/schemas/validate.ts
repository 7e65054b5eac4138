/** Turns schema failures into "field: rule" messages. */
import type { z } from 'zod';
import type { FieldIssue } from '../../shared-types';
import { EngineError } from '../engine';

/**
 * Formats a zod path as `sets[1].governor.droopPct`. A leading `plant` segment is
 * dropped: the plant is the document the user edits, so its fields are named from it.
 */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  const parts = path[0] === 'plant' && path.length > 1 ? path.slice(1) : path;
  for (const part of parts) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out || '(root)';
}

/** Thrown when a request breaks its schema; lists every field problem. */
export class ValidationError extends EngineError {
  readonly issues: FieldIssue[];
  constructor(issues: FieldIssue[]) {
    super('INVALID_INPUT', issues.map((i) => `${i.path}: ${i.message}`).join('\n'));
    this.issues = issues;
  }
}

function valueAt(root: unknown, path: readonly PropertyKey[]): unknown {
  let v = root;
  for (const k of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PropertyKey, unknown>)[k];
  }
  return v;
}

/** Parses `value` with `schema`, or throws a `ValidationError` naming each field and rule. */
export function parseOrThrow<T>(schema: z.ZodType<T>, value: unknown, prefix: readonly PropertyKey[] = []): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const issues = r.error.issues.map((i) => {
    let message = i.message;
    if (i.code === 'invalid_type') {
      const at = valueAt(value, i.path);
      if (at === undefined) message = 'is required';
      else if (i.expected === 'object') message = 'must be an object';
      else if (i.expected === 'array') message = 'must be a list';
    }
    if (i.code === 'unrecognized_keys') message = `unknown field(s): ${(i as { keys: string[] }).keys.join(', ')}`;
    return { path: formatPath([...prefix, ...i.path]), message };
  });
  // Cross-field rules may restate a field's own failure: keep the first message per field.
  const seen = new Set<string>();
  throw new ValidationError(issues.filter((i) => !seen.has(i.path) && seen.add(i.path)));
}
