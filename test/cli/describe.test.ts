import { describe, it, expect } from 'vitest';
import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { runCli } from '../../electron/cli/run-cli';
import { demoPlantJson } from '../helpers/plants';
import { memoryIO } from '../helpers/memory-io';

const run = promisify(execFile);

describe('droopline describe', () => {
  it('prints JSON with rated figures and exits 0', async () => {
    const io = memoryIO({ 'plant.json': JSON.stringify(demoPlantJson()) });
    const code = await runCli(['describe', 'plant.json', '--json'], io);
    expect(code).toBe(0);
    const out = JSON.parse(io.stdout()) as { sets: { ratedSpeedRpm: number }[]; onlineKW: number };
    expect(out.sets[0]!.ratedSpeedRpm).toBe(1500);
    expect(out.onlineKW).toBe(2040);
  });

  it('prints a readable table without --json', async () => {
    const io = memoryIO({ 'plant.json': JSON.stringify(demoPlantJson()) });
    expect(await runCli(['describe', 'plant.json'], io)).toBe(0);
    // I = S / (√3 V) = 1 250 000 / (√3 × 400) = 1804.2 A (closed form), printed to the ampere.
    expect(io.stdout()).toMatch(/G1\s+yes\s+1000\s+1250\s+1500\s+1804\n/);
  });

  it('exits 2 naming the field for invalid input', async () => {
    const plant = demoPlantJson() as { sets: { governor: { droopPct: number } }[] };
    plant.sets[1]!.governor.droopPct = -3;
    const io = memoryIO({ 'plant.json': JSON.stringify(plant) });
    expect(await runCli(['describe', 'plant.json'], io)).toBe(2);
    expect(io.stderr()).toContain('sets[1].governor.droopPct: must be 0 or more');
  });

  it('exits 2 for a missing file, bad JSON and an unknown command', async () => {
    const io = memoryIO({ 'bad.json': '{ "format": ' });
    expect(await runCli(['describe', 'nope.json'], io)).toBe(2);
    expect(io.stderr()).toContain('nope.json: no such file');
    expect(await runCli(['describe', 'bad.json'], io)).toBe(2);
    expect(io.stderr()).toContain('bad.json: not valid JSON');
    expect(await runCli(['frobnicate'], io)).toBe(2);
    expect(io.stderr()).toContain('unknown command "frobnicate"');
  });

  it('runs as the installed bin (npx droopline) with exit codes', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'droopline-cli-'));
    const good = join(dir, 'plant.json');
    writeFileSync(good, JSON.stringify(demoPlantJson()));
    const bin = fileURLToPath(new URL('../../electron/cli/droopline.mjs', import.meta.url));
    const { stdout } = await run(process.execPath, [bin, 'describe', good, '--json']);
    expect((JSON.parse(stdout) as { name: string }).name).toContain('Kestrel Ford');
    const bad = join(dir, 'bad.json');
    writeFileSync(bad, JSON.stringify({ ...(demoPlantJson() as object), ratedVoltageV: -400 }));
    const err = await run(process.execPath, [bin, 'describe', bad]).catch((e: { code: number; stderr: string }) => e);
    expect((err as { code: number }).code).toBe(2);
    expect((err as { stderr: string }).stderr).toContain('ratedVoltageV: must be 100 V or more');
  });
});
