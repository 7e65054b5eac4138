import { describe, it, expect } from 'vitest';
import { runCli } from '../../electron/cli/run-cli';
import { demoPlantJson } from '../helpers/plants';
import { memoryIO } from '../helpers/memory-io';
import { expectClose } from '../helpers/expect-close';

/** The example case (invented values): 0.25 Hz fast, 30° ahead, 80 ms breaker. */
const caseJson = {
  format: 'droopline.sync',
  version: 1,
  name: 'Set 4 onto the station bus',
  bus: { frequencyHz: 60, voltageV: 480 },
  incoming: { frequencyHz: 60.25, voltageV: 490, angleDeg: 30, ratedKVA: 1000, xddpPU: 0.15 },
  busSource: { ratedKVA: 1000, xPU: 0.15 },
  breakerClosingMs: 80,
  limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true },
};

interface SyncJson {
  slipHz: number;
  slipPeriodS: number;
  advanceAngleDeg: number;
  windowOpenS: number;
  voltageDifferencePct: number;
  permissive: boolean;
  reasons: string[];
  closeNow: { angleAtContactDeg: number; surgeCurrentPU: number; surgeCurrentA: number; peakCurrentA: number; torqueStepPU: number };
}

describe('droopline sync', () => {
  it("prints the issue's JSON fields and exits 0 (a refusal is a result, not an error)", async () => {
    const io = memoryIO({ 'case.json': JSON.stringify(caseJson) });
    expect(await runCli(['sync', 'case.json', '--json'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as SyncJson;
    for (const k of ['slipHz', 'slipPeriodS', 'advanceAngleDeg', 'windowOpenS', 'voltageDifferencePct', 'permissive', 'reasons', 'closeNow'])
      expect(out).toHaveProperty(k);
    for (const k of ['angleAtContactDeg', 'surgeCurrentPU', 'surgeCurrentA', 'peakCurrentA', 'torqueStepPU']) expect(out.closeNow).toHaveProperty(k);
    expectClose(out.slipPeriodS, 4, { rel: 1e-9 }, '1 / 0.25 Hz');
    expectClose(out.advanceAngleDeg, 7.2, { rel: 1e-9 }, '0.25 Hz × 80 ms: 360 × 0.25 × 0.08 = 7.2° (closed form)');
    expectClose(out.windowOpenS, 20 / 90, { rel: 1e-9 }, '2 × 10° / (360 × 0.25)');
    expect(out.permissive).toBe(false);
    expect(out.reasons).toEqual(['Slip +0.250 Hz is beyond the ±0.2 Hz limit.', 'Phase angle +30.0° is outside the ±10° window.']);
    expectClose(out.closeNow.angleAtContactDeg, 37.2, { abs: 1e-9 });
  });

  it('prints a readable verdict with checks, timing, surge and the caution line', async () => {
    const io = memoryIO({ 'case.json': JSON.stringify(caseJson) });
    expect(await runCli(['sync', 'case.json'], io)).toBe(0);
    const text = io.stdout();
    expect(text).toContain('Sync-check: CLOSE NOT PERMITTED');
    expect(text).toMatch(/slip\s+\+0\.250 Hz\s+±0\.2 Hz\s+FAIL/);
    expect(text).toMatch(/voltage\s+\+2\.08 %\s+±5 %\s+pass/);
    expect(text).toContain('issue the close command at −7.20°, in 3.587 s');
    expect(text).toContain("surge current I''");
    expect(text).toContain('Planning and training only');
    expect(text).not.toContain('NaN');
  });

  it('replaces the limits with --preset and lists presets with --presets', async () => {
    const io = memoryIO({ 'case.json': JSON.stringify(caseJson) });
    expect(await runCli(['sync', 'case.json', '--json', '--preset', 'ieee1547-2018-0-500'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as SyncJson & { limitsSource: string };
    expect(out.limitsSource).toContain('IEEE Std 1547-2018');
    expect(out.reasons).toEqual(['Phase angle +30.0° is outside the ±20° window.']);
    const list = memoryIO();
    expect(await runCli(['sync', '--presets'], list)).toBe(0);
    expect(list.stdout()).toContain('ieee-c50.12-c50.13');
    expect(list.stdout()).toContain('Verify against the standard you hold');
  });

  it('takes a plant file and a set id in the case', async () => {
    // The demo plant's bus with G2 off line sits near 49.48 Hz (droop, by solve): 49.55 Hz incoming is about 0.07 Hz fast.
    const io = memoryIO({
      'case.json': JSON.stringify({
        plant: demoPlantJson(),
        incomingSetId: 'G2',
        incoming: { frequencyHz: 49.55, voltageV: 400, angleDeg: -3 },
        breakerClosingMs: 50,
        presetId: 'practice-generating-sets',
      }),
    });
    expect(await runCli(['sync', 'case.json', '--json'], io)).toBe(0);
    const out = JSON.parse(io.stdout()) as SyncJson;
    expect(out.reasons).toEqual([]);
    expect(out.permissive).toBe(true);
  });

  it('uses the bus `solve` finds for the plant with the incoming set off line, prints it, and --json carries it', async () => {
    const plant = demoPlantJson() as { sets: { id: string; online: boolean }[] };
    const offLine = { ...plant, sets: plant.sets.map((s) => (s.id === 'G2' ? { ...s, online: false } : s)) };
    const solved = memoryIO({ 'plant.json': JSON.stringify(offLine) });
    expect(await runCli(['solve', 'plant.json', '--json'], solved)).toBe(0);
    const bus = (JSON.parse(solved.stdout()) as { bus: { frequencyHz: number; voltageV: number } }).bus;
    // A drooping plant does not sit at exactly rated: the point of taking the solved bus.
    expect(bus.frequencyHz).not.toBe(50);

    const file = {
      plant,
      incomingSetId: 'G2',
      incoming: { frequencyHz: 50.05, voltageV: 400, angleDeg: -3 },
      breakerClosingMs: 50,
      presetId: 'practice-generating-sets',
    };
    const json = memoryIO({ 'case.json': JSON.stringify(file) });
    expect(await runCli(['sync', 'case.json', '--json'], json)).toBe(0);
    const out = JSON.parse(json.stdout()) as SyncJson & { bus: { frequencyHz: number; voltageV: number; from: string } };
    expect(out.bus.frequencyHz).toBe(bus.frequencyHz);
    expect(out.bus.voltageV).toBe(bus.voltageV);
    expect(out.bus.from).toContain('G2 off line');
    expectClose(out.slipHz, 50.05 - bus.frequencyHz, { abs: 1e-9 }, 'slip against the solved bus');

    const text = memoryIO({ 'case.json': JSON.stringify(file) });
    expect(await runCli(['sync', 'case.json'], text)).toBe(0);
    expect(text.stdout()).toContain(`Bus used: ${bus.frequencyHz.toFixed(3)} Hz, ${bus.voltageV.toFixed(1)} V — the plant's steady state with G2 off line`);
  });

  it('exits 2 naming the field for invalid input, a bad preset, a missing file and bad JSON', async () => {
    const bad = { ...caseJson, limits: { ...caseJson.limits, voltagePct: -1 } };
    const io = memoryIO({ 'bad.json': JSON.stringify(bad), 'case.json': JSON.stringify(caseJson), 'broken.json': '{ "bus": ' });
    expect(await runCli(['sync', 'bad.json'], io)).toBe(2);
    expect(io.stderr()).toContain('limits.voltagePct: must be greater than 0');
    expect(await runCli(['sync', 'case.json', '--preset', 'loose'], io)).toBe(2);
    expect(io.stderr()).toContain('presetId: must be one of');
    expect(await runCli(['sync', 'nope.json'], io)).toBe(2);
    expect(io.stderr()).toContain('nope.json: no such file');
    expect(await runCli(['sync', 'broken.json'], io)).toBe(2);
    expect(io.stderr()).toContain('broken.json: not valid JSON');
    expect(await runCli(['sync'], io)).toBe(2);
    expect(io.stderr()).toContain('missing sync case file argument');
    expect(io.stderr()).not.toMatch(/at .*\.ts:\d+/);
  });
});
