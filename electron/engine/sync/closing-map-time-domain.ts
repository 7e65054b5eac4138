/**
 * The closing map from the time-domain simulator: for each cell the plant runs with the incoming set's breaker
 * closing at t = 0 at that slip, contact angle and voltage, for one cycle; the map keeps the largest
 * current of the incoming set and its largest electrical power step in that first cycle. The simulator is a
 * phasor (RMS) model, so the current it gives is the symmetrical one: the peak applies the IEC 60909 factor
 * κ √2 for the loop's R/X, as the closed form does.
 */
import type { ClosingMapRequest, Plant, Scenario } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { solveSharing } from '../sharing';
import { createSimulation } from '../simulation';
import { iecPeakFactor, peakTorqueFactor } from './closing-surge';
import { inWindow, setUpClosingMap } from './closing-map-grid';
import type { ClosingMapJob } from './closing-map-grid';
import { wrapAngleDeg } from './phasor';

/** Integration step of the first-cycle runs, ms (the simulator's default step). */
export const TIME_DOMAIN_STEP_MS = 1;

/** Most cells a time-domain map may have (each is a short simulation of the whole plant). */
export const TIME_DOMAIN_MAX_CELLS = 20000;

/**
 * Sets up a time-domain closing map (nothing simulated yet). Needs the case's plant and incoming set id.
 * @throws InvalidInput without a plant, with too many cells, or when no other set runs; NoSteadyState when the
 * running plant has no operating point; Diverged when a run fails.
 */
export function timeDomainClosingMapJob(req: ClosingMapRequest): ClosingMapJob {
  const c = req.case;
  if (!c.plant || c.incomingSetId === undefined) {
    throw new InvalidInput('method: the time-domain closing map needs the case\'s plant and incomingSetId (the simulator runs the whole plant).');
  }
  if (req.angleSteps * req.slipSteps > TIME_DOMAIN_MAX_CELLS) {
    throw new InvalidInput(`angleSteps × slipSteps: must be ${TIME_DOMAIN_MAX_CELLS} cells or fewer for the time-domain map (each cell is a simulation).`);
  }
  const { map, circuit, shiftS } = setUpClosingMap(req, 'time-domain');
  const setId = c.incomingSetId;
  // The incoming set starts off line; the rest of the plant is the running bus.
  const plant: Plant = { ...c.plant, sets: c.plant.sets.map((s) => (s.id === setId ? { ...s, online: false } : s)) };
  if (!plant.sets.some((s) => s.online)) {
    throw new InvalidInput(`plant: no set other than ${setId} is online, so there is no running bus to synchronize to.`);
  }
  const scenario = (events: Scenario['events'], durationS: number): Scenario => ({
    plant,
    durationS,
    stepMs: TIME_DOMAIN_STEP_MS,
    outputPoints: Math.ceil((durationS * 1000) / TIME_DOMAIN_STEP_MS) + 4,
    events,
  });
  // Every cell starts from the same steady state: solve it once, not once per cell.
  const atRest = solveSharing(plant);
  // The bus as the simulator finds it at rest: slip and voltage difference are taken from there.
  const rest = createSimulation(scenario([], 1), atRest).snapshot();
  const busHz = rest.frequencyHz;
  const cycleS = 1 / busHz;
  const incomingV = rest.voltageV + (map.voltageDifferencePct / 100) * c.plant.ratedVoltageV;
  const peakPerSym = iecPeakFactor(circuit.rOverX) * Math.SQRT2;
  const setKVA = c.incoming.ratedKVA;
  const ratedHz = c.plant.ratedFrequencyHz;
  const nA = map.anglesDeg.length;
  map.note =
    `First cycle (${(cycleS * 1000).toFixed(1)} ms) of the time-domain model after closing onto the plant's running bus ` +
    `(${busHz.toFixed(3)} Hz, ${rest.voltageV.toFixed(1)} V at rest); peak = κ √2 × the largest symmetrical current. ` +
    `The phasor model carries no DC offset, so the peak torque is the closed form (E1 E2 / X)(sin θ + 2 sin(θ/2)) at each cell's contact angle.`;
  const pMax = (rest.voltageV / c.plant.ratedVoltageV) * (incomingV / c.plant.ratedVoltageV) / circuit.loopXPU;
  return {
    map,
    rows: map.slipsHz.length,
    fillRows(from: number, to: number) {
      for (let j = from; j < to; j++) {
        const s = map.slipsHz[j]!;
        for (let i = 0; i < nA; i++) {
          const a = map.anglesDeg[i]!;
          const contactDeg = wrapAngleDeg(a + 360 * s * shiftS);
          const sim = createSimulation(
            scenario([{ atS: 0, type: 'close', setId, frequencyHz: busHz + s, voltageV: incomingV, angleDeg: contactDeg }], cycleS),
            atRest,
          );
          sim.advance(cycleS);
          const series = sim.result().series;
          const k = series.setIds.indexOf(setId);
          const amps = series.setCurrentA[k]!;
          const kw = series.setKW[k]!;
          const speed = series.setSpeedHz[k]!;
          let maxA = 0;
          let torquePU = 0;
          for (let n = 0; n < amps.length; n++) {
            if (amps[n]! > maxA) maxA = amps[n]!;
            // Torque = power / speed (pu); keep the sign of the largest swing.
            const t = kw[n]! / setKVA / (speed[n]! / ratedHz);
            if (Math.abs(t) > Math.abs(torquePU)) torquePU = t;
          }
          const iPU = maxA / circuit.baseCurrentA;
          const cell = j * nA + i;
          map.surgeCurrentPU[cell] = iPU;
          map.peakCurrentPU[cell] = peakPerSym * iPU;
          map.torqueStepPU[cell] = torquePU;
          map.peakTorquePU[cell] = (pMax * peakTorqueFactor(contactDeg)) / ((busHz + s) / ratedHz);
          if (iPU > map.maxSurgeCurrentPU) map.maxSurgeCurrentPU = iPU;
          if (iPU > map.maxSurgeInWindowPU && inWindow(map, s, a)) map.maxSurgeInWindowPU = iPU;
        }
      }
    },
  };
}
