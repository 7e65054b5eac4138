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
