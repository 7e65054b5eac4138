import { describe, it, expect } from 'vitest';
import { runCli } from '../../electron/cli/run-cli';
import { demoPlantJson, rawPlant, rawSet } from '../helpers/plants';
import { memoryIO } from '../helpers/memory-io';

const expectCloseKVAR = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThan(1e-6 * Math.abs(b));
const demoIO = (plant: unknown = demoPlantJson()) => memoryIO({ 'plant.json': JSON.stringify(plant) });

interface SolveJson {
  bus: { frequencyHz: number; voltageV: number };
  sets: {
    id: string;
    kW: number;
    kVAR: number;
    kVA: number;
    pf: number;
    currentA: number;
    terminalV: number;
    circulatingA: number;
    loadingPct: number;
    flags: string[];
  }[];
  warnings: string[];
  totals: { loadKW: number; loadKVAR: number; feederLossKW: number };
}

describe('droopline solve', () => {
  it('prints one JSON object with bus, sets and warnings, and exits 0', async () => {
    const io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--json'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as SolveJson;
    expect(Object.keys(out.bus)).toEqual(['frequencyHz', 'voltageV']);
    expect(Object.keys(out.sets[0]!).slice(0, 10)).toEqual(['id', 'kW', 'kVAR', 'kVA', 'pf', 'currentA', 'terminalV', 'circulatingA', 'loadingPct', 'flags']);
    expect(out.sets.map((s) => s.id)).toEqual(['G1', 'G2', 'G3']);
    expect(Array.isArray(out.warnings)).toBe(true);
    expect(out.totals.feederLossKW).toBeGreaterThan(0);
    expect(io.stderr()).toBe('');
  });

  it('prints a readable table without --json, with the caution line', async () => {
    const io = demoIO();
    expect(await runCli(['solve', 'plant.json'], io)).toBe(0);
    const text = io.stdout();
    expect(text).toMatch(/^bus: 50\.\d{3} Hz, \d{3}\.\d V/);
    expect(text).toMatch(/set\s+kW\s+kVAR\s+kVA\s+PF/);
    expect(text).toMatch(/\nG1\s+\d+\.\d\s+\d+\.\d/);
    expect(text).toContain('Planning and training only');
    expect(text).not.toContain('NaN');
  });

  it('--load-kw and --load-kvar replace the plant loads', async () => {
    const io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--json', '--load-kw', '900', '--load-kvar=300'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as SolveJson;
    expect(out.totals.loadKW).toBe(900);
  });

  it('the demo plant near full load answers (98 % of rated kW), flags in words', async () => {
    const io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kw', '2000', '--load-kvar', '1500'], io)).toBe(0);
    expect(io.stdout()).toMatch(/kVA overload/); // the shared flag words
    expect(io.stdout()).not.toContain('NaN');
  });

  it('--load-kw alone takes the plant loads power factor and says so', async () => {
    // Demo loads: 820 + 260 + 90 = 1170 kW, 560 + 150 + 10 = 720 kVAR → PF 1170 / √(1170² + 720²) = 0.852 lagging;
    // 1000 kW → 1000 × 720 / 1170 = 615.4 kVAR (closed form).
    const io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kw', '1000'], io)).toBe(0);
    const pf = 1170 / Math.hypot(1170, 720);
    expect(io.stdout()).toContain(
      `load: 1000.0 kW at PF ${pf.toFixed(3)} lagging (the plant loads; give --load-kvar to choose): ${((1000 * 720) / 1170).toFixed(1)} kVAR`,
    );
    const json = demoIO();
    expect(await runCli(['solve', 'plant.json', '--json', '--load-kw', '1000'], json)).toBe(0);
    expectCloseKVAR((JSON.parse(json.stdout()) as SolveJson).totals.loadKVAR, (1000 * 720) / 1170);
  });

  it('total PF at zero load prints "—"', async () => {
    const io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kw', '0'], io)).toBe(0);
    expect(io.stdout()).toMatch(/PF —; load/);
    const loaded = demoIO();
    expect(await runCli(['solve', 'plant.json'], loaded)).toBe(0);
    expect(loaded.stdout()).toMatch(/PF 0\.\d{3} lag; load/);
  });

  it('exits 2 naming the field for invalid input, and for bad flags', async () => {
    const plant = demoPlantJson() as { sets: { regulator: { droopPct: number } }[] };
    plant.sets[2]!.regulator.droopPct = 0;
    let io = demoIO(plant);
    expect(await runCli(['solve', 'plant.json'], io)).toBe(2);
    expect(io.stderr()).toContain('sets[2].regulator.droopPct: must be greater than 0 in reactive-droop mode');
    io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kw', 'lots'], io)).toBe(2);
    expect(io.stderr()).toContain('--load-kw: must be a number');
    io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kvar', '10'], io)).toBe(2);
    expect(io.stderr()).toContain('--load-kvar: needs --load-kw as well');
    io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kw', '-10'], io)).toBe(2);
    expect(io.stderr()).toContain('load.kW: must be 0 or more');
    io = demoIO();
    expect(await runCli(['solve', 'missing.json'], io)).toBe(2);
    expect(io.stderr()).toContain('missing.json: no such file');
  });

  it('exits 3 with the reason when no steady state exists', async () => {
    let io = demoIO();
    expect(await runCli(['solve', 'plant.json', '--load-kw', '5000'], io)).toBe(3);
    expect(io.stderr()).toContain('no steady state');
    expect(io.stderr()).toMatch(/more than the online sets can supply at their overload limits \(\d+ kW\): \d+ kW short/);
    expect(io.stdout()).toBe('');
    io = demoIO(
      rawPlant(
        [
          rawSet('A', { governor: { mode: 'isochronous', loadSharingLink: false } }),
          rawSet('B', { governor: { mode: 'isochronous', loadSharingLink: false } }),
        ],
        [{ id: 'L', kW: 100, kVAR: 0 }],
      ),
    );
    expect(await runCli(['solve', 'plant.json', '--json'], io)).toBe(3);
    expect(io.stderr()).toContain('isochronous without a common load-sharing link');
  });

  it('lists offline sets and flags in the table as words', async () => {
    const io = demoIO(
      rawPlant(
        [
          rawSet('A', { regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 416 } }),
          rawSet('B', { regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 380 } }),
          rawSet('C', { online: false }),
        ],
        [{ id: 'L', kW: 1000, kVAR: 0 }],
      ),
    );
    expect(await runCli(['solve', 'plant.json'], io)).toBe(0);
    expect(io.stdout()).toMatch(/\nB .*under-excited/);
    expect(io.stdout()).toMatch(/\nC\s+—.*offline/);
    expect(io.stdout()).toContain('warnings:\n  - B is held at its under-excitation limit');
  });
});
