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
    expect(findJsonSyntaxProblem('{\n "a": tru }')).toEqual({ line: 2, column: 10, truncated: false, expected: '"true"', found: '" "' });
    expect(findJsonSyntaxProblem('{"a": 1,}')).toMatchObject({ line: 1, column: 9, expected: 'a quoted name', found: '"}"' });
    expect(findJsonSyntaxProblem('[1] 2')).toMatchObject({ expected: 'the end of the file', column: 5 });
  });
});
