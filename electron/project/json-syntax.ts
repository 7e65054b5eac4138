/**
 * Finds the first syntax error in a JSON text and says where it is and what was expected.
 * `JSON.parse` messages differ between engines and name only an offset; this scanner gives
 * a line and column, and tells a file that simply stops (cut short by a crash or a full
 * disk) from one with a wrong character in the middle.
 */

/** Where and why a JSON text fails. */
export interface JsonSyntaxProblem {
  /** 1-based line of the problem. */
  line: number;
  /** 1-based column of the problem. */
  column: number;
  /** The text ends before the document is complete. */
  truncated: boolean;
  /** What the scanner expected there, in words ("a value", "',' or '}'"). */
  expected: string;
  /** The character found there (quoted), or "the end of the file". */
  found: string;
}

/** Deeper nesting than this is reported rather than scanned (no project comes close). */
const MAX_DEPTH = 512;

class Stop {
  constructor(
    readonly at: number,
    readonly expected: string,
  ) {}
}

/**
 * Scans `text` as JSON (RFC 8259). Returns null when it is valid, else the first problem.
 * Never throws.
 */
export function findJsonSyntaxProblem(text: string): JsonSyntaxProblem | null {
  let i = 0;
  const n = text.length;

  const ws = (): void => {
    while (i < n) {
      const c = text.charCodeAt(i);
      if (c === 0x20 || c === 0x0a || c === 0x0d || c === 0x09) i++;
      else break;
    }
  };
  const expect = (ch: string, what: string): void => {
    if (text[i] !== ch) throw new Stop(i, what);
    i++;
  };
  const literal = (word: string): void => {
    for (let k = 0; k < word.length; k++) {
      if (text[i] !== word[k]) throw new Stop(i, `"${word}"`);
      i++;
    }
  };
  const digits = (): void => {
    if (!/[0-9]/.test(text[i] ?? '')) throw new Stop(i, 'a digit');
    while (/[0-9]/.test(text[i] ?? '')) i++;
  };
  const number = (): void => {
    if (text[i] === '-') i++;
    if (text[i] === '0') i++;
    else digits();
    if (text[i] === '.') {
      i++;
      digits();
    }
    if (text[i] === 'e' || text[i] === 'E') {
      i++;
      if (text[i] === '+' || text[i] === '-') i++;
      digits();
    }
  };
  const string = (): void => {
    expect('"', 'a quoted name');
    for (;;) {
      if (i >= n) throw new Stop(i, 'a closing quote');
      const c = text.charCodeAt(i);
      if (c === 0x22) {
        i++;
        return;
      }
      if (c < 0x20) throw new Stop(i, 'a closing quote (control characters must be escaped)');
      if (c === 0x5c) {
        i++;
        const e = text[i];
        if (e === 'u') {
          i++;
          for (let k = 0; k < 4; k++) {
            if (!/[0-9a-fA-F]/.test(text[i] ?? '')) throw new Stop(i, 'a hexadecimal digit');
            i++;
          }
        } else if (e !== undefined && '"\\/bfnrt'.includes(e)) i++;
        else throw new Stop(i, 'an escape character');
      } else i++;
    }
  };
  const value = (depth: number): void => {
    if (depth > MAX_DEPTH) throw new Stop(i, `nesting of at most ${MAX_DEPTH} levels`);
    ws();
    const c = text[i];
    if (c === '{') {
      i++;
      ws();
      if (text[i] === '}') {
        i++;
        return;
      }
      for (;;) {
        ws();
        string();
        ws();
        expect(':', "':'");
        value(depth + 1);
        ws();
        if (text[i] === ',') {
          i++;
          continue;
        }
        expect('}', "',' or '}'");
        return;
      }
    }
    if (c === '[') {
      i++;
      ws();
      if (text[i] === ']') {
        i++;
        return;
      }
      for (;;) {
        value(depth + 1);
        ws();
        if (text[i] === ',') {
          i++;
          continue;
        }
        expect(']', "',' or ']'");
        return;
      }
    }
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    if (c === '-' || (c !== undefined && c >= '0' && c <= '9')) return number();
    throw new Stop(i, 'a value');
  };

  try {
    value(0);
    ws();
    if (i < n) throw new Stop(i, 'the end of the file');
    return null;
  } catch (e) {
    if (!(e instanceof Stop)) throw e;
    return locate(text, e.at, e.expected);
  }
}

function locate(text: string, at: number, expected: string): JsonSyntaxProblem {
  const before = text.slice(0, at);
  const line = before.split('\n').length;
  const column = at - before.lastIndexOf('\n');
  const truncated = at >= text.length;
  const ch = text[at];
  const found = ch === undefined ? 'the end of the file' : JSON.stringify(ch);
  return { line, column, truncated, expected, found };
}
