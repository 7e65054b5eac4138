/**
 * The closing map: surge current, peak current, torque step and first-cycle peak torque over a grid of phase angle (−180°…180°) ×
 * slip (±range) at one voltage difference, with the sync-check window as a rectangle on it. Closed forms
 * (see closing-surge.ts). By default the angle axis is the angle when the close command is issued, so the
 * contacts touch 360 s t later and slip moves the picture; with `angleAxis: 'contact'` the map is the bare surge.
 *
 * Built as a job that fills rows in chunks, so a caller can report progress and cancel between chunks.
 * `method: 'time-domain'` runs the simulator instead (closing-map-time-domain.ts).
 */
import type { ClosingMap, ClosingMapRequest } from '../../../shared-types';
import { iecPeakFactor, peakTorqueFactor } from './closing-surge';
import { setUpClosingMap } from './closing-map-grid';
import type { ClosingMapJob } from './closing-map-grid';
import { timeDomainClosingMapJob } from './closing-map-time-domain';

export type { ClosingMapJob, ClosingMapRows } from './closing-map-grid';
export { putRows, takeRows } from './closing-map-grid';

/**
 * Sets up a closed-form closing map for `req` (nothing computed yet). Pure with respect to `req`.
 * @throws InvalidInput when the bus is not live (there is no surge to map) or grid sizes are unusable.
 */
export function closingMapJob(req: ClosingMapRequest): ClosingMapJob {
  const { map, basis, circuit, shiftS: tS } = setUpClosingMap(req, 'closed-form');
  const c = req.case;
  const { anglesDeg, slipsHz, window } = map;
  const nA = anglesDeg.length;
  const nS = slipsHz.length;
  const peakPerSym = iecPeakFactor(circuit.rOverX) * Math.SQRT2;
  const ratedHz = basis.ratedFrequencyHz;
  return {
    map,
    rows: nS,
    fillRows(from: number, to: number) {
      const surge = map.surgeCurrentPU;
      const peak = map.peakCurrentPU;
      const torque = map.torqueStepPU;
      const peakTorque = map.peakTorquePU;
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
        const shiftDeg = 360 * s * tS;
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
          // The peak's sin(θ/2) is not 360°-periodic: it takes the wrapped contact angle.
          peakTorque[row + i] = (pMax * peakTorqueFactor(a + shiftDeg)) / speedPU;
          if (iPU > maxAll) maxAll = iPU;
          if (slipInWindow && iPU > maxWin && Math.abs(a) <= window.angleDeg + 1e-12) maxWin = iPU;
        }
      }
      map.maxSurgeCurrentPU = maxAll;
      map.maxSurgeInWindowPU = maxWin;
    },
    finish: () => map,
  };
}

/** The job for the request's method: closed form (default) or the time-domain simulator. */
export function closingMapJobFor(req: ClosingMapRequest): ClosingMapJob {
  return req.method === 'time-domain' ? timeDomainClosingMapJob(req) : closingMapJob(req);
}

/** The whole closing map in one call, by the request's method (see `closingMapJobFor` for progress and cancelling). */
export function closingMap(req: ClosingMapRequest): ClosingMap {
  const job = closingMapJobFor(req);
  job.fillRows(0, job.rows);
  return job.finish();
}
