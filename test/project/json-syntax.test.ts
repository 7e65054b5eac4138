import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { findJsonSyntaxProblem } from '../../electron/project';

describe('findJsonSyntaxProblem', () => {
  it('accepts everything JSON.stringify writes', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        expect(findJsonSyntaxProblem(JSON.stringify(v, null, 2))).toBeNull();
      }),
      { numRuns: 300 },
    );
  });

  it('agrees with JSON.parse on whether a text is valid', () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.nat(), fc.string({ maxLength: 2 }), (v, at, junk) => {
        const text = JSON.stringify(v);
        const cut = at % (text.length + 1);
        const mangled = text.slice(0, cut) + junk + text.slice(cut);
        let valid = true;
        try {
          JSON.parse(mangled);
        } catch {
          valid = false;
        }
        expect(findJsonSyntaxProblem(mangled) === null).toBe(valid);
      }),
      { numRuns: 500 },
    );
  });

  it('calls every strict prefix of a JSON object truncated', () => {
    const text = JSON.stringify({ a: [1, 2.5e3, 'x"y'], b: { c: null, d: true } }, null, 1);
    for (let n = 1; n < text.length; n++) {
      const p = findJsonSyntaxProblem(text.slice(0, n));
      expect(p?.truncated, `prefix of ${n} characters`).toBe(true);
    }
  });

  it('gives 1-based line and column of the first wrong character', () => {
    // The parser reads "tru" as one unknown word and points at its first letter (column 7), not at the space after it.
    expect(findJsonSyntaxProblem('{\n "a": tru }')).toEqual({ line: 2, column: 7, truncated: false, expected: 'a value', found: '"tru"' });
    expect(findJsonSyntaxProblem('{"a": 1,}')).toMatchObject({ line: 1, column: 9, expected: 'a quoted name', found: '"}"' });
    expect(findJsonSyntaxProblem('[1] 2')).toMatchObject({ expected: 'the end of the file', column: 5 });
  });

  it('reads strictly: no comments, no trailing commas, no empty text, only JSON whitespace', () => {
    expect(findJsonSyntaxProblem('{"a": 1 /* kVA */}')).toMatchObject({ column: 9, truncated: false, expected: 'no comment (JSON has none)' });
    expect(findJsonSyntaxProblem('// plant\n{}')).toMatchObject({ line: 1, column: 1, expected: 'no comment (JSON has none)' });
    expect(findJsonSyntaxProblem('[1, 2,]')).toMatchObject({ column: 7, expected: 'a value', found: '"]"' });
    expect(findJsonSyntaxProblem('')).toMatchObject({ truncated: true, found: 'the end of the file' });
    expect(findJsonSyntaxProblem('[1]\u00a0')).toMatchObject({ column: 4, truncated: false });
    expect(findJsonSyntaxProblem('\ufeff[1]')).toMatchObject({ column: 1, truncated: false });
    expect(findJsonSyntaxProblem('[01]')).toMatchObject({ column: 3, truncated: false });
    expect(findJsonSyntaxProblem('["a\u0001"]')).toMatchObject({
      column: 2,
      truncated: false,
      expected: 'a closing quote (control characters in a string must be escaped)',
    });
    for (const bad of ['{"a": 1 /* kVA */}', '[1, 2,]', '', '[1]\u00a0', '\ufeff[1]', '[01]', '["a\u0001"]', '[-]', '[1.]', '["\\x"]', '{"a" 1}']) {
      expect(() => JSON.parse(bad), JSON.stringify(bad)).toThrow();
    }
  });

  it('tells a file cut short inside a string, a number or a word from a wrong character', () => {
    expect(findJsonSyntaxProblem('{"ratedKVA": 12')).toMatchObject({ truncated: true, expected: "',' or '}'", found: 'the end of the file' });
    expect(findJsonSyntaxProblem('{"name": "G')).toMatchObject({ truncated: true, column: 10, expected: 'a closing quote' });
    expect(findJsonSyntaxProblem('[2.5e')).toMatchObject({ truncated: true, expected: 'a digit' });
    expect(findJsonSyntaxProblem('[fa')).toMatchObject({ truncated: true, found: '"fa"' });
    expect(findJsonSyntaxProblem('[fx]')).toMatchObject({ truncated: false, found: '"fx"', expected: 'a value' });
  });

  it('says what belonged where an unknown word stands', () => {
    expect(findJsonSyntaxProblem('{"a": 1 x}')).toMatchObject({ column: 9, expected: "','", found: '"x"' });
    expect(findJsonSyntaxProblem('{"a" x}')).toMatchObject({ column: 6, expected: "':'" });
    expect(findJsonSyntaxProblem('{x}')).toMatchObject({ column: 2, expected: 'a quoted name' });
    expect(findJsonSyntaxProblem('[1]x')).toMatchObject({ column: 4, expected: 'the end of the file' });
    expect(findJsonSyntaxProblem('[1] 2')).toMatchObject({ truncated: false });
  });
});
