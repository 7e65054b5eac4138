import { describe, it, expect } from 'vitest';
import {
  addItem,
  changeRatedFrequency,
  draftOf,
  duplicateItem,
  getIn,
  keepSame,
  moveItem,
  nextId,
  parsePath,
  removeItem,
  samePlain,
  setIn,
} from '../../renderer/stores/plant-draft';
import { plantSchema } from '../../electron/handlers';
import { demoPlant } from '../helpers/plants';
import { expectClose } from '../helpers/expect-close';

describe('parsePath', () => {
  it('splits an engine issue path into property and index steps', () => {
    expect(parsePath('sets[1].governor.droopPct')).toEqual(['sets', 1, 'governor', 'droopPct']);
    expect(parsePath('ratedVoltageV')).toEqual(['ratedVoltageV']);
    expect(parsePath('loads[12].kW')).toEqual(['loads', 12, 'kW']);
  });
});

describe('setIn', () => {
  it('copies only along the path and leaves the original untouched', () => {
    const d = draftOf(demoPlant());
    const before = JSON.stringify(d);
    const e = setIn(d, 'sets[1].governor.droopPct', 5);
    expect(JSON.stringify(d)).toBe(before);
    expect(getIn(e, 'sets[1].governor.droopPct')).toBe(5);
    expect(e.sets[0]).toBe(d.sets[0]);
    expect(e.loads).toBe(d.loads);
    expect(e.sets[1]?.regulator).toBe(d.sets[1]?.regulator);
  });
});

describe('set and load list edits', () => {
  it('adds a set with the last set’s settings, which the plant schema accepts unchanged, and it shares in proportion at once', async () => {
    const { solveSharing } = await import('../../electron/engine');
    const d = addItem(draftOf(demoPlant()), 'sets');
    expect(d.sets).toHaveLength(4);
    const added = d.sets[3]!;
    expect(added.id).toBe('G4');
    expect(added.name).toBe('Set G4');
    expect({ ...added, id: 'G3', name: d.sets[2]!.name }).toEqual(d.sets[2]);
    expect(added.governor).not.toBe(d.sets[2]!.governor);
    const valid = plantSchema.parse(d);
    // The schema fills nothing in: the draft equals its validated form.
    expect(valid.sets[3]).toEqual(added);
    // Same droop line as G3: both carry the same kW and kVAR (closed form: identical sets on one bus, identical feeders).
    const r = solveSharing(valid);
    expectClose(r.sets[3]!.kW, r.sets[2]!.kW, { rel: 1e-9 }, 'G4 kW = G3 kW');
    expectClose(r.sets[3]!.kVAR, r.sets[2]!.kVAR, { rel: 1e-9 }, 'G4 kVAR = G3 kVAR');
  });

  it('adds a first set with every field given when the plant has none', () => {
    const empty = { ...draftOf(demoPlant()), sets: [] };
    const added = addItem(empty, 'sets').sets[0]!;
    expect(added.id).toBe('G1');
    const valid = plantSchema.parse({ ...addItem(empty, 'sets') });
    expect(valid.sets[0]).toEqual(added);
    // Default no-load setpoint: f_rated (1 + droop) = 50 × 1.04 = 52 Hz (plant-schema default rule).
    expectClose(added.governor.noLoadHz ?? NaN, 52, { abs: 1e-12 }, 'noLoadHz');
  });

  it('duplicates a set after itself with a fresh id and "(copy)" in the name', () => {
    const d = duplicateItem(draftOf(demoPlant()), 'sets', 0);
    expect(d.sets.map((s) => s.id)).toEqual(['G1', 'G4', 'G2', 'G3']);
    expect(d.sets[1]?.name).toBe('Inlet works set (copy)');
    expect(d.sets[1]?.ratedKVA).toBe(1250);
    expect(d.sets[1]?.governor).not.toBe(d.sets[0]?.governor);
  });

  it('moves and removes items, clamped to the list', () => {
    const d0 = draftOf(demoPlant());
    expect(moveItem(d0, 'sets', 0, 1).sets.map((s) => s.id)).toEqual(['G2', 'G1', 'G3']);
    expect(moveItem(d0, 'sets', 2, 1)).toBe(d0);
    expect(removeItem(d0, 'loads', 1).loads.map((l) => l.id)).toEqual(['L1', 'L3']);
    expect(nextId('L', ['L1', 'L3'])).toBe('L2');
  });
});

