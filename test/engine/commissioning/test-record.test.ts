/** Reading load-bank test records: columns and units chosen by the caller, malformed files refused whole. */
import { describe, expect, it } from 'vitest';
import { inspectTestRecord, parseTestRecord, recordVerdict } from '../../../electron/engine';
import type { ParseRecordRequest } from '../../../shared-types';
import { expectClose } from '../../helpers/expect-close';

const SECONDS = `# Caution: invented record
t_s,frequency_Hz,voltage_V,kW
0.00,50.00,400.0,200
0.10,49.90,396.0,700
0.20,49.80,398.0,700
`;

const base = (text: string, over: Partial<ParseRecordRequest> = {}): ParseRecordRequest => ({
  text,
  columns: { time: 't_s', frequency: 'frequency_Hz', voltage: 'voltage_V' },
  units: { time: 's', frequency: 'Hz', voltage: 'V' },
  ratedFrequencyHz: 50,
  ratedVoltageV: 400,
  ...over,
});

function refusal(req: ParseRecordRequest): string {
  try {
    parseTestRecord(req);
  } catch (e) {
    return (e as Error).message;
  }
  throw new Error('the record was not refused');
}

describe('reading a test record', () => {
  it('reads seconds, hertz and volts, passing over comment lines', () => {
    const r = parseTestRecord(
      base(SECONDS, {
        columns: { time: 't_s', frequency: 'frequency_Hz', voltage: 'voltage_V', kW: 'kW' },
        units: { time: 's', frequency: 'Hz', voltage: 'V', kW: 'kW' },
      }),
    );
    expect(r.record.tS).toEqual([0, 0.1, 0.2]);
    expect(r.record.frequencyHz).toEqual([50, 49.9, 49.8]);
    expect(r.record.kW).toEqual([200, 700, 700]);
    expect(r.skippedLines).toBe(2); // the comment and the final empty line
  });

  it('reads the same record in milliseconds, per unit and kilovolts, semicolon-separated, by column number', () => {
    const text = 'Time (ms);Speed pu;U kV\n0;1.000;0.4000\n100;0.998;0.3960\n200;0.996;0.3980\n';
    const r = parseTestRecord(base(text, { columns: { time: 1, frequency: 2, voltage: 3 }, units: { time: 'ms', frequency: 'pu', voltage: 'kV' } }));
    const s = parseTestRecord(base(SECONDS));
    // 100 ms = 0.1 s; 0.998 pu × 50 Hz = 49.9 Hz; 0.396 kV = 396 V (closed form).
    r.record.tS.forEach((t, k) => expectClose(t, s.record.tS[k]!, { abs: 1e-12 }, `t[${k}]`));
    r.record.frequencyHz.forEach((f, k) => expectClose(f, s.record.frequencyHz[k]!, { abs: 1e-9 }, `f[${k}]`));
    r.record.voltageV.forEach((v, k) => expectClose(v, s.record.voltageV[k]!, { abs: 1e-9 }, `V[${k}]`));
  });

  it('reads % of rated frequency and voltage', () => {
    const r = parseTestRecord(
      base('t,f,v\n0,100,100\n1,99.5,97\n2,99,98\n', {
        columns: { time: 't', frequency: 'f', voltage: 'v' },
        units: { time: 's', frequency: '%', voltage: '%' },
      }),
    );
    expect(r.record.frequencyHz[1]).toBeCloseTo(49.75, 12);
    expect(r.record.voltageV[1]).toBeCloseTo(388, 12);
  });

  it('guesses columns and units from the header', () => {
    const i = inspectTestRecord('time_ms,freq_Hz,V_kV,P_kW,Q_kVAR\n0,50,0.4,1,1\n');
    expect(i.guess.columns).toMatchObject({ time: 'time_ms', frequency: 'freq_Hz', voltage: 'V_kV', kW: 'P_kW', kVAR: 'Q_kVAR' });
    expect(i.guess.units).toMatchObject({ time: 'ms', frequency: 'Hz', voltage: 'kV' });
    expect(i.dataRows).toBe(1);
  });

  it('refuses an empty file', () => {
    expect(refusal(base(''))).toMatch(/^line 1: the file is empty/);
    expect(refusal(base('# only a comment\n'))).toMatch(/^line 1: the file has only comment/);
    expect(refusal(base('t_s,frequency_Hz,voltage_V\n'))).toMatch(/^line 1: the file has a header but no data rows/);
  });

  it('refuses a missing column, naming the header line', () => {
    expect(refusal(base('# c\nt_s,frequency_Hz\n0,50\n1,50\n2,50\n'))).toMatch(/^line 2: columns.voltage: there is no column "voltage_V"/);
  });

  it('refuses text in a number, naming the line and the column', () => {
    expect(refusal(base('t_s,frequency_Hz,voltage_V\n0,50,400\n0.1,fifty,400\n0.2,50,400\n'))).toBe(
      'line 3: frequency ("frequency_Hz"): "fifty" is not a number',
    );
    expect(refusal(base('t_s,frequency_Hz,voltage_V\n0,50,400\n0.1,50,\n0.2,50,400\n'))).toMatch(/^line 3: voltage \("voltage_V"\): "" is not a number/);
  });

  it('refuses time that does not increase', () => {
    expect(refusal(base('t_s,frequency_Hz,voltage_V\n0,50,400\n0.2,50,400\n0.1,50,400\n'))).toBe('line 4: time must increase: 0.1 after 0.2 s');
    expect(refusal(base('t_s,frequency_Hz,voltage_V\n0,50,400\n0,50,400\n0.1,50,400\n'))).toMatch(/^line 3: time must increase/);
  });

  it('refuses a short row', () => {
    expect(refusal(base('t_s,frequency_Hz,voltage_V\n0,50,400\n0.1,50\n0.2,50,400\n'))).toMatch(/^line 3: has 2 fields/);
  });
});

