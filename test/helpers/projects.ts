/** Project builders for tests: a raw project file around the demo plant, and its text. */
import { demoPlantJson } from './plants';

/** A raw current-version project around the demo plant with one scenario, sync settings and one attempt. */
export function rawProject(over: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    format: 'droopline.project',
    version: 1,
    name: 'Kestrel Ford study',
    plant: demoPlantJson(),
    scenarios: [
      {
        id: 'S1',
        name: 'Pump start at 2 s',
        durationS: 8,
        stepMs: 1,
        events: [{ atS: 2, type: 'motor-start', kVA: 400, pf: 0.3, durationS: 3 }],
      },
    ],
    sync: {
      presetId: null,
      limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
      breakerClosingMs: 80,
      dead: { deadBus: true, deadLine: false, livePct: 80, deadPct: 20 },
      incomingSetId: 'G2',
    },
    trainerLog: [
      {
        at: '2026-11-30T10:15:00.000Z',
        seed: 7,
        level: 'steady-bus',
        angleAtContactDeg: 6.5,
        slipAtContactHz: 0.08,
        voltageDifferencePct: 1.2,
        surgeCurrentPU: 0.4,
        torqueStepPU: 0.2,
        score: 86,
        verdict: 'good close',
      },
    ],
    view: { view: 'sharing' },
    ...over,
  };
}

/** The text of a raw project, as a file would hold it. */
export function projectText(over: Record<string, unknown> = {}): string {
  return `${JSON.stringify(rawProject(over), null, 2)}\n`;
}

/** A small trace of a fit (four samples around a step at 0.05 s). */
function trace(dv: number): Record<string, number[]> {
  return { tS: [0, 0.04, 0.08, 0.12], frequencyHz: [50, 50, 49.6 + dv / 100, 49.8], voltageV: [400, 400, 380 + dv, 396] };
}

function verdict(): Record<string, unknown> {
  return {
    initialFrequencyHz: 50,
    initialVoltageV: 400,
    frequencyNadirHz: 49.6,
    frequencyPeakHz: 50,
    voltageMinV: 380,
    voltageMaxV: 400,
    settledFrequencyHz: 49.8,
    settledVoltageV: 396,
    frequencyRecoveryS: null,
    voltageRecoveryS: 0.07,
    classes: [
      {
        quantity: 'frequency drop',
        unit: '%',
        measured: 0.8,
        limits: { G1: 15, G2: 10, G3: 7 },
        pass: { G1: true, G2: true, G3: true },
        source: 'ISO 8528-5, clause 7',
      },
    ],
    notes: ['the record is short'],
  };
}

/**
 * A raw commissioning section (invented figures): a four-sample record with its column and unit choice, the test,
 * two parameters chosen (one range left blank), a fit of the inertia, and a sign-off.
 */
export function rawCommissioning(): Record<string, unknown> {
  const test = { setId: 'G1', onlineSetIds: ['G1'], startKW: 100, startKVAR: 50, stepKW: 300, stepKVAR: 200, stepAtS: 0.05, measuredAt: 'set' };
  return {
    record: {
      fileName: 'bank G1.csv',
      text: 't,f,v\n0,50,400\n0.04,50,400\n0.08,49.6,380\n0.12,49.8,396\n',
      columns: { time: 't', frequency: 'f', voltage: 3 },
      units: { time: 's', frequency: 'Hz', voltage: 'V' },
    },
    test: { ...test, stepKVAR: null },
    params: [
      { key: 'machine.inertiaS', chosen: true, min: 0.5, max: 4 },
      { key: 'governor.engineLagS', chosen: true, min: null, max: 2 },
    ],
    maxIterations: 12,
    fit: {
      result: {
        setId: 'G1',
        parameters: [
          {
            key: 'machine.inertiaS',
            unit: 's',
            start: 1,
            value: 1.6,
            min: 0.5,
            max: 4,
            atBound: false,
            sensitivityPct: 42,
            confidence: 'well determined',
          },
        ],
        residual: { frequencyPct: 0.01, voltagePct: 0.05, totalPct: 0.036 },
        startResidual: { frequencyPct: 0.1, voltagePct: 0.4, totalPct: 0.29 },
        iterations: 4,
        maxIterations: 12,
        simulations: 11,
        stoppedAtCap: false,
        fitted: trace(0.2),
        startTrace: trace(3),
        measured: trace(0),
        measuredVerdict: verdict(),
        modelVerdict: verdict(),
        fittedPlant: { name: 'fitted' },
        notes: ['compared as deviations from the values before the step'],
        warnings: [],
      },
      test,
      applied: true,
    },
    signOff: { by: 'R. Tester', date: '2026-12-02', remarks: 'Load bank on the north feeder.' },
    recordSetId: 'G1',
  };
}
