import { describe, it, expect } from 'vitest';
import { plantSchema } from '../../electron/schemas/plant-schema';
import { dispatch } from '../../electron/handlers';
import { runClosingMap } from '../../electron/handlers/sync-handlers';
import { closingMapRequestSchema } from '../../electron/schemas/sync-schema';
import type { ClosingMap, Plant, SyncResult } from '../../shared-types';
import { solveSharing } from '../../electron/engine';
import { demoPlantJson } from '../helpers/plants';
import { expectClose } from '../helpers/expect-close';

/** The case file of the CLI example (invented values). */
function caseFile(): Record<string, unknown> {
  return {
    format: 'droopline.sync',
    version: 1,
    bus: { frequencyHz: 60, voltageV: 480 },
    incoming: { frequencyHz: 60.1, voltageV: 485, angleDeg: -8, ratedKVA: 1000, xddpPU: 0.15 },
    busSource: { ratedKVA: 1000, xPU: 0.15 },
    breakerClosingMs: 100,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
  };
}

async function messageOf(method: 'evaluateSync' | 'closingMap', payload: unknown): Promise<string> {
  const r = await dispatch(method, payload);
  expect(r.ok).toBe(false);
  return r.ok ? '' : `${r.error.code}: ${r.error.message}`;
}

describe('evaluateSync handler', () => {
  it('evaluates a droopline.sync case file', async () => {
    const r = await dispatch('evaluateSync', caseFile());
    expect(r.ok).toBe(true);
    const v = (r as { value: SyncResult }).value;
    expectClose(v.advanceAngleDeg, 3.6, { rel: 1e-9 }, '0.1 Hz × 100 ms: 360 × 0.1 × 0.1 = 3.6° (closed form)');
    expect(v.permissive).toBe(true);
  });

  it('takes the plant and a set id instead of bus and incoming machine data', async () => {
    const r = await dispatch('evaluateSync', {
      plant: demoPlantJson(),
      incomingSetId: 'G3',
      incoming: { frequencyHz: 50.08, voltageV: 402, angleDeg: -4 },
      breakerClosingMs: 60,
      presetId: 'ieee1547-2018-0-500',
    });
    expect(r.ok).toBe(true);
    const v = (r as { value: SyncResult }).value;
    // The bus is the plant's own steady state with G3 off line (solveSharing of the same plant); G3 is 500 kVA, 4 poles (demo plant).
    const plant: Plant = plantSchema.parse(demoPlantJson()); // defaults filled, as the handler reads it
    const bus = solveSharing({ ...plant, sets: plant.sets.map((s) => (s.id === 'G3' ? { ...s, online: false } : s)) }).bus;
    expect(v.bus).toEqual({ frequencyHz: bus.frequencyHz, voltageV: bus.voltageV, from: expect.stringContaining('G3 off line') });
    expectClose(v.slipHz, 50.08 - bus.frequencyHz, { abs: 1e-9 });
    expectClose(v.base.currentA, 500000 / (Math.sqrt(3) * 400), { rel: 1e-12 });
    expect(v.base.ratedSpeedRpm).toBe(1500);
    expect(v.busEquivalent.setIds).toEqual(['G1', 'G2']);
    expect(v.limits).toEqual({ slipHz: 0.3, voltagePct: 10, angleDeg: 20 });
    expect(v.limitsSource).toContain('IEEE Std 1547-2018');
  });

  it('closes a plant set onto a dead bus when no other set runs and dead-bus closing is on', async () => {
    const plant = demoPlantJson() as { sets: { online: boolean }[] };
    plant.sets.forEach((s, i) => (s.online = i === 0));
    const r = await dispatch('evaluateSync', {
      plant,
      incomingSetId: 'G1',
      incoming: { frequencyHz: 50, voltageV: 400, angleDeg: 0 },
      breakerClosingMs: 60,
      limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
      dead: { deadBus: true },
    });
    expect(r.ok).toBe(true);
    const v = (r as { value: SyncResult }).value;
    expect(v.permissive).toBe(true);
    expect(v.deadBusClose).toBe(true);
  });

  it.each([
    ['a missing bus without a plant', (c: Record<string, unknown>) => delete c.bus, 'bus: is required (or give a plant and incomingSetId)'],
    [
      'a missing xddpPU',
      (c: Record<string, unknown>) => delete (c.incoming as Record<string, unknown>).xddpPU,
      'incoming.xddpPU: is required (or give a plant and incomingSetId)',
    ],
    ['no limits and no preset', (c: Record<string, unknown>) => delete c.limits, 'limits: is required (or give presetId)'],
    [
      'an unknown preset',
      (c: Record<string, unknown>) => {
        delete c.limits;
        c.presetId = 'fast';
      },
      'presetId: must be one of: ieee1547-2018-0-500',
    ],
    [
      'a window wider than 180°',
      (c: Record<string, unknown>) => ((c.limits as Record<string, unknown>).angleDeg = 200),
      'limits.angleDeg: must be 180° or less',
    ],
    ['a zero slip limit', (c: Record<string, unknown>) => ((c.limits as Record<string, unknown>).slipHz = 0), 'limits.slipHz: must be greater than 0'],
    ['a negative frequency', (c: Record<string, unknown>) => ((c.bus as Record<string, unknown>).frequencyHz = -50), 'bus.frequencyHz: must be 0 or more'],
    ['text for a number', (c: Record<string, unknown>) => (c.breakerClosingMs = '100'), 'breakerClosingMs: must be a number (ms)'],
    ['odd poles', (c: Record<string, unknown>) => ((c.incoming as Record<string, unknown>).poles = 3), 'incoming.poles: must be even'],
    ['dead threshold above live', (c: Record<string, unknown>) => (c.dead = { livePct: 50, deadPct: 60 }), 'dead.deadPct: must be below the live threshold'],
    [
      'a negative slip limit',
      (c: Record<string, unknown>) => (c.limits = { slipHz: -0.2, angleDeg: 10, voltagePct: 5 }),
      'limits.slipHz: must be greater than 0',
    ],
    [
      'an angle limit of 200°',
      (c: Record<string, unknown>) => (c.limits = { slipHz: 0.2, angleDeg: 200, voltagePct: 5 }),
      'limits.angleDeg: must be 180° or less',
    ],
    ['a negative breaker time', (c: Record<string, unknown>) => (c.breakerClosingMs = -50), 'breakerClosingMs: must be greater than 0'],
    ['a breaker time of 0 ms', (c: Record<string, unknown>) => (c.breakerClosingMs = 0), 'breakerClosingMs: must be greater than 0'],
    [
      'a 500 Hz incoming set (no rated frequency given)',
      (c: Record<string, unknown>) => ((c.incoming as Record<string, unknown>).frequencyHz = 500),
      'incoming.frequencyHz: must be within 15 % of 50 or 60 Hz (42.5–69 Hz), or 0 for a dead side',
    ],
    [
      'a 60 Hz bus on a 50 Hz rating',
      (c: Record<string, unknown>) => {
        c.ratedFrequencyHz = 50;
        (c.bus as Record<string, unknown>).frequencyHz = 60;
      },
      'bus.frequencyHz: must be within 15 % of the rated 50 Hz (42.5–57.5 Hz), or 0 for a dead side',
    ],
    ['a wrong format tag', (c: Record<string, unknown>) => (c.format = 'droopline.plant'), 'format: must be "droopline.sync"'],
    ['an unknown field', (c: Record<string, unknown>) => (c.slipHz = 0.1), '(root): unknown field(s): slipHz'],
    ['a set id without a plant', (c: Record<string, unknown>) => (c.incomingSetId = 'G1'), 'plant: is required when incomingSetId is given'],
  ])('refuses %s, naming the field and the rule', async (_what, edit, message) => {
    const c = caseFile();
    edit(c);
    expect(await messageOf('evaluateSync', c)).toContain(`INVALID_INPUT: ${message}`);
  });

  it('refuses a plant without a set id, an unknown set id, and names plant fields', async () => {
    const base = { incoming: { frequencyHz: 50, voltageV: 400, angleDeg: 0 }, breakerClosingMs: 60, presetId: 'ieee1547-2018-0-500' };
    expect(await messageOf('evaluateSync', { ...base, plant: demoPlantJson() })).toContain('incomingSetId: is required when a plant is given');
    expect(await messageOf('evaluateSync', { ...base, plant: demoPlantJson(), incomingSetId: 'G7' })).toContain(
      'incomingSetId: must name a set of the plant (G1, G2, G3)',
    );
    const bad = demoPlantJson() as { sets: { machine: { xddpPU: number } }[] };
    bad.sets[1]!.machine.xddpPU = 0;
    expect(await messageOf('evaluateSync', { ...base, plant: bad, incomingSetId: 'G1' })).toContain('sets[1].machine.xddpPU: must be 0.01 pu or more');
  });

  it('refuses a live bus at 0 Hz from the engine with a field-named sentence', async () => {
    const c = caseFile();
    (c.bus as Record<string, unknown>).frequencyHz = 0;
    expect(await messageOf('evaluateSync', c)).toBe('INVALID_INPUT: bus.frequencyHz: must be greater than 0 when the bus is live.');
  });

  it('does not mutate the request', async () => {
    const c = { ...caseFile(), plant: demoPlantJson(), incomingSetId: 'G2' };
    const before = JSON.stringify(c);
    await dispatch('evaluateSync', c);
    expect(JSON.stringify(c)).toBe(before);
  });
});

