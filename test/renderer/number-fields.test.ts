import { describe, it, expect } from 'vitest';
import { nextTick, ref } from 'vue';
import { above, anyNumber, from, fromBelow, numberFields, whole } from '../../renderer/stores/number-fields';

describe('number fields a store takes from the screen', () => {
  it('words each rule after the field name and refuses NaN (blank or unreadable text) as "must be a number"', () => {
    expect(anyNumber(Number.NaN)).toBe('must be a number');
    expect(anyNumber(-3)).toBeNull();
    // Power factor: 0 < pf ≤ 1 (closed form: cos φ of a load angle).
    const pf = above(0, '', 1);
    expect(pf(1)).toBeNull();
    expect(pf(0)).toBe('must be above 0 and at most 1');
    expect(pf(Number.NaN)).toBe('must be a number');
    expect(above(0, 'V')(-1)).toBe('must be above 0 V');
    expect(from(0, 200, '%')(200)).toBeNull();
    expect(from(0, 200, '%')(200.5)).toBe('must be from 0 to 200 %');
    expect(from(0, undefined, 'kW')(-1)).toBe('must be 0 kW or more');
    expect(fromBelow(0, 50, '%')(50)).toBe('must be 0 or more and below 50 %');
    expect(whole(10, 1_000_000)(2.5)).toBe('must be a whole number from 10 to 1 000 000');
    expect(whole(1, 200)(200)).toBeNull();
  });

  it('keeps the last good value for a refused entry, names its rule until a good entry or a value from elsewhere', async () => {
    const cap = ref(30);
    const f = numberFields<'cap'>(() => ({ name: 'iteration cap', rule: whole(1, 200), get: () => cap.value, set: (v) => (cap.value = v) }));
    expect(f.take('cap', Number.NaN)).toBe(false);
    expect(cap.value).toBe(30);
    expect(f.issues.value).toEqual({ cap: 'must be a number' });
    expect(f.sentences()).toEqual(['iteration cap must be a number']);
    await nextTick();
    expect(f.issues.value).toEqual({ cap: 'must be a number' }); // the value did not change, so the reason stays
    expect(f.take('cap', 40)).toBe(true);
    expect(cap.value).toBe(40);
    expect(f.issues.value).toEqual({});
    f.take('cap', 0);
    expect(f.sentences(['cap'])).toEqual(['iteration cap must be a whole number from 1 to 200']);
    cap.value = 50; // e.g. a project opened
    await nextTick();
    expect(f.issues.value).toEqual({});
  });
});
