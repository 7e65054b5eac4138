/**
 * The closing map from the time-domain simulator: for each cell the plant runs with the incoming set's breaker
 * closing at t = 0 at that slip, contact angle and voltage; the map keeps the largest current of the incoming set
 * and its largest electrical torque after contact. The simulator is a phasor (RMS) model, so the current it gives
 * is the symmetrical one: the peak applies the IEC 60909 factor κ √2 for the loop's R/X, as the closed form does.
 *
 * Each cell runs only as long as it needs, never longer than one cycle of the running bus: it stops once neither its
 * current nor its torque can climb back to its peak before the cycle ends. Both follow the angle between the incoming
 * set and the bus (|ΔV| / X and (E1 E2 / X) sin θ, whose slopes per radian are at most max(E1, E2) / X and E1 E2 / X),
 * and that angle can still move by at most 2π (|slip| τ + ½ |d slip/dt| τ²) in the τ left, taken `PEAK_PAST_MARGIN`
 * times over; the decay of the sub-transient field only lowers them further. In this model the contact surge peaks
 * at or within a few milliseconds of contact, so most cells stop after a few steps; a cell whose current or torque
 * is still rising (a small angle with slip) runs the whole cycle. The later electromechanical swing (which can peak
 * hundreds of milliseconds after a close near 180°) is not part of this map: the Transients view simulates it.
 * The plant at rest is solved once per map, not once per cell (every cell starts from the same operating point),
 * and no cell builds a full simulation result (which would solve the plant again for its steady-state target).
 */
import type { ClosingMapRequest, Plant, Scenario } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { solveSharing } from '../sharing';
import { createSimulation } from '../simulation';
import { iecPeakFactor, peakTorqueFactor } from './closing-surge';
import { inWindow, setUpClosingMap } from './closing-map-grid';
import type { ClosingMapJob } from './closing-map-grid';
import { wrapAngleDeg } from './phasor';
import { formatNumber } from '../../../shared-types';

/** Integration step of the cell runs, ms (the simulator's default step). */
export const TIME_DOMAIN_STEP_MS = 1;

/** Most cells a time-domain map may have (each is a short simulation of the whole plant). */
export const TIME_DOMAIN_MAX_CELLS = 20000;

/**
 * Safety factor on the angle the incoming set can still move before the cycle ends (its slip now, and the change of
 * slip seen over the last step, carried on to the end of the cycle).
 */
export const PEAK_PAST_MARGIN = 2;

/** Options of the job (the tests' reference run). */
export interface TimeDomainOptions {
  /** Run every cell for the whole cycle (no early stop). */
  fullCycle?: boolean;
}

/**
 * Sets up a time-domain closing map (nothing simulated yet). Needs the case's plant and incoming set id.
 * @throws InvalidInput without a plant, with too many cells, or when no other set runs; NoSteadyState when the
 * running plant has no operating point; Diverged when a run fails.
 */