describe('listSyncPresets handler', () => {
  it('lists the presets with their sources', async () => {
    const r = await dispatch('listSyncPresets', {});
    expect(r.ok).toBe(true);
    const ids = r.ok ? r.value.map((p) => p.id) : [];
    expect(ids).toContain('ieee1547-2018-over-1500');
    expect(ids).toContain('ieee-c50.12-c50.13');
  });
});

describe('closingMap handler', () => {
  it('fills the grid defaults (181 × 101 over ±0.5 Hz) and reports progress up to 1', async () => {
    const fractions: number[] = [];
    const r = await dispatch('closingMap', { case: caseFile() }, { progress: (f) => fractions.push(f), signal: new AbortController().signal });
    expect(r.ok).toBe(true);
    const m = (r as { value: ClosingMap }).value;
    expect(m.anglesDeg).toHaveLength(181);
    expect(m.slipsHz).toHaveLength(101);
    expect(fractions.length).toBeGreaterThan(2);
    expect(fractions.at(-1)).toBe(1);
    expect([...fractions].sort((a, b) => a - b)).toEqual(fractions);
  });

  it('stops with CANCELLED when the caller aborts between chunks', async () => {
    const ac = new AbortController();
    const r = await dispatch(
      'closingMap',
      { case: caseFile(), angleSteps: 721, slipSteps: 401 },
      {
        progress: (f) => {
          if (f > 0) ac.abort();
        },
        signal: ac.signal,
      },
    );
    expect(r).toEqual({ ok: false, error: { name: 'EngineError', code: 'CANCELLED', message: 'The closing map was cancelled.' } });
  });

  it('runs the time-domain method row by row with progress, from a plant case', async () => {
    const fractions: number[] = [];
    const payload = {
      case: {
        plant: demoPlantJson(),
        incomingSetId: 'G3',
        incoming: { frequencyHz: 50.1, voltageV: 400, angleDeg: 0 },
        breakerClosingMs: 60,
        presetId: 'practice-generating-sets',
      },
      method: 'time-domain',
      angleSteps: 5,
      slipSteps: 3,
    };
    const r = await dispatch('closingMap', payload, { progress: (f) => fractions.push(f), signal: new AbortController().signal });
    expect(r.ok).toBe(true);
    expect((r as { value: ClosingMap }).value.method).toBe('time-domain');
    // 15 cells fit one chunk of 800.
    expect(fractions).toEqual([0, 1]);
    // Five cells (one row) per chunk: progress after every row.
    const rows: number[] = [];
    const parsed = closingMapRequestSchema.parse(payload);
    await runClosingMap(parsed, { progress: (f) => rows.push(f), signal: new AbortController().signal }, 5);
    expect(rows).toEqual([0, 1 / 3, 2 / 3, 1]);
  });

  it('refuses the time-domain method without a plant, by field', async () => {
    expect(await messageOf('closingMap', { case: caseFile(), method: 'time-domain', angleSteps: 5, slipSteps: 3 })).toContain(
      "INVALID_INPUT: method: the time-domain closing map needs the case's plant and incomingSetId",
    );
  });

  it('refuses bad grid sizes by field', async () => {
    expect(await messageOf('closingMap', { case: caseFile(), angleSteps: 2.5 })).toContain('angleSteps: must be a whole number');
    expect(await messageOf('closingMap', { case: caseFile(), slipRangeHz: 9 })).toContain('slipRangeHz: must be 5 Hz or less');
    const c = caseFile();
    delete c.limits;
    expect(await messageOf('closingMap', { case: c })).toContain('case.limits: is required (or give presetId)');
  });
});
