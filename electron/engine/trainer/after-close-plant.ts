/**
 * After-close traces from the plant's own time-domain model: the plant runs at its
 * steady state with the incoming set off line, the incoming set is closed at the
 * exercise's contact (slip, voltage difference and angle relative to the plant's bus),
 * and the simulator runs the first seconds. Used when the exercise came from a plant.
 */
import type { Plant, TrainerState, TrainerTraces } from '../../../shared-types';
import { ratedCurrentA } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { createSimulation } from '../simulation';

/** Options of the plant run. */
export interface PlantAfterCloseOptions {
  durationS: number;
  /** Interval between kept points, s. */
  outputS: number;
}

const DEFAULTS: PlantAfterCloseOptions = { durationS: 3, outputS: 0.01 };

/**
 * Traces of the first seconds after contact from the simulator.
 * @throws InvalidInput when the breaker has not closed or the set is not in the plant; the
 *   simulator's own errors (no steady state) pass through.
 */
export function afterClosePlantTraces(state: TrainerState, plant: Plant, setId: string, options: Partial<PlantAfterCloseOptions> = {}): TrainerTraces {
  const o = { ...DEFAULTS, ...options };
  const c = state.contact;
  if (state.phase !== 'closed' || !c) throw new InvalidInput('state: the breaker has not closed yet.');
  const set = plant.sets.find((s) => s.id === setId);
  if (!set) throw new InvalidInput(`incomingSetId: no set "${setId}" in the plant.`);
  const sets = plant.sets.map((s) => (s.id === setId ? { ...s, online: false } : s));
  const sim = createSimulation({ plant: { ...plant, sets }, durationS: o.durationS, events: [] });
  const before = sim.snapshot();
  // The plant's bus sits where its own droops put it; the contact is applied relative to that bus.
  sim.applyEvent({
    atS: 0,
    type: 'close',
    setId,
    frequencyHz: before.frequencyHz + c.slipHz,
    voltageV: before.voltageV * (1 + c.voltageDifferencePct / 100),
    angleDeg: c.angleDeg,
  });
  const ratedA = ratedCurrentA(set.ratedKVA, plant.ratedVoltageV);
  const traces: TrainerTraces = { tS: [], angleDeg: [], currentPU: [], powerPU: [], speedHz: [], source: 'plant-simulator' };
  const keep = (t: number): void => {
    const snap = sim.snapshot();
    const s = snap.sets.find((x) => x.id === setId)!;
    traces.tS.push(t);
    traces.angleDeg.push(s.rotorAngleDeg ?? 0);
    traces.currentPU.push(s.currentA / ratedA);
    traces.powerPU.push(s.kW / set.ratedKVA);
    traces.speedHz.push(s.speedHz);
  };
  keep(0);
  const n = Math.round(o.durationS / o.outputS);
  for (let k = 1; k <= n; k++) {
    sim.advance(o.outputS);
    keep(k * o.outputS);
  }
  return traces;
}