describe('changeRatedFrequency', () => {
  it('scales the frequency setpoints with the rated frequency so droop in per unit is kept', () => {
    const d = changeRatedFrequency(draftOf(demoPlant()), 60);
    expect(d.ratedFrequencyHz).toBe(60);
    // 51.2 Hz no-load at 50 Hz is 2.4 % above rated; at 60 Hz that is 61.44 Hz (closed form).
    expectClose(d.sets[0]?.governor.noLoadHz ?? NaN, 61.44, { abs: 1e-9 }, 'noLoadHz');
    expectClose(d.sets[0]?.governor.setpointHz ?? NaN, 60, { abs: 1e-9 }, 'setpointHz');
  });
});

describe('samePlain', () => {
  it('compares JSON values by content, whatever the key order', () => {
    const d = draftOf(demoPlant());
    expect(samePlain(d, JSON.parse(JSON.stringify(d)))).toBe(true);
    expect(samePlain({ a: 1, b: [1, 2] }, { b: [1, 2], a: 1 })).toBe(true);
    expect(samePlain(setIn(d, 'sets[1].governor.droopPct', 5), d)).toBe(false);
    expect(samePlain({ a: 1 }, { a: 1, b: 2 })).toBe(false);
    expect(samePlain({ a: 1, b: undefined }, { a: 1, c: undefined })).toBe(false);
    expect(samePlain([1, 2], { 0: 1, 1: 2 })).toBe(false);
    expect(samePlain([1, 2], [1, 2, 3])).toBe(false);
    expect(samePlain(null, {})).toBe(false);
    expect(samePlain({ a: 1, b: 2 }, { a: 1 })).toBe(false);
    expect(samePlain(0, -0)).toBe(false);
    expect(samePlain(Number.NaN, Number.NaN)).toBe(true);
  });
});

describe('keepSame', () => {
  it('keeps the old object where the values are the same, and the new one where they differ', () => {
    const old = { rated: { kW: 800, curve: [1, 2, 3] }, lines: [{ droop: 4 }, { droop: 3 }], name: 'A' };
    const next = { rated: { kW: 800, curve: [1, 2, 3] }, lines: [{ droop: 4 }, { droop: 5 }], name: 'A' };
    const kept = keepSame(old, next);
    expect(kept).toBe(next);
    expect(kept.rated).toBe(old.rated);
    expect(kept.lines).not.toBe(old.lines);
    expect(kept.lines[0]).toBe(old.lines[0]);
    expect(kept.lines[1]).toEqual({ droop: 5 });
    expect(kept.lines[1]).not.toBe(old.lines[1]);
  });

  it('gives the old object itself when nothing differs, and never keeps across a changed shape', () => {
    const old = { a: [1, { b: 2 }], c: null };
    expect(keepSame(old, JSON.parse(JSON.stringify(old)))).toBe(old);
    // An added or a removed key, an array against an object, a longer array: the new value stands.
    const added = { a: [1, { b: 2 }], c: null, d: 1 };
    expect(keepSame(old, added)).toBe(added);
    const removed = { a: [1, { b: 2 }] };
    expect(keepSame(old, removed)).toBe(removed);
    const asObject = { 0: 1, 1: { b: 2 } };
    expect(keepSame([1, { b: 2 }], asObject)).toBe(asObject);
    const longer = [1, { b: 2 }, 3];
    expect(keepSame([1, { b: 2 }], longer)).toBe(longer);
    expect(keepSame(null, old)).toBe(old);
  });

  it('keeps every part of a described plant that a droop edit leaves alone', () => {
    const d = draftOf(demoPlant());
    const edited = setIn(d, 'sets[1].governor.droopPct', 5);
    const kept = keepSame(d, JSON.parse(JSON.stringify(edited)) as typeof d);
    expect(kept).not.toBe(d);
    expect(kept.sets[0]).toBe(d.sets[0]);
    expect(kept.sets[1]).not.toBe(d.sets[1]);
    expect(kept.sets[1]?.governor.droopPct).toBe(5);
    expect(samePlain(kept, edited)).toBe(true);
  });
});