describe('ISO 8528-5 verdict of a measured record', () => {
  it('reads the dip, the settled value and the recovery from the samples', () => {
    // A record with a step at 1 s: frequency falls linearly 50 → 48 Hz by 1.5 s, then rises to 49.5 Hz by 3 s and stays.
    const t: number[] = [];
    const f: number[] = [];
    const v: number[] = [];
    for (let k = 0; k <= 1000; k++) {
      const s = k * 0.01;
      t.push(s);
      f.push(s < 1 ? 50 : s < 1.5 ? 50 - 4 * (s - 1) : s < 3 ? 48 + (1.5 * (s - 1.5)) / 1.5 : 49.5);
      v.push(400);
    }
    const r = recordVerdict({ tS: t, frequencyHz: f, voltageV: v, stepAtS: 1, ratedFrequencyHz: 50, ratedVoltageV: 400, droopPct: 4 });
    expectClose(r.initialFrequencyHz, 50, { abs: 1e-12 }, 'initial Hz');
    expectClose(r.frequencyNadirHz, 48, { abs: 1e-9 }, 'nadir Hz');
    expectClose(r.settledFrequencyHz, 49.5, { abs: 1e-12 }, 'settled Hz');
    // Dip (48 − 50) / 50 = −4 % (ISO 8528-5 transient deviation, closed form): class G3 (−7 %) passes.
    const dip = r.classes.find((c) => c.quantity.startsWith('transient frequency deviation, load on'))!;
    expectClose(dip.measured!, -4, { abs: 1e-9 }, 'dip %');
    expect(dip.pass.G3).toBe(true);
    // Recovery into ±0.75 % (G2: half the 1.5 % band) of 49.5 Hz = 49.125 Hz on the rise 48 + (s − 1.5): s = 2.625 s, 1.625 s after the step (closed form).
    expectClose(r.frequencyRecoveryS!, 1.63, { abs: 0.011 }, 'recovery s');
  });
});
