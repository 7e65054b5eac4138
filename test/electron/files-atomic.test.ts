// @vitest-environment node
import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { mkdtempSync, readdirSync, readFileSync, rmSync, utimesSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { nodeSaveSteps, writeFileAtomic, backupPathOf } from '../../electron/files/atomic-write';
import type { SaveSteps } from '../../electron/files/atomic-write';

let dir: string;
let target: string;
const OLD = '{"format":"droopline.project","name":"old"}\n';
const PREVIOUS = '{"format":"droopline.project","name":"older"}\n';
const NEW = '{"format":"droopline.project","name":"new"}\n';

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'droopline-save-'));
  target = join(dir, 'plant study.droopline.json');
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const read = (p: string) => readFileSync(p, 'utf8');
const leftovers = () => readdirSync(dir).filter((n) => n.endsWith('.tmp'));

type StepName = keyof SaveSteps;
/** The real steps, with a hook called before each one (it may throw to interrupt the save there). */
function instrumented(before: (step: StepName, args: unknown[]) => void): SaveSteps {
  const out = {} as Record<StepName, unknown>;
  for (const name of Object.keys(nodeSaveSteps) as StepName[]) {
    out[name] = (...args: unknown[]) => {
      before(name, args);
      return (nodeSaveSteps[name] as (...a: unknown[]) => Promise<unknown>)(...args);
    };
  }
  return out as unknown as SaveSteps;
}

describe('writeFileAtomic', () => {
  it('creates a new file without a backup', async () => {
    const r = await writeFileAtomic(target, NEW);
    expect(read(target)).toBe(NEW);
    expect(r.backupPath).toBeNull();
    expect(existsSync(backupPathOf(target))).toBe(false);
    expect(leftovers()).toEqual([]);
  });

  it('replaces the file and keeps the previous one as .bak', async () => {
    writeFileSync(target, OLD);
    const r = await writeFileAtomic(target, NEW);
    expect(read(target)).toBe(NEW);
    expect(r.backupPath).toBe(`${target}.bak`);
    expect(read(`${target}.bak`)).toBe(OLD);
    expect(leftovers()).toEqual([]);
  });

  it('keeps the file whole at every step where the process could die', async () => {
    writeFileSync(target, OLD);
    writeFileSync(backupPathOf(target), PREVIOUS);
    const seen: string[] = [];
    await writeFileAtomic(target, NEW, {
      steps: instrumented((step) => {
        seen.push(step);
        // A kill here leaves what is on disk now: the target must be one whole version.
        expect([OLD, NEW]).toContain(read(target));
        expect([PREVIOUS, OLD]).toContain(read(backupPathOf(target)));
      }),
    });
    expect(seen).toEqual(['writeNew', 'exists', 'readBytes', 'writeNew', 'rename', 'rename', 'syncDir', 'list']);
    expect(read(target)).toBe(NEW);
  });

  it.each(['writeNew', 'readBytes', 'rename', 'syncDir'] as const)('leaves the file and its backup intact when %s fails', async (failing) => {
    for (let nth = 1; nth <= 2; nth++) {
      writeFileSync(target, OLD);
      writeFileSync(backupPathOf(target), PREVIOUS);
      let count = 0;
      const steps = instrumented((step) => {
        if (step === failing && ++count === nth) throw Object.assign(new Error('no space left on device'), { code: 'ENOSPC' });
      });
      const result = await writeFileAtomic(target, NEW, { steps }).then(
        () => 'saved',
        (e: Error) => e.message,
      );
      if (count < nth) continue; // this step runs only once per save
      if (failing === 'syncDir') {
        // The rename already happened: the new file is complete, the old one is the backup.
        expect(result).toBe('no space left on device');
        expect(read(target)).toBe(NEW);
        expect(read(backupPathOf(target))).toBe(OLD);
      } else if (failing === 'rename' && nth === 2) {
        // The backup was refreshed, the target never replaced.
        expect(read(target)).toBe(OLD);
        expect(read(backupPathOf(target))).toBe(OLD);
      } else {
        expect(result).toBe('no space left on device');
        expect(read(target)).toBe(OLD);
        expect(read(backupPathOf(target))).toBe(PREVIOUS);
      }
      expect(leftovers()).toEqual([]);
    }
  });

  it('leaves the file intact when the disk fills half-way through writing the new text', async () => {
    writeFileSync(target, OLD);
    const steps: SaveSteps = {
      ...nodeSaveSteps,
      async writeNew(path, data) {
        // Half the bytes reach the temporary file, then the write fails.
        writeFileSync(path, typeof data === 'string' ? data.slice(0, data.length / 2) : data.slice(0, data.length / 2));
        throw Object.assign(new Error('disk full'), { code: 'ENOSPC' });
      },
    };
    await expect(writeFileAtomic(target, NEW, { steps })).rejects.toThrow('disk full');
    expect(read(target)).toBe(OLD);
    expect(leftovers()).toEqual([]);
  });

  it('after a kill mid-save, the file is whole and the next save removes the stale temporary file', async () => {
    writeFileSync(target, OLD);
    // A kill: the temporary file is written, then the process stops (no clean-up runs).
    const killed: SaveSteps = {
      ...nodeSaveSteps,
      remove: async () => undefined,
      rename: async () => {
        throw new Error('killed');
      },
    };
    await expect(writeFileAtomic(target, NEW, { steps: killed })).rejects.toThrow('killed');
    expect(read(target)).toBe(OLD);
    const stale = leftovers();
    expect(stale.length).toBeGreaterThan(0);
    const longAgo = new Date(Date.now() - 3600_000);
    for (const f of stale) utimesSync(join(dir, f), longAgo, longAgo);
    await writeFileAtomic(target, NEW);
    expect(read(target)).toBe(NEW);
    expect(leftovers()).toEqual([]);
  });

  it('keeps the backup byte for byte, even when the old file is not valid text', async () => {
    const bytes = Buffer.from([0x7b, 0xff, 0xfe, 0x00, 0x7d]);
    writeFileSync(target, bytes);
    await writeFileAtomic(target, NEW);
    expect(readFileSync(backupPathOf(target)).equals(bytes)).toBe(true);
  });
});
