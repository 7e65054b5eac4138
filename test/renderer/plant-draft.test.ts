import { describe, it, expect } from 'vitest';
import {
  addItem,
  changeRatedFrequency,
  draftOf,
  duplicateItem,
  getIn,
  moveItem,
  nextId,
  parsePath,
  removeItem,
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
  it('adds a set that the plant schema accepts unchanged (every field given)', () => {
    const d = addItem(draftOf(demoPlant()), 'sets');
    expect(d.sets).toHaveLength(4);
    const added = d.sets[3];
    expect(added?.id).toBe('G4');
    const valid = plantSchema.parse(d);
    // The schema fills nothing in: the draft equals its validated form.
    expect(valid.sets[3]).toEqual(added);
    // Default no-load setpoint: f_rated (1 + droop) = 50 × 1.04 = 52 Hz (plant-schema default rule).
    expectClose(added?.governor.noLoadHz ?? NaN, 52, { abs: 1e-12 }, 'noLoadHz');
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
