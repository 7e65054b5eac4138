/**
 * Closed-loop check of the fit: a record the simulator itself produced from known parameters,
 * with seeded noise added, is fitted from perturbed start values and must give the known
 * parameters back.
 */
import { describe, expect, it } from 'vitest';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { fitTestRecord, simulate, withParameters } from '../../../electron/engine';
import type { FitParameterChoice, FitParameterKey, Plant, TestDescription, TestRecord } from '../../../shared-types';
import { makePlant, rawSet } from '../../helpers/plants';

const TRUE: Record<string, number> = { 'machine.inertiaS': 1.5, 'governor.engineLagS': 0.4, 'regulator.gainPU': 40, 'regulator.exciterLagS': 0.15 };
const KEYS = Object.keys(TRUE) as FitParameterKey[];

function basePlant(): Plant {
  return makePlant([rawSet('G1'), rawSet('G2', { online: false })], [{ id: 'L', kW: 100, kVAR: 50 }]);
}

const TEST: TestDescription = { setId: 'G1', onlineSetIds: ['G1'], startKW: 200, startKVAR: 100, stepKW: 500, stepKVAR: 300, stepAtS: 1 };

/** A record of the test from the true parameters, 10 ms samples over 6 s, with uniform noise ±0.01 Hz and ±0.4 V. */
function syntheticRecord(seed: number): TestRecord {
  const plant = basePlant();
  const set = withParameters(
    plant.sets[0]!,
    KEYS,
    KEYS.map((k) => TRUE[k]!),
  );
  const truth: Plant = {
    ...plant,
    sets: [set, { ...plant.sets[1]!, online: false }],
    loads: [{ id: 'LB', name: 'bank', online: true, kW: TEST.startKW, kVAR: TEST.startKVAR, model: 'constant-power', frequencySensitivity: 0 }],
  };
  const r = simulate({
    plant: truth,
    durationS: 6.01,
    stepMs: 2,
    outputPoints: 4000,
    events: [{ atS: 1, type: 'load-step', kW: TEST.stepKW, kVAR: TEST.stepKVAR, model: 'constant-power' }],
  });
  const rng = xoroshiro128plus(42 + seed);
  const noise = (a: number) => a * (2 * uniformFloat64(rng) - 1);
  const rec: TestRecord = { tS: [], frequencyHz: [], voltageV: [] };
  const s = r.series;
  let j = 0;
  for (let k = 0; k <= 600; k++) {
    const t = k * 0.01;
    while (j < s.t.length - 2 && s.t[j + 1]! < t) j++;
    const w = (t - s.t[j]!) / (s.t[j + 1]! - s.t[j]!);
    const at = (y: number[]) => y[j]! + (y[j + 1]! - y[j]!) * Math.min(1, Math.max(0, w));
    rec.tS.push(t);
    rec.frequencyHz.push(at(s.setSpeedHz[0]!) + noise(0.01));
    rec.voltageV.push(at(s.setTerminalV[0]!) + noise(0.4));
  }
  return rec;
}

const BOUNDS: Record<string, [number, number]> = {
  'machine.inertiaS': [0.3, 5],
  'governor.engineLagS': [0.05, 2],
  'regulator.gainPU': [5, 200],
  'regulator.exciterLagS': [0.01, 1],
};
const START: Record<string, number> = { 'machine.inertiaS': 1.0, 'governor.engineLagS': 0.25, 'regulator.gainPU': 70, 'regulator.exciterLagS': 0.08 };

function choices(keys: FitParameterKey[]): FitParameterChoice[] {
  return keys.map((key) => ({ key, min: BOUNDS[key]![0], max: BOUNDS[key]![1], start: START[key] }));
}

describe('fitting the model to a load-bank record', () => {
  const record = syntheticRecord(0);

  it('recovers known parameters from a noisy simulated record (closed loop, within 5 %)', () => {
    const r = fitTestRecord({ plant: basePlant(), record, test: TEST, params: choices(KEYS), maxIterations: 40 });
    for (const q of r.parameters) {
      // Tolerance 5 % of the true value: the noise (±0.01 Hz, ±0.4 V) is what limits it.
      expect(Math.abs(q.value - TRUE[q.key]!) / TRUE[q.key]!, `${q.key}: fitted ${q.value}, true ${TRUE[q.key]}`).toBeLessThan(0.05);
      expect(q.confidence).not.toBe('not determined');
    }
    // The fitted RMS error is the noise's: uniform ±a has RMS a/√3 (closed form); 0.01 Hz of 50 Hz is 0.02 %, 0.4 V of 400 V is 0.1 %.
    expect(r.residual.frequencyPct).toBeLessThan((0.02 / Math.sqrt(3)) * 1.3);
    expect(r.residual.voltagePct).toBeLessThan((0.1 / Math.sqrt(3)) * 1.3);
    expect(r.startResidual.totalPct).toBeGreaterThan(r.residual.totalPct * 2);
    expect(r.iterations).toBeLessThanOrEqual(40);
    expect(r.fitted.tS.length).toBe(record.tS.length);
    expect(r.fittedPlant.sets[0]!.machine.inertiaS).toBe(r.parameters.find((q) => q.key === 'machine.inertiaS')!.value);
    // The measured verdict is the record's: a 500 kW step on a 1000 kW set dips the frequency.
    expect(r.measuredVerdict.frequencyNadirHz).toBeLessThan(r.measuredVerdict.initialFrequencyHz);
    expect(r.measuredVerdict.classes.length).toBe(9);
  }, 120_000);

  it('gives the same answer whatever the order of the parameters', () => {
    const a = fitTestRecord({ plant: basePlant(), record, test: TEST, params: choices(KEYS), maxIterations: 40 });
    const b = fitTestRecord({ plant: basePlant(), record, test: TEST, params: choices([...KEYS].reverse()), maxIterations: 40 });
    for (const q of a.parameters) {
      const other = b.parameters.find((x) => x.key === q.key)!;
      expect(Math.abs(other.value - q.value) / q.value, q.key).toBeLessThan(1e-3);
    }
  }, 120_000);
});
