import { describe, it, expect } from 'vitest';
import { runCli } from '../../electron/cli/run-cli';
import { dispatch } from '../../electron/handlers';
import { demoPlantJson } from '../helpers/plants';
import { memoryIO } from '../helpers/memory-io';

// A project file of our own invention around the demo plant: one scenario, explicit sync settings.
function projectJson(): string {
  return JSON.stringify({
    format: 'droopline.project',
    version: 1,
    name: 'Kestrel Ford commissioning',
    plant: demoPlantJson(),
    scenarios: [{ id: 's1', name: 'Blower start', durationS: 3, stepMs: 2, events: [{ atS: 0.5, type: 'load-step', kW: 150, kVAR: 100 }] }],
    sync: {
      presetId: null,
      limits: { slipHz: 0.15, angleDeg: 8, voltagePct: 4 },
      breakerClosingMs: 50,
      dead: { deadBus: false, deadLine: false, livePct: 80, deadPct: 20 },
      incomingSetId: 'G2',
    },
    trainerLog: [],
    view: {},
  });
}

describe('droopline report', () => {
  it('writes the HTML report of a project file and exits 0', async () => {
    const io = memoryIO({ 'p.json': projectJson() });
    const code = await runCli(['report', 'p.json', '--out', 'r.html', '--date', '2026-12-02', '--loads', '30,60,90'], io);
    expect(io.stderr()).not.toContain('internal error');
    expect(code).toBe(0);
    const html = String(io.files.get('r.html'));
    expect(html).toContain('<h1>Kestrel Ford commissioning</h1>');
    expect(html).toContain('datetime="2026-12-02"');
    expect(html).toMatch(/<td[^>]*>30 %<\/td>/);
    expect(html).toContain('<section id="transients">');
    expect(io.stdout()).toMatch(/^wrote r\.html \(\d+ tables, \d+ charts\)/);
  });

  it('gives the same page as the engine method (CLI and app share buildReport)', async () => {
    const io = memoryIO({ 'plant.json': JSON.stringify(demoPlantJson()) });
    expect(await runCli(['report', 'plant.json', '--out', 'r.html', '--date', '2026-12-02'], io)).toBe(0);
    const parsed = await dispatch('parseProject', { text: JSON.stringify(demoPlantJson()) });
    if (!parsed.ok) throw new Error(parsed.error.message);
    const p = parsed.value.project;
    const direct = await dispatch('buildReport', { project: { name: p.name, plant: p.plant, sync: p.sync }, date: '2026-12-02' });
    if (!direct.ok) throw new Error(direct.error.message);
    expect(io.files.get('r.html')).toBe(direct.value.html);
  });

  it('prints the HTML to stdout without --out', async () => {
    const io = memoryIO({ 'plant.json': JSON.stringify(demoPlantJson()) });
    expect(await runCli(['report', 'plant.json', '--date', '2026-12-02'], io)).toBe(0);
    expect(io.stdout().startsWith('<!doctype html>')).toBe(true);
  });

  it('exits 2 for --pdf without Electron, saying so', async () => {
    const io = memoryIO({ 'p.json': projectJson() });
    expect(await runCli(['report', 'p.json', '--pdf'], io)).toBe(2);
    expect(io.stderr()).toContain('--pdf needs Electron');
    expect(io.files.has('r.html')).toBe(false);
  });

  it('exits 2 naming the field or flag for bad input', async () => {
    const plant = demoPlantJson() as { sets: { ratedKVA: number }[] };
    plant.sets[0]!.ratedKVA = -5;
    const io = memoryIO({ 'bad.json': JSON.stringify(plant), 'p.json': projectJson(), 'junk.json': '{"format": "droopline.pla' });
    expect(await runCli(['report', 'bad.json', '--out', 'r.html'], io)).toBe(2);
    expect(io.stderr()).toContain('sets[0].ratedKVA');
    expect(await runCli(['report', 'p.json', '--loads', '50,abc'], io)).toBe(2);
    expect(io.stderr()).toContain('--loads: must be numbers separated by commas');
    expect(await runCli(['report', 'p.json', '--pf', '1.5', '--date', '2026-12-02'], io)).toBe(2);
    expect(io.stderr()).toContain('loadPF: must be at most 1');
    expect(await runCli(['report', 'p.json', '--date', 'tuesday'], io)).toBe(2);
    expect(io.stderr()).toContain('--date: must be an ISO date');
    expect(await runCli(['report', 'missing.json'], io)).toBe(2);
    expect(io.stderr()).toContain('missing.json: no such file');
    expect(await runCli(['report', 'junk.json'], io)).toBe(2);
    expect(io.files.has('r.html')).toBe(false);
  });

  it('--strict exits 0 for the demo plant: every section, every sharing row computed', async () => {
    const io = memoryIO({ 'p.json': projectJson() });
    expect(await runCli(['report', 'p.json', '--out', 'r.html', '--strict', '--date', '2026-12-02'], io)).toBe(0);
    expect(io.stderr()).not.toContain('not computed');
  });

  it('--strict exits 3 when a section could not be computed', async () => {
    const project = JSON.parse(projectJson()) as { sync: { incomingSetId: string } };
    project.sync.incomingSetId = 'G7';
    const io = memoryIO({ 'p.json': JSON.stringify(project) });
    expect(await runCli(['report', 'p.json', '--out', 'r.html', '--strict', '--date', '2026-12-02'], io)).toBe(3);
    expect(io.stderr()).toContain('not computed: Sync-check settings and closing map');
  });
});
