import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../electron/cli/run-cli';
import { plantSchema } from '../../electron/handlers';
import { demoPlantJson } from '../helpers/plants';
import { memoryIO } from '../helpers/memory-io';

const files = () => ({ 'plant.json': JSON.stringify(demoPlantJson()) });

describe('droopline plan', () => {
  it('prints { plant, ... } with a complete valid plant and exits 0 when the bands are met', async () => {
    const io = memoryIO(files());
    const code = await runCli(['plan', 'plant.json', '--hz-band', '49.5,50.5', '--v-band', '380,420', '--loads', '0,95', '--pf', '0.8', '--json'], io);
    expect(io.stderr()).toBe('');
    expect(code).toBe(0);
    const out = JSON.parse(io.stdout()) as { plant: unknown; feasible: boolean };
    expect(out.feasible).toBe(true);
    expect(plantSchema.safeParse(out.plant).success).toBe(true);
  });

  it('exits 3 with the reason when no setting meets the bands', async () => {
    const io = memoryIO(files());
    const code = await runCli(['plan', 'plant.json', '--hz-band', '49.95,50.05', '--v-band', '380,420', '--loads', '0,95'], io);
    expect(code).toBe(3);
    expect(io.stderr()).toContain('Frequency band');
    expect(io.stdout()).toContain('NO SETTING MEETS THE BANDS');
  });

  it('keeps the settings named by --fix', async () => {
    const io = memoryIO(files());
    const code = await runCli(['plan', 'plant.json', '--hz-band', '49,51', '--v-band', '380,420', '--loads', '0,90', '--fix', 'G2.droopPct', '--json'], io);
    expect(code).toBe(0);
    const out = JSON.parse(io.stdout()) as { settings: { droopPct: number }[] };
    // G2's speed droop is 4 % in the demo plant, so every droop set gets 4 %.
    expect(out.settings.map((s) => s.droopPct)).toEqual([4, 4, 4]);
    const bad = memoryIO(files());
    expect(await runCli(['plan', 'plant.json', '--hz-band', '49,51', '--v-band', '380,420', '--fix', 'G2.speed'], bad)).toBe(2);
    expect(bad.stderr()).toContain('--fix: "G2.speed" must be SET.FIELD');
  });

  it('exits 2 naming the flag for a malformed band', async () => {
    const io = memoryIO(files());
    expect(await runCli(['plan', 'plant.json', '--hz-band', '50', '--v-band', '380,420'], io)).toBe(2);
    expect(io.stderr()).toContain('--hz-band: must be two numbers LO,HI');
  });
});

describe('droopline tolerance', () => {
  const argv = ['tolerance', 'plant.json', '--samples', '400', '--seed', '9', '--hz-tol', '0.1', '--v-tol-pct', '0.5', '--droop-tol-pct', '5', '--json'];

  it('prints the sets, bus and probabilities in the documented shape', async () => {
    const io = memoryIO(files());
    expect(await runCli(argv, io)).toBe(0);
    type Stats = { mean: number; std: number; p5: number; p50: number; p95: number };
    const out = JSON.parse(io.stdout()) as {
      sets: { id: string; kW: Stats; kVAR: Stats; circulatingA: Stats }[];
      bus: { frequencyHz: Stats; voltageV: Stats };
      probabilities: { overload: number; reversePower: number };
    };
    expect(out.sets.map((s) => s.id)).toEqual(['G1', 'G2', 'G3']);
    expect(Object.keys(out.sets[0]!.kW)).toEqual(['mean', 'std', 'p5', 'p50', 'p95']);
    expect(out.bus.frequencyHz.p5).toBeLessThanOrEqual(out.bus.frequencyHz.p95);
    for (const p of [out.probabilities.overload, out.probabilities.reversePower]) {
      expect(p).toBeGreaterThanOrEqual(0);
      expect(p).toBeLessThanOrEqual(1);
    }
  });

  it('gives byte-identical JSON for the same seed, and --normal and --load-kw change it', async () => {
    const a = memoryIO(files());
    const b = memoryIO(files());
    await runCli(argv, a);
    await runCli(argv, b);
    expect(a.stdout()).toBe(b.stdout());
    const c = memoryIO(files());
    await runCli([...argv, '--normal', '--load-kw', '1200', '--load-kvar', '700'], c);
    expect(c.stdout()).not.toBe(a.stdout());
  });

  it('runs as the installed bin on 1 and 2 worker threads with byte-identical JSON, equal to the run without a pool', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'droopline-tol-'));
    writeFileSync(join(dir, 'plant.json'), JSON.stringify(demoPlantJson()));
    const bin = fileURLToPath(new URL('../../electron/cli/droopline.mjs', import.meta.url));
    const args = [bin, ...argv.map((a) => (a === 'plant.json' ? join(dir, 'plant.json') : a.replace(/^400$/, '2400')))];
    const run = promisify(execFile);
    const one = await run(process.execPath, args, { env: { ...process.env, DROOPLINE_WORKERS: '1' } });
    const two = await run(process.execPath, args, { env: { ...process.env, DROOPLINE_WORKERS: '2' } });
    expect(two.stdout).toBe(one.stdout);
    const inProcess = memoryIO(files());
    await runCli(
      argv.map((a) => a.replace(/^400$/, '2400')),
      inProcess,
    );
    expect(one.stdout).toBe(inProcess.stdout());
  }, 60_000);

  it('exits 2 naming the field for a bad tolerance', async () => {
    const io = memoryIO(files());
    expect(await runCli(['tolerance', 'plant.json', '--droop-tol-pct', '80'], io)).toBe(2);
    expect(io.stderr()).toContain('droopTolPct: must be 0 % or more and below 50 %');
  });
});
