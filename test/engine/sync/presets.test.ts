import { describe, it, expect } from 'vitest';
import { ieee1547PresetForRating, listSyncPresets, syncPreset } from '../../../electron/engine';

describe('listSyncPresets', () => {
  // IEEE Std 1547-2018 clause 4.10, Table 5 — values from memory (a secondary copy agrees for the first two
  // bands). The presets must say so.
  it.each([
    ['ieee1547-2018-0-500', 0.3, 10, 20],
    ['ieee1547-2018-500-1500', 0.2, 5, 15],
    ['ieee1547-2018-over-1500', 0.1, 3, 10],
  ])('%s holds Δf %s Hz, ΔV %s %, Δφ %s° [memory]', (id, hz, pct, deg) => {
    const p = syncPreset(id);
    expect(p.limits).toEqual({ slipHz: hz, voltagePct: pct, angleDeg: deg });
    expect(p.source).toContain('IEEE Std 1547-2018');
    expect(p.source).toContain('Table 5');
    expect(p.note).toContain('Verify against the standard you hold');
    expect(p.confidence).toBe('memory');
  });

  it('holds IEEE C50.12 / C50.13: ±10°, 0 to +5 %, ±0.067 Hz (IEEE Std C50.12 / C50.13, seen in a secondary copy; clause unconfirmed)', () => {
    const p = syncPreset('ieee-c50.12-c50.13');
    // The label matches the note: a secondary copy, clauses not confirmed.
    expect(p.confidence).toBe('secondary');
    expect(p.note).toMatch(/secondary copy; the clause numbers were not confirmed/);
    expect(p.limits).toEqual({ slipHz: 0.067, angleDeg: 10, voltagePct: 5, incomingHigher: true });
    expect(p.source).toMatch(/C50\.12.*C50\.13/);
    expect(p.note).toContain('Verify against the standard you hold');
  });

  it('marks the generating-set presets as common practice, inside the usual ranges (common practice between generating sets)', () => {
    const practice = listSyncPresets().filter((p) => p.confidence === 'practice');
    expect(practice.length).toBeGreaterThanOrEqual(1);
    for (const p of practice) {
      expect(p.source).toMatch(/common practice/i);
      expect(p.limits.slipHz).toBeGreaterThanOrEqual(0.05);
      expect(p.limits.slipHz).toBeLessThanOrEqual(0.2);
      expect(p.limits.angleDeg).toBeGreaterThanOrEqual(5);
      expect(p.limits.angleDeg).toBeLessThanOrEqual(10);
      expect(p.limits.voltagePct).toBeGreaterThanOrEqual(2);
      expect(p.limits.voltagePct).toBeLessThanOrEqual(5);
      expect(p.limits.incomingFaster).toBe(true);
    }
  });

  it('names a source and a note for every preset, with unique ids', () => {
    const all = listSyncPresets();
    expect(new Set(all.map((p) => p.id)).size).toBe(all.length);
    for (const p of all) {
      expect(p.source.length).toBeGreaterThan(10);
      expect(p.note.length).toBeGreaterThan(10);
    }
  });

  it('hands out copies (editing one does not change the next list)', () => {
    listSyncPresets()[0]!.limits.slipHz = 99;
    expect(listSyncPresets()[0]!.limits.slipHz).toBe(0.3);
  });
});

describe('ieee1547PresetForRating', () => {
  it('picks the band by aggregate rating, upper edges inclusive (IEEE 1547-2018 Table 5 bands [memory])', () => {
    expect(ieee1547PresetForRating(250).id).toBe('ieee1547-2018-0-500');
    expect(ieee1547PresetForRating(500).id).toBe('ieee1547-2018-0-500');
    expect(ieee1547PresetForRating(501).id).toBe('ieee1547-2018-500-1500');
    expect(ieee1547PresetForRating(1500).id).toBe('ieee1547-2018-500-1500');
    expect(ieee1547PresetForRating(2550).id).toBe('ieee1547-2018-over-1500');
  });

  it('refuses a rating that is not positive, and unknown preset ids by name', () => {
    expect(() => ieee1547PresetForRating(0)).toThrow('The aggregate rating must be a positive number of kVA.');
    expect(() => syncPreset('nope')).toThrow(/Unknown sync-check preset "nope"\. Known presets: ieee1547-2018-0-500/);
  });
});
