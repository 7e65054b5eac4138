/**
 * Fuzz of the file readers: `parseProject` over a valid project mutated at random leaves (extremes,
 * wrong types, missing fields, text in number fields), over plant, scenario and sync-check files (which
 * it migrates), and over raw text damage (a flipped byte, a cut, an inserted character). It must either
 * open the file or refuse it with a `ProjectFileError` whose sentence is there and, for an invalid file,
 * names each field; what it opens saves and reopens to the same project. A project with a commissioning section is
 * fuzzed too, and a mutation inside that section never refuses the file: the damaged part is left out with a note
 * naming its field. `FUZZ_RUNS` (npm run test:fuzz)
 * sets the cases.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseProject, ProjectFileError, serializeProject } from '../../electron/project';
import { demoPlantJson } from '../helpers/plants';
import { rawCommissioning, rawProject } from '../helpers/projects';

const RUNS = Number(process.env.FUZZ_RUNS ?? 120);
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const MISSING = Symbol('missing');
const replacement = fc.oneof(
  fc.constantFrom<unknown>(0, -1, 1e308, -1e308, 5e-324, 2 ** 53, 'NaN', 'Infinity', '', null, true, [], {}, MISSING),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.string({ maxLength: 6 }),
);

function leafPaths(v: unknown, at: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  if (Array.isArray(v)) v.forEach((x, i) => leafPaths(x, [...at, i], out));
  else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) leafPaths(x, [...at, k], out);
  else out.push(at);
  return out;
}

function mutate(root: unknown, path: (string | number)[], value: unknown): unknown {
  const copy = JSON.parse(JSON.stringify(root)) as Record<string | number, unknown>;
  let o = copy;
  for (const k of path.slice(0, -1)) o = o[k] as Record<string | number, unknown>;
  const last = path[path.length - 1]!;
  if (value === MISSING) delete o[last];
  else o[last] = value;
  return copy;
}

const tally = { opened: 0, refused: 0 };

/** Opens or refuses as the contract says; anything else fails the property. */
function judge(text: string): void {
  let parsed;
  try {
    parsed = parseProject(text);
  } catch (e) {
    expect(e, `untyped throw: ${String(e)}`).toBeInstanceOf(ProjectFileError);
    const err = e as ProjectFileError;
    expect(err.message.length).toBeGreaterThan(20);
    if (err.problem === 'invalid') {
      expect(err.issues.length).toBeGreaterThan(0);
      for (const issue of err.issues) expect(issue.path, issue.message).not.toBe('');
    }
    tally.refused++;
    return;
  }
  const again = parseProject(serializeProject(parsed.project)).project;
  expect(again).toEqual(parsed.project);
  tally.opened++;
}

const files: [string, unknown][] = [
  ['project', rawProject()],
  ['project with commissioning work', rawProject({ commissioning: rawCommissioning() })],
  ['plant file', demoPlantJson()],
  [
    'scenario file',
    { format: 'droopline.scenario', version: 1, plant: demoPlantJson(), durationS: 5, stepMs: 1, events: [{ atS: 1, type: 'trip', setId: 'G1' }] },
  ],
];

describe('file readers under fuzz', () => {
  for (const [what, raw] of files) {
    const paths = leafPaths(raw);
    it(`parseProject: a ${what} with one leaf mutated opens or is refused with the field named`, () => {
      fc.assert(
        fc.property(fc.integer({ min: 0, max: paths.length - 1 }), replacement, (i, value) => judge(JSON.stringify(mutate(raw, paths[i]!, value)))),
        { numRuns: RUNS, seed: SEED },
      );
    });
  }

  it('parseProject: damage inside the commissioning section opens the project, naming the field of any part left out', () => {
    const raw = rawProject({ commissioning: rawCommissioning() });
    const paths = leafPaths(raw).filter((p) => p[0] === 'commissioning');
    fc.assert(
      fc.property(fc.integer({ min: 0, max: paths.length - 1 }), replacement, (i, value) => {
        const path = paths[i]!;
        const { project, notes } = parseProject(JSON.stringify(mutate(raw, path, value)));
        const part = String(path[1]);
        const left = !(part in (project.commissioning ?? {}));
        // A part is left out only with a note naming a field inside it; a part kept has no note.
        if (left && value !== MISSING) expect(notes.join(' ')).toContain(`commissioning.${part}`);
        if (!left) expect(notes.join(' ')).not.toContain(`commissioning.${part}`);
        expect(project.sync?.incomingSetId).toBe('G2');
        expect(parseProject(serializeProject(project)).project).toEqual(project);
      }),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('parseProject: raw damage to a saved project (flipped byte, cut, inserted character) is refused in words or opens intact', () => {
    const text = serializeProject(parseProject(JSON.stringify(rawProject())).project);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: text.length - 1 }),
        fc.constantFrom('flip', 'cut', 'insert'),
        fc.integer({ min: 0, max: 0xffff }),
        (at, kind, code) => {
          const ch = String.fromCharCode(code);
          const damaged =
            kind === 'flip'
              ? text.slice(0, at) + String.fromCharCode(text.charCodeAt(at) ^ (1 << (code % 8))) + text.slice(at + 1)
              : kind === 'cut'
                ? text.slice(0, at)
                : text.slice(0, at) + ch + text.slice(at);
          judge(damaged);
        },
      ),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('tried both outcomes', () => {
    // The tally shows the fuzz reached both sides of the reader (opened and refused files).
    expect(tally.opened).toBeGreaterThan(0);
    expect(tally.refused).toBeGreaterThan(0);
  });
});
