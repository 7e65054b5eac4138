/** `droopline simulate`, run in-process with an in-memory file system. */
import { describe, expect, it } from 'vitest';
import { runCli } from '../../electron/cli/run-cli';
import { demoPlantJson } from '../helpers/plants';
import { memoryIO } from '../helpers/memory-io';

const scenario = (over: Record<string, unknown> = {}) =>
  JSON.stringify({
    format: 'droopline.scenario',
    version: 1,
    plantFile: 'plants/works.plant.json',
    durationS: 3,
    stepMs: 2,
    outputPoints: 31,
    events: [{ atS: 0.5, type: 'load-step', kW: 300, kVAR: 150 }],
    ...over,
  });

const files = (scen: string) => ({ 'cases/step.json': scen, 'cases/plants/works.plant.json': JSON.stringify(demoPlantJson()) });

describe('droopline simulate', () => {
  it('reads plantFile relative to the scenario and prints the JSON result', async () => {
    const io = memoryIO(files(scenario()));
    expect(await runCli(['simulate', 'cases/step.json', '--json'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as {
      metrics: { frequencyNadirHz: number; final: { sets: { id: string; kW: number }[] } };
      series: { t: number[]; frequencyHz: number[]; voltageV: number[] };
    };
    expect(out.metrics.final.sets.map((s) => s.id)).toEqual(['G1', 'G2', 'G3']);
    expect(out.metrics.frequencyNadirHz).toBeLessThan(50.1);
    expect(out.series.t.length).toBe(out.series.frequencyHz.length);
    expect(out.series.t.length).toBeGreaterThanOrEqual(30);
  });

  it('prints CSV with a unit in every column name', async () => {
    const io = memoryIO(files(scenario()));
    expect(await runCli(['simulate', 'cases/step.json', '--csv'], io)).toBe(0);
    const lines = io.stdout().trim().split('\n');
    // A leading '#' comment line carries the caution (CSV readers skip it with their comment option).
    expect(lines.shift()).toMatch(/^# Caution: planning and training only\./);
    expect(lines[0]).toBe(
      't_s,frequency_Hz,voltage_V,G1_kW,G1_kVAR,G1_A,G1_speed_Hz,G1_terminal_V,G2_kW,G2_kVAR,G2_A,G2_speed_Hz,G2_terminal_V,G3_kW,G3_kVAR,G3_A,G3_speed_Hz,G3_terminal_V',
    );
    expect(lines[1]!.split(',')).toHaveLength(18);
    expect(io.stdout()).not.toMatch(/NaN/);
  });

  it('prints a readable summary with the ISO 8528-5 table, its source and the caution', async () => {
    const io = memoryIO(files(scenario()));
    expect(await runCli(['simulate', 'cases/step.json'], io)).toBe(0);
    const text = io.stdout();
    expect(text).toMatch(/frequency: initial 50\.0\d\d Hz, nadir/);
    expect(text).toContain('transient frequency deviation, load on');
    expect(text).toContain('ISO 8528-5');
    expect(text).toContain('verify against the standard you hold');
    expect(text).toContain('0.500 s  load step 300 kW, 150 kVAR');
    expect(text).toContain('Planning and training only');
  });

  it('exits 2 naming the field for a bad scenario', async () => {
    const io = memoryIO(files(scenario({ events: [{ atS: 1, type: 'trip', setId: 'G7' }] })));
    expect(await runCli(['simulate', 'cases/step.json'], io)).toBe(2);
    expect(io.stderr()).toContain('events[0].setId: no set "G7" in the plant');
  });

  it('exits 2 when the plant file is missing, or for --json with --csv', async () => {
    const io = memoryIO({ 'cases/step.json': scenario() });
    expect(await runCli(['simulate', 'cases/step.json'], io)).toBe(2);
    expect(io.stderr()).toContain('cases/plants/works.plant.json: no such file');
    const io2 = memoryIO(files(scenario()));
    expect(await runCli(['simulate', 'cases/step.json', '--json', '--csv'], io2)).toBe(2);
    expect(io2.stderr()).toContain('--json and --csv: choose one');
  });

  it('exits 3 when the plant has no steady state to start from', async () => {
    const plant = demoPlantJson() as { loads: { kW: number }[] };
    plant.loads[0]!.kW = 40_000;
    const io = memoryIO({ 'step.json': scenario({ plantFile: undefined, plant }) });
    expect(await runCli(['simulate', 'step.json'], io)).toBe(3);
    expect(io.stderr()).toContain('no steady state');
  });
});
