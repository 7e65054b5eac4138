/** Commissioning methods through dispatch: refusals name the field, the record is built with the caution. */
import { describe, expect, it } from 'vitest';
import { dispatch } from '../../electron/handlers';
import { CAUTION } from '../../shared-types';
import type { CommissioningRecord } from '../../shared-types';
import { demoPlantJson } from '../helpers/plants';

const record = { tS: [0, 1, 2, 3], frequencyHz: [50, 50, 49.5, 49.8], voltageV: [400, 400, 380, 398] };
const test = { setId: 'G1', onlineSetIds: ['G1'], startKW: 100, startKVAR: 50, stepKW: 300, stepKVAR: 200, stepAtS: 1.5 };

async function messageOf(method: 'fitTestRecord' | 'parseTestRecord' | 'buildCommissioningRecord', payload: unknown): Promise<string> {
  const r = await dispatch(method, payload);
  if (r.ok) throw new Error('accepted');
  return [r.error.message, ...(r.error.issues ?? []).map((i) => `${i.path}: ${i.message}`)].join('\n');
}

describe('commissioning handlers', () => {
  it('fitTestRecord refuses bad requests by field', async () => {
    expect(await messageOf('fitTestRecord', { plant: demoPlantJson(), record, test, params: [] })).toContain('params: choose at least one parameter');
    expect(await messageOf('fitTestRecord', { plant: demoPlantJson(), record, test, params: [{ key: 'colour', min: 0, max: 1 }] })).toContain(
      'params[0].key: must be one of',
    );
    expect(
      await messageOf('fitTestRecord', {
        plant: demoPlantJson(),
        record: { ...record, tS: [0, 2, 1, 3] },
        test,
        params: [{ key: 'machine.inertiaS', min: 0.5, max: 3 }],
      }),
    ).toContain('record.tS[2]: must increase');
    expect(
      await messageOf('fitTestRecord', {
        plant: demoPlantJson(),
        record,
        test: { ...test, setId: 'G9', onlineSetIds: ['G9'] },
        params: [{ key: 'machine.inertiaS', min: 0.5, max: 3 }],
      }),
    ).toContain('no set "G9"');
    expect(await messageOf('fitTestRecord', { plant: demoPlantJson(), record, test, params: [{ key: 'machine.inertiaS', min: 3, max: 0.5 }] })).toContain(
      'params[0].max: must be greater than min',
    );
    expect(
      await messageOf('fitTestRecord', {
        plant: demoPlantJson(),
        record,
        test: { ...test, stepAtS: 9 },
        params: [{ key: 'machine.inertiaS', min: 0.5, max: 3 }],
      }),
    ).toContain('test.stepAtS: must be inside the record');
  });

  it('parseTestRecord names the unit field', async () => {
    expect(
      await messageOf('parseTestRecord', {
        text: 't,f,v\n0,50,400\n',
        columns: { time: 't', frequency: 'f', voltage: 'v' },
        units: { time: 'min', frequency: 'Hz', voltage: 'V' },
        ratedFrequencyHz: 50,
        ratedVoltageV: 400,
      }),
    ).toContain('units.time: must be "s" or "ms"');
  });

  it('buildCommissioningRecord gives the settings, the sign-off and the caution in CSV and HTML', async () => {
    const r = await dispatch('buildCommissioningRecord', {
      plant: demoPlantJson(),
      setId: 'G2',
      syncCheck: { limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 }, breakerClosingMs: 80 },
      signOff: { by: 'A. Fitter <tech>', date: '2026-12-02', remarks: 'load bank 1' },
      date: '2026-12-02',
    });
    expect(r.ok).toBe(true);
    const v = (r as { value: CommissioningRecord }).value;
    const row = (item: string) => v.rows.find((x) => x.item === item)!;
    expect(row('speed droop').model).toBe('4.00');
    expect(row('no-load frequency').model).toBe('51.20');
    // Advance = 360° × 0.2 Hz × 0.080 s = 5.76° (closed form).
    expect(row('close-command advance at the slip limit').model).toBe('5.8');
    // Reverse power 8 % of 640 kW = 51.2 kW (demo plant G2).
    expect(v.rows.find((x) => x.section === 'Reverse power (device 32)' && x.unit === 'kW')!.model).toBe('51');
    expect(v.csv.split('\n')[0]).toBe(`# Caution: ${CAUTION.charAt(0).toLowerCase()}${CAUTION.slice(1)}`);
    expect(v.csv).toContain('Sign-off,commissioned by,,A. Fitter <tech>,');
    expect(v.html).toContain('A. Fitter &lt;tech&gt;');
    expect(v.html).toContain(CAUTION.replace(/'/g, '&#39;'));
    expect(v.html).not.toContain('<script');
    expect(
      await messageOf('buildCommissioningRecord', { plant: demoPlantJson(), setId: 'G7', signOff: { by: '', date: '', remarks: '' }, date: '' }),
    ).toContain('setId: there is no set "G7"');
  });
});

describe('commissioning record with a fit', () => {
  it('refuses a fit result that lacks what the record prints, naming the field', async () => {
    const r = await dispatch('buildCommissioningRecord', {
      plant: demoPlantJson(),
      setId: 'G1',
      fit: { setId: 'G1', parameters: [{ key: 'machine.inertiaS' }] },
      signOff: { by: '', date: '', remarks: '' },
      date: '2026-12-02',
    });
    expect(r.ok).toBe(false);
    const issues = r.ok ? [] : (r.error.issues ?? []).map((i) => i.path);
    expect(issues).toContain('fit.parameters[0].value');
    expect(issues).toContain('fit.measuredVerdict');
  });
});

describe('a fit passed back into the commissioning record', () => {
  it("is accepted, and its measured figures stand beside the model's", { timeout: 120_000 }, async () => {
    const { readFileSync } = await import('node:fs');
    const text = readFileSync('renderer/demo/example.load-bank.csv', 'utf8');
    const parsed = await dispatch('parseTestRecord', {
      text,
      columns: { time: 'time_s', frequency: 'frequency_Hz', voltage: 'voltage_V' },
      units: { time: 's', frequency: 'Hz', voltage: 'V' },
      ratedFrequencyHz: 50,
      ratedVoltageV: 400,
    });
    if (!parsed.ok) throw new Error(parsed.error.message);
    const t = { setId: 'G1', onlineSetIds: ['G1'], startKW: 250, startKVAR: 150, stepKW: 500, stepKVAR: 300, stepAtS: 2.01 };
    const fit = await dispatch('fitTestRecord', {
      plant: demoPlantJson(),
      record: parsed.value.record,
      test: t,
      params: [{ key: 'machine.inertiaS', min: 0.5, max: 3 }],
      maxIterations: 2,
    });
    if (!fit.ok) throw new Error(fit.error.message);
    const r = await dispatch('buildCommissioningRecord', {
      plant: demoPlantJson(),
      setId: 'G1',
      fit: JSON.parse(JSON.stringify(fit.value)) as unknown,
      test: t,
      signOff: { by: 'x', date: 'y', remarks: '' },
      date: '2026-12-02',
    });
    if (!r.ok) throw new Error(r.error.message + JSON.stringify(r.error.issues));
    const nadir = r.value.rows.find((x) => x.item === 'frequency nadir')!;
    expect(Number(nadir.measured)).toBeCloseTo(fit.value.measuredVerdict.frequencyNadirHz, 3);
    expect(r.value.rows.some((x) => x.section === 'Fitted parameters' && x.item === 'inertia constant H')).toBe(true);
  });
});

describe('the example record', () => {
  it('has its step between two samples, as its test description says (no sample at the instant of the step)', async () => {
    const { readFileSync } = await import('node:fs');
    const text = readFileSync('renderer/demo/example.load-bank.csv', 'utf8');
    const parsed = await dispatch('parseTestRecord', {
      text,
      columns: { time: 'time_s', frequency: 'frequency_Hz', voltage: 'voltage_V', kW: 'P_kW' },
      units: { time: 's', frequency: 'Hz', voltage: 'V', kW: 'kW' },
      ratedFrequencyHz: 50,
      ratedVoltageV: 400,
    });
    if (!parsed.ok) throw new Error(parsed.error.message);
    const { tS, kW, voltageV } = parsed.value.record;
    // The step is at 2.01 s (its comment line, `EXAMPLE_TEST` in the commissioning store and `--step-at` in the CLI test):
    // every sample up to 2.00 s is the load bank at 250 kW (noise ±2 kW, build/scripts/make-example-record.ts), every one
    // from 2.02 s on carries the 500 kW step.
    expect(text).toContain('a step of 500 kW / 300 kVAR at 2.01 s');
    const at200 = tS.findIndex((t) => Math.abs(t - 2) < 1e-9);
    expect(tS[at200 + 1]).toBeCloseTo(2.02, 9);
    for (let k = 0; k <= at200; k++) expect(Math.abs(kW![k]! - 250)).toBeLessThanOrEqual(3);
    for (let k = at200 + 1; k < tS.length; k++) expect(kW![k]!).toBeGreaterThan(700);
    // The voltage at 2.00 s is still the value before the step (within the ±0.3 V noise of the samples before it).
    expect(Math.abs(voltageV[at200]! - voltageV[at200 - 1]!)).toBeLessThan(1);
  });
});
