// The example files shipped beside the demo plant (named by each command's --help) stay valid.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../electron/cli/run-cli';
import { memoryIO } from '../helpers/memory-io';

const demo = (name: string) => readFileSync(new URL(`../../renderer/demo/${name}`, import.meta.url), 'utf8');
const files = () =>
  Object.fromEntries(['water-works.plant.json', 'example.scenario.json', 'example.sync.json', 'example.droopline.json'].map((n) => [`demo/${n}`, demo(n)]));

describe('example files', () => {
  it('the sync-check case gives a verdict (exit 0) with the caution', async () => {
    const io = memoryIO(files());
    expect(await runCli(['sync', 'demo/example.sync.json', '--json'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as { permissive: boolean; caution: string };
    expect(typeof out.permissive).toBe('boolean');
    expect(out.caution).toMatch(/^Planning and training only/);
  });

  it('the scenario runs on the demo plant through plantFile', async () => {
    const io = memoryIO(files());
    expect(await runCli(['simulate', 'demo/example.scenario.json'], io)).toBe(0);
    expect(io.stdout()).toContain('class G1');
  });

  it('the project file makes a report', async () => {
    const io = memoryIO(files());
    expect(await runCli(['report', 'demo/example.droopline.json', '--out', 'r.html', '--date', '2026-12-02'], io)).toBe(0);
    expect(String(io.files.get('r.html'))).toContain('Marsh Road cold store');
  });

  it('--help of each command names its example file, and every output carries the caution', async () => {
    for (const [cmd, example] of [
      ['describe', 'water-works.plant.json'],
      ['solve', 'water-works.plant.json'],
      ['sync', 'example.sync.json'],
      ['simulate', 'example.scenario.json'],
      ['report', 'example.droopline.json'],
    ] as const) {
      const io = memoryIO();
      expect(await runCli([cmd, '--help'], io)).toBe(0);
      expect(io.stdout()).toContain(`renderer/demo/${example}`);
      expect(io.stdout()).toContain('Planning and training only');
    }
    const d = memoryIO(files());
    expect(await runCli(['describe', 'demo/water-works.plant.json'], d)).toBe(0);
    expect(d.stdout()).toContain('Planning and training only');
    const dj = memoryIO(files());
    expect(await runCli(['describe', 'demo/water-works.plant.json', '--json'], dj)).toBe(0);
    expect((JSON.parse(dj.stdout()) as { caution: string }).caution).toContain('Planning and training only');
    const p = memoryIO();
    expect(await runCli(['sync', '--presets'], p)).toBe(0);
    expect(p.stdout()).toContain('Planning and training only');
    const pj = memoryIO();
    expect(await runCli(['sync', '--presets', '--json'], pj)).toBe(0);
    const presets = JSON.parse(pj.stdout()) as { presets: unknown[]; caution: string };
    expect(presets.presets.length).toBeGreaterThan(0);
    expect(presets.caution).toContain('Planning and training only');
  });
});
