/**
 * Reading a load-bank test record: a delimited text file (comma, semicolon or tab) with a
 * header line and one row per sample. Lines starting with `#` (such as the caution line
 * `droopline simulate --csv` writes) and blank lines are passed over. The caller chooses the
 * columns and their units; the record comes back in s, Hz, V, kW, kVAR and A.
 *
 * A malformed file is refused whole (`InvalidInput` naming the line and the reason): a missing
 * column, text where a number belongs, a row with too few fields, time that does not increase,
 * no data rows. Nothing is imported in part.
 */
import type { ParseRecordRequest, ParsedTestRecord, RecordColumns, RecordInspection, RecordUnits, TestRecord } from '../../../shared-types';
import { InvalidInput } from '../errors';

/** Most data rows a record may have (a 10 minute test at 3 ms; bounded work). */
export const MAX_RECORD_ROWS = 200_000;
/** Longest record, s. */
export const MAX_RECORD_S = 600;
/** Rows a preview shows. */
const SAMPLE_ROWS = 8;

interface Lines {
  /** [line number (1-based), text] of the non-comment, non-blank lines. */
  rows: [number, string][];
  skipped: number;
}

function splitLines(text: string): Lines {
  const rows: [number, string][] = [];
  let skipped = 0;
  const all = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  all.forEach((line, k) => {
    const t = line.trim();
    if (t === '' || t.startsWith('#')) {
      skipped++;
      return;
    }
    rows.push([k + 1, line]);
  });
  return { rows, skipped };
}

function findDelimiter(header: string): ',' | ';' | '\t' {
  const counts: [',' | ';' | '\t', number][] = [
    [',', header.split(',').length],
    [';', header.split(';').length],
    ['\t', header.split('\t').length],
  ];
  counts.sort((a, b) => b[1] - a[1]);
  return counts[0]![1] > 1 ? counts[0]![0] : ',';
}

function cells(line: string, delimiter: string): string[] {
  return line.split(delimiter).map((c) =>
    c
      .trim()
      .replace(/^"(.*)"$/, '$1')
      .trim(),
  );
}

const norm = (s: string) => s.toLowerCase().replace(/[\s_\-()[\]]/g, '');

function header(text: string): { lines: Lines; headers: string[]; headerLine: number; delimiter: ',' | ';' | '\t' } {
  if (text.trim() === '') throw new InvalidInput('line 1: the file is empty (it needs a header line and data rows)');
  const lines = splitLines(text);
  const first = lines.rows[0];
  if (!first) throw new InvalidInput('line 1: the file has only comment or blank lines (it needs a header line and data rows)');
  const delimiter = findDelimiter(first[1]);
  const headers = cells(first[1], delimiter);
  return { lines, headers, headerLine: first[0], delimiter };
}

function guessUnit<T extends string>(name: string, options: [RegExp, T][], fallback: T): T {
  for (const [re, unit] of options) if (re.test(name)) return unit;
  return fallback;
}

/** The header, a preview and a first guess at the columns and units (from their names). */
export function inspectTestRecord(text: string): RecordInspection {
  const { lines, headers, headerLine, delimiter } = header(text);
  const find = (re: RegExp) => headers.find((h) => re.test(norm(h)));
  const columns: Partial<RecordColumns> = {};
  const time = find(/^(t|time|times?|ts|tms)/);
  const freq = find(/^(f|freq|frequency|hz|speed)/) ?? find(/hz/);
  const volt = find(/^(v|volt|voltage|u|vll)/) ?? find(/(^|[^k])v$/);
  const kw = find(/^(p|kw|mw|power|active)/) ?? find(/kw$/);
  const kvar = find(/^(q|kvar|mvar|reactive)/) ?? find(/var$/);
  const amps = find(/^(i|a|current|amps?)/);
  if (time) columns.time = time;
  if (freq) columns.frequency = freq;
  if (volt) columns.voltage = volt;
  if (kw) columns.kW = kw;
  if (kvar) columns.kVAR = kvar;
  if (amps) columns.current = amps;
  const units: RecordUnits = {
    time: guessUnit(norm(time ?? ''), [[/ms$/, 'ms']], 's'),
    frequency: guessUnit(
      norm(freq ?? ''),
      [
        [/pu$/, 'pu'],
        [/%$|pct$/, '%'],
      ],
      'Hz',
    ),
    voltage: guessUnit(
      norm(volt ?? ''),
      [
        [/kv$/, 'kV'],
        [/pu$/, 'pu'],
        [/%$|pct$/, '%'],
      ],
      'V',
    ),
  };
  if (kw) units.kW = guessUnit<'kW' | 'MW'>(norm(kw), [[/mw$/, 'MW']], 'kW');
  if (kvar) units.kVAR = guessUnit<'kVAR' | 'MVAR'>(norm(kvar), [[/mvar$/, 'MVAR']], 'kVAR');
  if (amps) units.current = guessUnit<'A' | 'kA'>(norm(amps), [[/ka$/, 'kA']], 'A');
  const data = lines.rows.slice(1);
  return {
    headers,
    headerLine,
    dataRows: data.length,
    sample: data.slice(0, SAMPLE_ROWS).map(([, l]) => cells(l, delimiter)),
    guess: { columns, units },
    delimiter,
  };
}

const FIELD_NAMES: Record<keyof RecordColumns, string> = {
  time: 'time',
  frequency: 'frequency',
  voltage: 'voltage',
  kW: 'kW',
  kVAR: 'kVAR',
  current: 'current',
};

