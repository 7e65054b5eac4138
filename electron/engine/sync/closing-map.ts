/**
 * The closing map: surge current, peak current and torque step over a grid of phase angle (−180°…180°) ×
 * slip (±range) at one voltage difference, with the sync-check window as a rectangle on it. Closed forms
 * (see closing-surge.ts). By default the angle axis is the angle when the close command is issued, so the
 * contacts touch 360 s t later and slip moves the picture; with `angleAxis: 'contact'` the map is the bare surge.
 *
 * Built as a job that fills rows in chunks, so a caller can report progress and cancel between chunks.
 */
import type { ClosingMap, ClosingMapRequest } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { iecPeakFactor, surgeCircuit } from './closing-surge';
import type { SurgeCircuit } from './closing-surge';
import { sideState } from './permissives';
import { syncBasis } from './sync-basis';

/** A closing map being filled: `fillRows(from, to)` computes slip rows [from, to). */
export interface ClosingMapJob {
  /** The map; its arrays fill in as rows are computed. */
  map: ClosingMap;
  /** Number of slip rows. */
  rows: number;
  fillRows(from: number, to: number): void;
}

function linspace(from: number, to: number, n: number): number[] {
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = n === 1 ? from : from + ((to - from) * i) / (n - 1);
  return out;
}

/**
 * Sets up a closed-form closing map for `req` (nothing computed yet). Pure with respect to `req`.
 * @throws InvalidInput when the bus is not live (there is no surge to map) or grid sizes are unusable.
 */
export function closingMapJob(req: ClosingMapRequest): ClosingMapJob {
  const c = req.case;
  if (!(req.angleSteps >= 2 && req.slipSteps >= 2 && Number.isInteger(req.angleSteps) && Number.isInteger(req.slipSteps))) {
    throw new InvalidInput('angleSteps, slipSteps: must be whole numbers of 2 or more.');
  }
  if (!(req.slipRangeHz > 0)) throw new InvalidInput('slipRangeHz: must be greater than 0.');
  const basis = syncBasis(c);
  if (sideState((c.bus.voltageV / basis.voltageV) * 100, c.dead) !== 'live') {
    throw new InvalidInput('case.bus.voltageV: the bus is not live, so there is no synchronizing surge to map (a dead-bus close has none).');
  }
  const base = surgeCircuit(c, basis);
  const voltageDifferencePct = req.voltageDifferencePct ?? ((c.incoming.voltageV - c.bus.voltageV) / basis.voltageV) * 100;
  const circuit: SurgeCircuit = { ...base, incomingVoltagePU: base.busVoltagePU + voltageDifferencePct / 100 };
  if (!(circuit.incomingVoltagePU >= 0)) throw new InvalidInput('voltageDifferencePct: leaves the incoming voltage below 0.');
  const angleAxis = req.angleAxis ?? 'command';
  const tS = c.breakerClosingMs / 1000;
  const nA = req.angleSteps;
  const nS = req.slipSteps;
  const anglesDeg = linspace(-180, 180, nA);
  const slipsHz = linspace(-req.slipRangeHz, req.slipRangeHz, nS);
  const cells = nA * nS;
  const L = c.limits;
  const window = { angleDeg: L.angleDeg, slipHz: L.slipHz, slipMinHz: L.incomingFaster ? 0 : -L.slipHz, slipMaxHz: L.slipHz };
  const map: ClosingMap = {
    anglesDeg,
    slipsHz,
    surgeCurrentPU: new Array<number>(cells).fill(0),
    peakCurrentPU: new Array<number>(cells).fill(0),
    torqueStepPU: new Array<number>(cells).fill(0),
    window,
    method: 'closed-form',
    angleAxis,
    voltageDifferencePct,
    baseCurrentA: circuit.baseCurrentA,
    torqueBaseKNm: circuit.torqueBaseKNm,
    maxSurgeCurrentPU: 0,
    maxSurgeInWindowPU: 0,
  };
  const peakPerSym = iecPeakFactor(circuit.rOverX) * Math.SQRT2;
  const ratedHz = basis.ratedFrequencyHz;
  return {
    map,
    rows: nS,
    fillRows(from: number, to: number) {
      const surge = map.surgeCurrentPU;
      const peak = map.peakCurrentPU;
      const torque = map.torqueStepPU;
      // The closed forms of closing-surge.ts, unrolled with constants hoisted: |ΔV|² = V1² + V2² − 2 V1 V2 cos θ.
      const v1 = circuit.busVoltagePU;
      const v2 = circuit.incomingVoltagePU;
      const sumSq = v1 * v1 + v2 * v2;
      const twoV1V2 = 2 * v1 * v2;
      const invX = 1 / circuit.loopXPU;
      const pMax = v1 * v2 * invX;
      const degToRad = Math.PI / 180;
      let maxAll = map.maxSurgeCurrentPU;
      let maxWin = map.maxSurgeInWindowPU;
      for (let j = from; j < to; j++) {
        const s = slipsHz[j]!;
        const shiftDeg = angleAxis === 'command' ? 360 * s * tS : 0;
        const speedPU = (c.bus.frequencyHz + s) / ratedHz;
        const slipInWindow = s >= window.slipMinHz - 1e-12 && s <= window.slipMaxHz + 1e-12;
        const row = j * nA;
        for (let i = 0; i < nA; i++) {
          const a = anglesDeg[i]!;
          // cos and sin are 360°-periodic, so the contact angle needs no wrapping here.
          const th = (a + shiftDeg) * degToRad;
          const sq = sumSq - twoV1V2 * Math.cos(th);
          const iPU = (sq > 0 ? Math.sqrt(sq) : 0) * invX;
          surge[row + i] = iPU;
          peak[row + i] = peakPerSym * iPU;
          torque[row + i] = (pMax * Math.sin(th)) / speedPU;
          if (iPU > maxAll) maxAll = iPU;
          if (slipInWindow && iPU > maxWin && Math.abs(a) <= window.angleDeg + 1e-12) maxWin = iPU;
        }
      }
      map.maxSurgeCurrentPU = maxAll;
      map.maxSurgeInWindowPU = maxWin;
    },
  };
}

/** The whole closed-form closing map in one call (see `closingMapJob` for progress and cancelling). */
export function closingMap(req: ClosingMapRequest): ClosingMap {
  const job = closingMapJob(req);
  job.fillRows(0, job.rows);
  return job.map;
}
