/**
 * Scenarios that together walk every branch of the simulator's step (governor modes, regulator modes, isochronous
 * load-sharing link, cross-current group, trips, protection, a close, a ramp, a motor start, load shedding, a
 * de-excited start, frequency-dependent and constant-impedance loads) and a compact fingerprint of each run.
 *
 * The stored fingerprints (`fixtures/run-fingerprints.json`) are a regression record written by this engine itself
 * before its step loop was reworked for speed (`WRITE_FINGERPRINTS=1 npx vitest run test/engine/simulation/fingerprint.test.ts`):
 * they are not reference values, only "the same answer as before, up to floating-point noise".
 */
import { simulate } from '../../../electron/engine';
import type { Scenario, SimulationResult } from '../../../shared-types';
import { demoPlant, makePlant, rawSet } from '../../helpers/plants';

export interface Fingerprint {
  steps: number;
  /** The series sampled at a fixed set of indices: frequency, voltage, then kW / kVAR / speed / terminal V per set. */
  samples: number[];
  metrics: number[];
  log: string[];
}

function pick(xs: number[], count: number): number[] {
  const out: number[] = [];
  for (let k = 0; k < count; k++) out.push(xs[Math.floor((k * (xs.length - 1)) / (count - 1))]!);
  return out;
}

export function fingerprint(r: SimulationResult): Fingerprint {
  const s = r.series;
  const samples = [...pick(s.frequencyHz, 25), ...pick(s.voltageV, 25)];
  for (let i = 0; i < s.setIds.length; i++)
    samples.push(...pick(s.setKW[i]!, 12), ...pick(s.setKVAR[i]!, 12), ...pick(s.setSpeedHz[i]!, 12), ...pick(s.setTerminalV[i]!, 12));
  const m = r.metrics;
  const metrics = [
    m.frequencyNadirHz,
    m.frequencyPeakHz,
    m.voltageDipPct,
    m.final.frequencyHz,
    m.final.voltageV,
    ...m.final.sets.flatMap((x) => [x.kW, x.kVAR]),
  ].map((x) => (typeof x === 'number' ? x : Number.NaN));
  return { steps: r.steps, samples, metrics, log: r.log.map((l) => `${l.atS.toFixed(4)} ${l.text}`) };
}

export function fingerprintScenarios(): { name: string; scenario: Scenario }[] {
  const demo = demoPlant();
  const mixed = makePlant(
    [
      rawSet('D', { governor: { mode: 'droop', droopPct: 4, noLoadHz: 52 }, regulator: { mode: 'reactive-droop', droopPct: 4, noLoadV: 416 } }),
      rawSet('I1', { governor: { mode: 'isochronous', setpointHz: 50 }, regulator: { mode: 'cross-current', droopPct: 4, setpointV: 400 } }),
      rawSet('I2', {
        ratedKVA: 800,
        ratedKW: 640,
        governor: { mode: 'isochronous', setpointHz: 50 },
        regulator: { mode: 'cross-current', droopPct: 4, setpointV: 400 },
        feeder: { rOhm: 0.004, xOhm: 0.003 },
      }),
      rawSet('B', { governor: { mode: 'baseload', baseKW: 300 }, regulator: { mode: 'power-factor', pf: 0.95, setpointV: 400 } }),
      rawSet('V', {
        online: false,
        governor: { mode: 'droop', droopPct: 3, noLoadHz: 51.5 },
        regulator: { mode: 'voltage', setpointV: 400, shuntExcited: true },
      }),
    ],
    [
      { id: 'P', kW: 1400, kVAR: 900, frequencySensitivity: 1.5 },
      { id: 'Z', kW: 300, kVAR: 100, model: 'constant-impedance', frequencySensitivity: 1 },
      { id: 'S', kW: 200, kVAR: 50, shedFrequencyPct: 96, shedDelayS: 0.3 },
    ],
  );
  const weak = makePlant([rawSet('A'), rawSet('B', { reversePowerTripPct: 5 })], [{ id: 'L', kW: 1500, kVAR: 1100 }]);
  return [
    {
      name: 'demo plant, load step and trip',
      scenario: {
        plant: demo,
        durationS: 6,
        stepMs: 1,
        events: [
          { atS: 1, type: 'load-step', kW: 300, kVAR: 150 },
          { atS: 3.5, type: 'trip', setId: 'G3' },
        ],
      },
    },
    {
      name: 'mixed modes: close, ramp, setpoints, motor start, shedding',
      scenario: {
        plant: mixed,
        durationS: 8,
        stepMs: 1,
        startDeExcited: ['V'],
        events: [
          { atS: 0.5, type: 'setpoint', setId: 'D', frequencyHz: 51.8, voltageV: 412 },
          { atS: 1, type: 'ramp', setId: 'B', toKW: 600, durationS: 2 },
          { atS: 2, type: 'close', setId: 'V', frequencyHz: 50.2, voltageV: 402, angleDeg: 12 },
          { atS: 3, type: 'motor-start', kVA: 1800, pf: 0.3, durationS: 1.5 },
          { atS: 5, type: 'load-step', kW: 1500, kVAR: 600 },
          { atS: 6.5, type: 'trip', setId: 'I2', openBreaker: false },
        ],
      },
    },
    {
      name: 'overloaded pair: reverse power, under-frequency and the limits',
      scenario: {
        plant: weak,
        durationS: 5,
        stepMs: 2,
        events: [
          { atS: 0.5, type: 'trip', setId: 'A', openBreaker: false },
          { atS: 2, type: 'load-step', kW: 700, kVAR: 500 },
        ],
      },
    },
  ];
}

export function runFingerprints(): Record<string, Fingerprint> {
  const out: Record<string, Fingerprint> = {};
  for (const { name, scenario } of fingerprintScenarios()) out[name] = fingerprint(simulate(scenario));
  return out;
}