export function timeDomainClosingMapJob(req: ClosingMapRequest, options: TimeDomainOptions = {}): ClosingMapJob {
  const c = req.case;
  if (!c.plant || c.incomingSetId === undefined) {
    throw new InvalidInput("method: the time-domain closing map needs the case's plant and incomingSetId (the simulator runs the whole plant).");
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
  const k = plant.sets.findIndex((s) => s.id === setId);
  // Every cell starts from the same steady state: solve it once, not once per cell.
  const atRest = solveSharing(plant);
  const restScenario = (durationS: number): Scenario => ({ plant, durationS, stepMs: TIME_DOMAIN_STEP_MS, outputPoints: 2, events: [] });
  // The bus as the simulator finds it at rest: slip and voltage difference are taken from there.
  const rest = createSimulation(restScenario(1), atRest).snapshot();
  const busHz = rest.frequencyHz;
  const cycleS = 1 / busHz;
  const capSteps = Math.max(1, Math.round((cycleS * 1000) / TIME_DOMAIN_STEP_MS));
  const capMs = capSteps * TIME_DOMAIN_STEP_MS;
  const cellScenario = restScenario(capMs / 1000);
  const incomingV = rest.voltageV + (map.voltageDifferencePct / 100) * c.plant.ratedVoltageV;
  const peakPerSym = iecPeakFactor(circuit.rOverX) * Math.SQRT2;
  const setKVA = c.incoming.ratedKVA;
  const ratedHz = c.plant.ratedFrequencyHz;
  const nA = map.anglesDeg.length;
  const runMs = new Float64Array(map.anglesDeg.length * map.slipsHz.length);
  const rule = options.fullCycle
    ? `every cell ran the whole cycle (${capMs} ms)`
    : `each cell ran until neither its current nor its torque could climb back to its peak before the end of one cycle (${capMs} ms), given how far the slip can still move the angle`;
  const v1 = rest.voltageV / c.plant.ratedVoltageV;
  const v2 = incomingV / c.plant.ratedVoltageV;
  const pMax = (v1 * v2) / circuit.loopXPU;
  const currentSlopePU = Math.max(v1, v2) / circuit.loopXPU;
  const hS = TIME_DOMAIN_STEP_MS / 1000;

  /** One cell: the largest current (A) and the signed torque of largest magnitude (pu), and the steps run. */
  const runCell = (slipHz: number, contactDeg: number, out: { maxA: number; torquePU: number; steps: number }) => {
    const sim = createSimulation(cellScenario, atRest);
    sim.applyEvent({ atS: 0, type: 'close', setId, frequencyHz: busHz + slipHz, voltageV: incomingV, angleDeg: contactDeg });
    let maxPU = 0;
    let torquePU = 0;
    let steps = 0;
    let lastSlip = slipHz;
    for (;;) {
      const snap = sim.snapshot();
      const o = snap.sets[k]!;
      const iPU = o.currentA / circuit.baseCurrentA;
      // Torque = power / speed (pu); keep the sign of the largest swing.
      const t = o.kW / setKVA / (o.speedHz / ratedHz);
      if (iPU > maxPU) maxPU = iPU;
      if (Math.abs(t) > Math.abs(torquePU)) torquePU = t;
      if (steps >= capSteps) break;
      if (!options.fullCycle && steps > 0) {
        const slip = o.speedHz - snap.frequencyHz;
        const tau = (capSteps - steps) * hS;
        const reach = PEAK_PAST_MARGIN * 2 * Math.PI * (Math.abs(slip) * tau + 0.5 * (Math.abs(slip - lastSlip) / hS) * tau * tau);
        lastSlip = slip;
        if (iPU + currentSlopePU * reach < maxPU && Math.abs(t) + pMax * reach < Math.abs(torquePU)) break;
      }
      sim.steps(1);
      steps++;
    }
    out.maxA = maxPU * circuit.baseCurrentA;
    out.torquePU = torquePU;
    out.steps = steps;
  };

  map.note =
    `First cycle (${formatNumber(cycleS * 1000, 1)} ms) of the time-domain model after closing onto the plant's running bus ` +
    `(${formatNumber(busHz, 3)} Hz, ${formatNumber(rest.voltageV, 1)} V at rest); ${rule}. Peak = κ √2 × the largest symmetrical current. ` +
    `The phasor model carries no DC offset, so the peak torque is the closed form (E1 E2 / X)(sin θ + 2 sin(θ/2)) at each cell's contact angle. ` +
    `The electromechanical swing after the surge is not mapped (simulate a close in the Transients view).`;
  const cell = { maxA: 0, torquePU: 0, steps: 0 };
  const job: ClosingMapJob = {
    map,
    rows: map.slipsHz.length,
    runMs,
    fillRows(from: number, to: number) {
      for (let j = from; j < to; j++) {
        const s = map.slipsHz[j]!;
        for (let i = 0; i < nA; i++) {
          const a = map.anglesDeg[i]!;
          const contactDeg = wrapAngleDeg(a + 360 * s * shiftS);
          runCell(s, contactDeg, cell);
          const iPU = cell.maxA / circuit.baseCurrentA;
          const at = j * nA + i;
          map.surgeCurrentPU[at] = iPU;
          map.peakCurrentPU[at] = peakPerSym * iPU;
          map.torqueStepPU[at] = cell.torquePU;
          map.peakTorquePU[at] = (pMax * peakTorqueFactor(contactDeg)) / ((busHz + s) / ratedHz);
          runMs[at] = cell.steps * TIME_DOMAIN_STEP_MS;
          if (iPU > map.maxSurgeCurrentPU) map.maxSurgeCurrentPU = iPU;
          if (iPU > map.maxSurgeInWindowPU && inWindow(map, s, a)) map.maxSurgeInWindowPU = iPU;
        }
      }
    },
    finish() {
      let sum = 0;
      let longest = 0;
      let atCap = 0;
      for (const ms of runMs) {
        sum += ms;
        if (ms > longest) longest = ms;
        if (ms >= capMs) atCap++;
      }
      const meanMs = sum / runMs.length;
      map.cellRun = { rule: rule.charAt(0).toUpperCase() + rule.slice(1) + '.', capMs, meanMs, longestMs: longest, cellsAtCap: atCap };
      return map;
    },
  };
  return job;
}
