// Words and numbers: the one presentation module the renderer, the CLI and the report import.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  csvField,
  CAUTION,
  CAUTION_AFTER_LABEL,
  CSV_CAUTION_LINE,
  FLAG_WORDS,
  flagWords,
  CHART_PALETTE,
  escapeHtml,
  formatAngleDeg,
  formatCurrentA,
  formatHz,
  formatMs,
  formatNumber,
  formatPercent,
  formatPF,
  formatPU,
  formatSeconds,
  formatSigned,
  isoClassName,
  issueInWords,
  messageInWords,
  pathInWords,
} from '../../shared-types';

describe('number formats', () => {
  it('never prints NaN or a negative zero', () => {
    expect(formatNumber(Number.NaN, 1)).toBe('—');
    expect(formatNumber(null, 1)).toBe('—');
    expect(formatNumber(Number.POSITIVE_INFINITY, 0)).toBe('—');
    expect(formatNumber(-0.04, 1)).toBe('0.0');
    expect(formatNumber(-0.4, 0)).toBe('0');
    expect(formatNumber(-1.25, 1)).toBe('-1.3');
  });
  it('signs deviations with a true minus and gives a power factor its sense', () => {
    expect(formatSigned(1.23, 1)).toBe('+1.2');
    expect(formatSigned(-0.44, 1)).toBe('−0.4');
    expect(formatSigned(-0.01, 1)).toBe('0.0');
    // An axis whose every tick is signed (the closing map's slip axis): zero or more carries "+", the keyboard minus.
    expect(formatSigned(0, 2, { ascii: true, plusAtZero: true })).toBe('+0.00');
    expect(formatSigned(0.0001, 3, { ascii: true, plusAtZero: true })).toBe('+0.000');
    expect(formatSigned(-0.0001, 3, { ascii: true, plusAtZero: true })).toBe('0.000');
    expect(formatSigned(-0.25, 2, { ascii: true, plusAtZero: true })).toBe('-0.25');
    expect(formatSigned(0.25, 2, { ascii: true, plusAtZero: true })).toBe('+0.25');
    expect(formatPF(0.851, true)).toBe('0.85 lag');
    expect(formatPF(0.97, false)).toBe('0.97 lead');
    expect(formatPF(0.9999, false)).toBe('1.00');
  });
  it('gives currents to the ampere', () => {
    // 1250 kVA at 400 V: I = S / (√3 V) = 1804.22 A (closed form) → "1804".
    expect(formatCurrentA(1_250_000 / (Math.sqrt(3) * 400))).toBe('1804');
    expect(formatCurrentA(1056.91)).toBe('1057');
  });
});

describe('one formatter per kind of figure', () => {
  it('writes each kind with its unit, never "-0", and "—" without a unit for a blank', () => {
    expect(formatPercent(12.345)).toBe('12.3 %');
    expect(formatPercent(-0.04)).toBe('0.0 %');
    expect(formatHz(49.99951)).toBe('50.000 Hz');
    expect(formatHz(-0.0004)).toBe('0.000 Hz');
    expect(formatAngleDeg(-7.2)).toBe('-7.2°');
    expect(formatAngleDeg(-0.04)).toBe('0.0°');
    expect(formatMs(79.6)).toBe('80 ms');
    expect(formatSeconds(1.254)).toBe('1.25 s');
    expect(formatPU(1.054)).toBe('1.05 pu');
    for (const f of [formatPercent, formatHz, formatAngleDeg, formatMs, formatSeconds, formatPU]) {
      expect(f(Number.NaN)).toBe('—');
      expect(f(undefined)).toBe('—');
      expect(f(null)).toBe('—');
    }
  });
  it('signs with the keyboard minus where a readout always has, and leaves zero unsigned', () => {
    expect(formatSigned(-73.44, 1, { ascii: true })).toBe('-73.4');
    expect(formatSigned(0.1, 3, { ascii: true })).toBe('+0.100');
    expect(formatSigned(-0.0004, 3, { ascii: true })).toBe('0.000');
    expect(formatSigned(undefined, 1)).toBe('—');
  });
  it('escapes the HTML-special characters of user text', () => {
    expect(escapeHtml(`<a href="x">R&D's</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;R&amp;D&#39;s&lt;/a&gt;');
  });
  it('keeps one palette whose series colours the app’s light theme also declares', () => {
    const css = readFileSync(new URL('../../renderer/styles/base.css', import.meta.url), 'utf8');
    const light = css.slice(0, css.indexOf('--series-5') + 30);
    CHART_PALETTE.series.forEach((c, i) => expect(light).toContain(`--series-${i + 1}: ${c};`));
    for (const k of ['fg', 'muted', 'accent', 'good', 'warn', 'bad'] as const) expect(css).toContain(CHART_PALETTE[k]);
  });
});

describe('words', () => {
  it('puts field paths into words for the screens', () => {
    expect(pathInWords('sets[1].governor.droopPct')).toBe('set 2, governor droop');
    expect(pathInWords('sets[0].ratedKVA')).toBe('set 1, rated apparent power');
    expect(pathInWords('events[2].kW')).toBe('event 3, active power');
    expect(pathInWords('durationS')).toBe('length');
    expect(pathInWords('someNewField')).toBe('someNewField');
  });
  it('turns field names inside a rule into words and keeps the rest', () => {
    expect(messageInWords('must not exceed ratedKVA')).toBe('must not exceed rated apparent power');
    expect(messageInWords('must be below livePct')).toBe('must be below live threshold');
    expect(messageInWords('must be below someNewField')).toBe('must be below someNewField');
    expect(messageInWords('must be a number (kW)')).toBe('must be a number (kW)');
    expect(issueInWords({ path: 'sets[0].minKW', message: 'must not exceed ratedKW' })).toBe('set 1, minimum output: must not exceed rated active power');
  });
  it('has one flag vocabulary, and names ISO 8528-5 classes so they never read as set ids', () => {
    expect(FLAG_WORDS['overload-kW'].words).toBe('kW overload');
    expect(flagWords('something-new').words).toBe('something-new');
    expect(isoClassName('G3')).toBe('class G3');
  });
  it('has one caution sentence, and the preview script prints the same one', () => {
    expect(CAUTION).toMatch(/^Planning and training only\. Verify against makers' data, protection studies, local codes and licensed practice\./);
    expect(CAUTION_AFTER_LABEL).toMatch(/^planning and training only\./);
    expect(CSV_CAUTION_LINE).toBe(`# Caution: ${CAUTION_AFTER_LABEL}`);
    const script = readFileSync(new URL('../../build/scripts/preview.mjs', import.meta.url), 'utf8');
    expect(script).toContain(JSON.stringify(CAUTION));
  });
  it('writes one CSV field the way RFC 4180 (section 2, rules 5–7) asks, for every export', () => {
    expect(csvField('G1')).toBe('G1');
    expect(csvField('a, b')).toBe('"a, b"');
    expect(csvField('say "ok"')).toBe('"say ""ok"""');
    expect(csvField('line\nbreak')).toBe('"line\nbreak"');
    expect(csvField('cr\rhere')).toBe('"cr\rhere"');
    expect(csvField(-0.125)).toBe('-0.125');
    expect(csvField(Number.NaN)).toBe('');
    expect(csvField(null)).toBe('');
  });
});
