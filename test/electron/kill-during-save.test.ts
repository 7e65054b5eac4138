// @vitest-environment node
/**
 * Kill during save: a child process saves two versions of a project in turn with the real
 * atomic writer and is killed (SIGKILL) at moments spread over the save cycle; the file must always be one
 * whole version (never cut short or mixed), and so must its backup. `KILL_TRIALS` sets the
 * number of trials (a few dozen here; `npm run test:kill` runs hundreds).
 */
import { describe, it, expect } from 'vitest';
import { fork } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { projectText } from '../helpers/projects';

const TRIALS = Number(process.env.KILL_TRIALS ?? 12);
const child = fileURLToPath(new URL('./fixtures/save-loop.ts', import.meta.url));

describe('kill during save', () => {
  it(`leaves a whole old or new file after each of ${TRIALS} kills at moments spread over the save cycle`, async () => {
    const dir = mkdtempSync(join(tmpdir(), 'droopline-kill-'));
    // Two complete versions, large enough that a save takes several writes.
    const a = projectText({ name: `Version A ${'a'.repeat(20_000)}` });
    const b = projectText({ name: `Version B ${'b'.repeat(40_000)}` });
    writeFileSync(join(dir, 'a.txt'), a);
    writeFileSync(join(dir, 'b.txt'), b);
    const outcomes = { a: 0, b: 0 };
    try {
      for (let trial = 0; trial < TRIALS; trial++) {
        const file = join(dir, `site-${trial}.droopline.json`);
        writeFileSync(file, a);
        const p = fork(child, [file, join(dir, 'a.txt'), join(dir, 'b.txt')], { execArgv: ['--import', 'tsx'], stdio: 'ignore' });
        await new Promise<void>((ready, fail) => {
          p.once('message', () => ready());
          p.once('error', fail);
        });
        // Kill moments spread over 0–40 ms after the child is ready, the same on every run.
        const delayMs = (trial * 17) % 41;
        await new Promise((r) => setTimeout(r, delayMs));
        p.kill('SIGKILL');
        await new Promise((r) => p.once('exit', r));
        const text = readFileSync(file, 'utf8');
        expect([a, b], `trial ${trial}: the file is one whole version`).toContain(text);
        outcomes[text === a ? 'a' : 'b']++;
        if (existsSync(`${file}.bak`)) expect([a, b], `trial ${trial}: the backup is one whole version`).toContain(readFileSync(`${file}.bak`, 'utf8'));
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    expect(outcomes.a + outcomes.b).toBe(TRIALS);
  }, 600_000);
});
