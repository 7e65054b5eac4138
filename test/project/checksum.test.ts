// @vitest-environment node
/** The saved project's content checksum: written on save, checked on open, silent for files without one. */
import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { CHECKSUM_MISMATCH, contentChecksum, parseProject, serializeProject } from '../../electron/project';
import { projectText } from '../helpers/projects';

const saved = () => serializeProject(parseProject(projectText({ name: 'Kestrel Ford study' })).project);

describe('project checksum', () => {
  it("is SHA-256 of the canonical text (checked with Node's own SHA-256, FIPS 180-4)", () => {
    const content = { format: 'droopline.project', name: 'x', nested: { a: [1, 2.5, 'ü'] } };
    const expected = createHash('sha256')
      .update(JSON.stringify(content, null, 2), 'utf8')
      .digest('hex');
    expect(contentChecksum(content)).toBe(expected);
  });

  it('is written last on save and reads back with no note; saving again gives the same text', () => {
    const text = saved();
    const json = JSON.parse(text) as Record<string, unknown>;
    expect(Object.keys(json).at(-1)).toBe('integrity');
    expect((json.integrity as { sha256: string }).sha256).toMatch(/^[0-9a-f]{64}$/);
    const again = parseProject(text);
    expect(again.notes).toEqual([]);
    expect(serializeProject(again.project)).toBe(text);
  });

  it('notes a byte flipped inside a string or a number, and still opens the file', () => {
    const text = saved();
    const inName = text.replace('"Kestrel Ford study"', '"Kestrel Ford studz"');
    expect(inName).not.toBe(text);
    expect(parseProject(inName).notes).toContain(CHECKSUM_MISMATCH);
    const inNumber = text.replace(/"droopPct": 4\b/, '"droopPct": 5');
    expect(inNumber).not.toBe(text);
    const opened = parseProject(inNumber);
    expect(opened.notes).toContain(CHECKSUM_MISMATCH);
    expect(opened.project.plant.sets.some((s) => s.governor.droopPct === 5)).toBe(true);
  });

  it('stays quiet for a reformatted file and for a file written by hand without one', () => {
    const text = saved();
    expect(parseProject(JSON.stringify(JSON.parse(text))).notes).toEqual([]);
    expect(parseProject(projectText()).notes).toEqual([]);
  });

  it('treats a damaged checksum field as a mismatch, never as an error', () => {
    const json = JSON.parse(saved()) as Record<string, unknown>;
    json.integrity = { sha256: 42 };
    expect(parseProject(JSON.stringify(json)).notes).toContain(CHECKSUM_MISMATCH);
  });
});
