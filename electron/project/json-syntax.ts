/**
 * Finds the first syntax error in a JSON text and says where it is and what was expected.
 * `JSON.parse` messages differ between engines and name only an offset; this gives a line and
 * column, and tells a file that simply stops (cut short by a crash or a full disk) from one with a
 * wrong character in the middle. The reading itself is `jsonc-parser`'s, run strictly (no
 * comments, no trailing commas, no empty text), so it accepts exactly what RFC 8259 accepts.
 */
import { parse, printParseErrorCode } from 'jsonc-parser';
import type { ParseError, ParseErrorCode } from 'jsonc-parser';

/** The error kind's name ('InvalidSymbol', …); the package's enum is type-only here (a const enum). */
type Kind = ReturnType<typeof printParseErrorCode>;
const kind = (code: ParseErrorCode): Kind => printParseErrorCode(code);

/** Where and why a JSON text fails. */
export interface JsonSyntaxProblem {
  /** 1-based line of the problem. */
  line: number;
  /** 1-based column of the problem. */
  column: number;
  /** The text ends before the document is complete. */
  truncated: boolean;
  /** What was expected there, in words ("a value", "',' or '}'"). */
  expected: string;
  /** What was found there (quoted), or "the end of the file". */
  found: string;
}

/** The parser's error kinds in words. Errors inside a string or number point at its first character. */
const EXPECTED: Partial<Record<Kind, string>> = {
  InvalidSymbol: 'a value',
  InvalidNumberFormat: 'a number',
  PropertyNameExpected: 'a quoted name',
  ValueExpected: 'a value',
  ColonExpected: "':'",
  CommaExpected: "','",
  CloseBraceExpected: "',' or '}'",
  CloseBracketExpected: "',' or ']'",
  EndOfFileExpected: 'the end of the file',
  InvalidCommentToken: 'no comment (JSON has none)',
  UnexpectedEndOfComment: 'no comment (JSON has none)',
  UnexpectedEndOfString: 'a closing quote',
  UnexpectedEndOfNumber: 'a digit',
  InvalidUnicode: 'four hexadecimal digits after \\u',
  InvalidEscapeCharacter: 'a known escape (\\" \\\\ \\/ \\b \\f \\n \\r \\t \\u)',
  InvalidCharacter: 'a closing quote (control characters in a string must be escaped)',
};

/** Errors whose token may be the start of something the missing rest would complete. */
const UNFINISHED = new Set<Kind>(['UnexpectedEndOfString', 'UnexpectedEndOfNumber', 'UnexpectedEndOfComment']);

/** True when the error is the text running out rather than a wrong character. */
function isTruncation(text: string, e: ParseError): boolean {
  if (e.offset >= text.length) return true;
  if (e.offset + e.length < text.length) return false;
  if (UNFINISHED.has(kind(e.error))) return true;
  // A word cut short: "tr" of true, "-" of a negative number.
  if (kind(e.error) === 'InvalidSymbol') {
    const token = text.slice(e.offset);
    return token === '-' || ['true', 'false', 'null'].some((w) => w.startsWith(token));
  }
  return false;
}

/**
 * The parser flags an unknown word ("x", "tru") without regard to where it stands. To say what
 * belonged there, the word is read again as a plain value (`0`, padded so offsets stay put): a
 * structural error at that place (a missing ',' or ':', a name expected) is what was wanted;
 * none means a value was.
 */
function expectedInPlaceOf(text: string, e: ParseError): string | undefined {
  const patched = text.slice(0, e.offset) + '0' + ' '.repeat(Math.max(0, e.length - 1)) + text.slice(e.offset + e.length);
  const again: ParseError[] = [];
  parse(patched, again, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
  const there = again.find((x) => x.offset === e.offset);
  return there && STRUCTURAL.has(kind(there.error)) ? EXPECTED[kind(there.error)] : undefined;
}

const STRUCTURAL = new Set<Kind>(['CommaExpected', 'ColonExpected', 'PropertyNameExpected', 'CloseBraceExpected', 'CloseBracketExpected', 'EndOfFileExpected']);

/**
 * Reads `text` as JSON (RFC 8259). Returns null when it is valid, else the first problem.
 * Never throws (a nesting deeper than the parser can follow gives null: the caller then
 * reports the file as unreadable without a place).
 */
export function findJsonSyntaxProblem(text: string): JsonSyntaxProblem | null {
  const errors: ParseError[] = [];
  try {
    parse(text, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
  } catch {
    return null;
  }
  const first = errors[0];
  if (!first) return null;
  const before = text.slice(0, first.offset);
  const line = before.split('\n').length;
  const column = first.offset - before.lastIndexOf('\n');
  const truncated = isTruncation(text, first);
  const expected = (kind(first.error) === 'InvalidSymbol' && expectedInPlaceOf(text, first)) || EXPECTED[kind(first.error)] || 'valid JSON';
  const token = kind(first.error) === 'InvalidSymbol' ? text.slice(first.offset, first.offset + Math.min(first.length, 20)) : text[first.offset];
  const found = token === undefined || token === '' ? 'the end of the file' : JSON.stringify(token);
  return { line, column, truncated, expected, found };
}
