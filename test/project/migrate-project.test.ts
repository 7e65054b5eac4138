import { describe, it, expect } from 'vitest';
import { runMigrations, PROJECT_MIGRATIONS, ProjectFileError } from '../../electron/project';
import type { MigrationStep } from '../../electron/project';
import { PROJECT_VERSION } from '../../shared-types';

// Two made-up steps exercise the chain; the real table is PROJECT_MIGRATIONS.
const steps: MigrationStep[] = [
  { from: 2, note: 'sync became a list', run: (o) => ({ ...o, syncCases: o.sync === null ? [] : [o.sync], sync: undefined }) },
  { from: 1, note: 'view settings moved', run: (o) => ({ ...o, view: { legacy: o.viewSettings ?? {} }, viewSettings: undefined }) },
];

describe('runMigrations', () => {
  it('applies the steps in version order and stamps each new version', () => {
    const old = Object.freeze({ format: 'droopline.project', version: 1, sync: { a: 1 }, viewSettings: { zoom: 2 } });
    const out = runMigrations(old, 1, 3, steps);
    expect(out.raw).toMatchObject({ version: 3, view: { legacy: { zoom: 2 } }, syncCases: [{ a: 1 }] });
    expect(out.notes).toEqual(['view settings moved', 'sync became a list']);
    expect(out.migratedFrom).toBe('a project file, version 1');
    expect(old).toEqual({ format: 'droopline.project', version: 1, sync: { a: 1 }, viewSettings: { zoom: 2 } });
  });

  it('returns a current file untouched', () => {
    const current = { version: 3 };
    expect(runMigrations(current, 3, 3, steps)).toEqual({ raw: current, migratedFrom: null, notes: [] });
  });

  it('refuses a version with no step instead of guessing', () => {
    expect(() => runMigrations({ version: 1 }, 1, 3, [steps[0]!])).toThrow(ProjectFileError);
    expect(() => runMigrations({ version: 1 }, 1, 3, [steps[0]!])).toThrow('Project files of version 1 cannot be read by this version of Droopline.');
  });

  it('has a step for every project version older than the current one', () => {
    for (let v = 1; v < PROJECT_VERSION; v++)
      expect(
        PROJECT_MIGRATIONS.some((s) => s.from === v),
        `step from ${v}`,
      ).toBe(true);
  });
});