function columnIndex(headers: string[], choice: string | number, field: keyof RecordColumns, headerLine: number): number {
  if (typeof choice === 'number') {
    if (!Number.isInteger(choice) || choice < 1 || choice > headers.length)
      throw new InvalidInput(`line ${headerLine}: columns.${field}: column ${choice} does not exist (the header has ${headers.length} columns)`);
    return choice - 1;
  }
  const k = headers.findIndex((h) => norm(h) === norm(choice));
  if (k < 0)
    throw new InvalidInput(
      `line ${headerLine}: columns.${field}: there is no column "${choice}" in the header (it has ${headers.map((h) => `"${h}"`).join(', ')})`,
    );
  return k;
}

/** A number as written in a record: plain decimal or exponent notation, a point as decimal mark. */
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads the record with the caller's columns and units.
 * @throws InvalidInput with the line and the reason; nothing is imported in part.
 */
export function parseTestRecord(req: ParseRecordRequest): ParsedTestRecord {
  const { lines, headers, headerLine, delimiter } = header(req.text);
  const wanted = (Object.keys(FIELD_NAMES) as (keyof RecordColumns)[]).filter((f) => req.columns[f] !== undefined);
  const index = new Map<keyof RecordColumns, number>();
  for (const f of wanted) index.set(f, columnIndex(headers, req.columns[f]!, f, headerLine));
  const data = lines.rows.slice(1);
  if (data.length === 0) throw new InvalidInput(`line ${headerLine}: the file has a header but no data rows`);
  if (data.length > MAX_RECORD_ROWS)
    throw new InvalidInput(
      `line ${data[MAX_RECORD_ROWS]![0]}: the record has ${data.length} data rows; at most ${MAX_RECORD_ROWS.toLocaleString('en')} are read (shorten or decimate it)`,
    );
  const fr = req.ratedFrequencyHz;
  const vr = req.ratedVoltageV;
  const u = req.units;
  const scale: Record<keyof RecordColumns, number> = {
    time: u.time === 'ms' ? 1e-3 : 1,
    frequency: u.frequency === 'pu' ? fr : u.frequency === '%' ? fr / 100 : 1,
    voltage: u.voltage === 'kV' ? 1000 : u.voltage === 'pu' ? vr : u.voltage === '%' ? vr / 100 : 1,
    kW: u.kW === 'MW' ? 1000 : 1,
    kVAR: u.kVAR === 'MVAR' ? 1000 : 1,
    current: u.current === 'kA' ? 1000 : 1,
  };
  const out: Record<keyof RecordColumns, number[]> = { time: [], frequency: [], voltage: [], kW: [], kVAR: [], current: [] };
  const width = Math.max(...[...index.values()]) + 1;
  for (const [lineNo, line] of data) {
    const c = cells(line, delimiter);
    if (c.length < width) throw new InvalidInput(`line ${lineNo}: has ${c.length} fields, the chosen columns need at least ${width}`);
    for (const f of wanted) {
      const text = c[index.get(f)!]!;
      if (!NUMBER.test(text)) throw new InvalidInput(`line ${lineNo}: ${FIELD_NAMES[f]} ("${headers[index.get(f)!]}"): "${text}" is not a number`);
      out[f].push(Number(text) * scale[f]);
    }
    const n = out.time.length;
    if (n > 1 && !(out.time[n - 1]! > out.time[n - 2]!))
      throw new InvalidInput(
        `line ${lineNo}: time must increase: ${text(out.time[n - 1]! / scale.time)} after ${text(out.time[n - 2]! / scale.time)} ${u.time}`,
      );
    const f = out.frequency[n - 1]!;
    const v = out.voltage[n - 1]!;
    if (!(f > 0)) throw new InvalidInput(`line ${lineNo}: frequency must be greater than 0 (got ${text(f)} Hz)`);
    if (!(v >= 0)) throw new InvalidInput(`line ${lineNo}: voltage must be 0 or more (got ${text(v)} V)`);
  }
  const t = out.time;
  const span = t[t.length - 1]! - t[0]!;
  if (t.length < 3) throw new InvalidInput(`line ${data[data.length - 1]![0]}: the record has ${t.length} data rows; a fit needs at least 3`);
  if (span > MAX_RECORD_S) throw new InvalidInput(`line ${data[data.length - 1]![0]}: the record spans ${text(span)} s; at most ${MAX_RECORD_S} s are read`);
  const record: TestRecord = { tS: t, frequencyHz: out.frequency, voltageV: out.voltage };
  if (index.has('kW')) record.kW = out.kW;
  if (index.has('kVAR')) record.kVAR = out.kVAR;
  if (index.has('current')) record.currentA = out.current;
  const notes: string[] = [];
  let dtMin = Infinity;
  let dtMax = 0;
  for (let k = 1; k < t.length; k++) {
    dtMin = Math.min(dtMin, t[k]! - t[k - 1]!);
    dtMax = Math.max(dtMax, t[k]! - t[k - 1]!);
  }
  notes.push(`${t.length} samples over ${text(span)} s from ${text(t[0]!)} s`);
  if (dtMax > dtMin * 1.5) notes.push(`uneven time base: samples ${text(dtMin * 1000)} ms to ${text(dtMax * 1000)} ms apart (read as given)`);
  return { record, rows: t.length, skippedLines: lines.skipped, notes };
}

function text(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(6)));
}
