// Exported chart images say what they show: title, plant, scenario, date, and the caution (wrapped to the width).
import { describe, expect, it } from 'vitest';
import { pngHeading, wrapWords } from '../../renderer/components/report/download';

describe('PNG labels', () => {
  it('heads the image with the title, then plant · scenario · date', () => {
    expect(pngHeading({ title: 'Bus frequency', plant: 'Kestrel Ford', scenario: 'Run 1 · Block load step', date: '2026-12-02' })).toEqual([
      'Bus frequency',
      'Kestrel Ford · Run 1 · Block load step · 2026-12-02',
    ]);
    expect(pngHeading({ title: 'Speed droop', plant: 'Kestrel Ford', date: '2026-12-02' })[1]).toBe('Kestrel Ford · 2026-12-02');
  });
  it('wraps the caution to the image width without losing a word', () => {
    const text = 'Caution: planning and training only. Verify against makers’ data.';
    const lines = wrapWords(text, 20, (s) => s.length);
    expect(lines.every((l) => l.length <= 20 || !l.includes(' '))).toBe(true);
    expect(lines.join(' ')).toBe(text);
  });
});
