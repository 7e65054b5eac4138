/** The grid, window and bases a closing map shares between its closed-form and time-domain variants. */
import type { ClosingMap, ClosingMapRequest } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { surgeCircuit } from './closing-surge';
import type { SurgeCircuit } from './closing-surge';
import { sideState } from './permissives';
import { syncBasis } from './sync-basis';
import type { SyncBasis } from './sync-basis';

/** A closing map being filled: `fillRows(from, to)` computes slip rows [from, to). */
export interface ClosingMapJob {
  /** The map; its arrays fill in as rows are computed. */
  map: ClosingMap;
  /** Number of slip rows. */
  rows: number;
  fillRows(from: number, to: number): void;
  /** Time-domain maps: each cell's run after contact, ms (filled with the rows). */
  runMs?: Float64Array;
  /** Completes the map once every row is in (the time-domain map's run lengths) and returns it. */
  finish(): ClosingMap;
}

/**
 * Slip rows [from, to) of a map as plain typed arrays (row-major, as in the map): what a pool
 * worker sends back, to be put into the host's own job with `putRows`.
 */
export interface ClosingMapRows {
  from: number;
  to: number;
  surgeCurrentPU: Float64Array;
  peakCurrentPU: Float64Array;
  torqueStepPU: Float64Array;
  peakTorquePU: Float64Array;
  runMs?: Float64Array;
}

/** Copies filled rows [from, to) out of `job`. */
export function takeRows(job: ClosingMapJob, from: number, to: number): ClosingMapRows {
  const nA = job.map.anglesDeg.length;
  const lo = from * nA;
  const hi = to * nA;
  const m = job.map;
  return {
    from,
    to,
    surgeCurrentPU: Float64Array.from(m.surgeCurrentPU.slice(lo, hi)),
    peakCurrentPU: Float64Array.from(m.peakCurrentPU.slice(lo, hi)),
    torqueStepPU: Float64Array.from(m.torqueStepPU.slice(lo, hi)),
    peakTorquePU: Float64Array.from(m.peakTorquePU.slice(lo, hi)),
    ...(job.runMs ? { runMs: job.runMs.slice(lo, hi) } : {}),
  };
}

/** Puts rows computed elsewhere (by the same request) into `job`, with the map's maxima. */
export function putRows(job: ClosingMapJob, rows: ClosingMapRows): void {
  const m = job.map;
  const nA = m.anglesDeg.length;
  const lo = rows.from * nA;
  for (let k = 0; k < rows.surgeCurrentPU.length; k++) {
    const cell = lo + k;
    const iPU = rows.surgeCurrentPU[k]!;
    m.surgeCurrentPU[cell] = iPU;
    m.peakCurrentPU[cell] = rows.peakCurrentPU[k]!;
    m.torqueStepPU[cell] = rows.torqueStepPU[k]!;
    m.peakTorquePU[cell] = rows.peakTorquePU[k]!;
    if (iPU > m.maxSurgeCurrentPU) m.maxSurgeCurrentPU = iPU;
    const s = m.slipsHz[Math.floor(cell / nA)]!;
    const a = m.anglesDeg[cell % nA]!;
    if (iPU > m.maxSurgeInWindowPU && inWindow(m, s, a)) m.maxSurgeInWindowPU = iPU;
  }
  if (rows.runMs && job.runMs) job.runMs.set(rows.runMs, lo);
}

/** What both variants start from: an empty map, the bases and the closing loop at the map's voltage difference. */
export interface MapSetup {
  map: ClosingMap;
  basis: SyncBasis;
  circuit: SurgeCircuit;
  /** Breaker closing time, s (0 on the contact axis: the angle axis is already the contact angle). */
  shiftS: number;
}

function linspace(from: number, to: number, n: number): number[] {
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = from + ((to - from) * i) / (n - 1);
  return out;
}

/**
 * Checks a map request and lays out its empty map. Pure with respect to `req`.
 * @throws InvalidInput when the bus is not live (there is no surge to map) or the grid is unusable.
 */
export function setUpClosingMap(req: ClosingMapRequest, method: ClosingMap['method']): MapSetup {
  const c = req.case;
  if (!(req.angleSteps >= 2 && req.slipSteps >= 2 && Number.isInteger(req.angleSteps) && Number.isInteger(req.slipSteps))) {
    throw new InvalidInput('angleSteps, slipSteps: must be whole numbers of 2 or more.');
  }
  if (!(req.slipRangeHz > 0)) throw new InvalidInput('slipRangeHz: must be greater than 0.');
  const basis = syncBasis(c);
  if (sideState((c.bus.voltageV / basis.voltageV) * 100, c.dead) !== 'live') {
    throw new InvalidInput('case.bus.voltageV: the bus is not live, so there is no synchronizing surge to map (a dead-bus close has none).');
  }
  // The same rule as evaluateSync: a live bus turns (0 Hz would give an infinite surge torque).
  if (!(c.bus.frequencyHz > 0)) throw new InvalidInput('case.bus.frequencyHz: must be greater than 0 when the bus is live.');
  const base = surgeCircuit(c, basis);
  const voltageDifferencePct = req.voltageDifferencePct ?? ((c.incoming.voltageV - c.bus.voltageV) / basis.voltageV) * 100;
  const circuit: SurgeCircuit = { ...base, incomingVoltagePU: base.busVoltagePU + voltageDifferencePct / 100 };
  if (!(circuit.incomingVoltagePU >= 0)) throw new InvalidInput('voltageDifferencePct: leaves the incoming voltage below 0.');
  const angleAxis = req.angleAxis ?? 'command';
  const cells = req.angleSteps * req.slipSteps;
  const L = c.limits;
  const map: ClosingMap = {
    anglesDeg: linspace(-180, 180, req.angleSteps),
    slipsHz: linspace(-req.slipRangeHz, req.slipRangeHz, req.slipSteps),
    surgeCurrentPU: new Array<number>(cells).fill(0),
    peakCurrentPU: new Array<number>(cells).fill(0),
    torqueStepPU: new Array<number>(cells).fill(0),
    peakTorquePU: new Array<number>(cells).fill(0),
    window: { angleDeg: L.angleDeg, slipHz: L.slipHz, slipMinHz: L.incomingFaster ? 0 : -L.slipHz, slipMaxHz: L.slipHz },
    method,
    angleAxis,
    voltageDifferencePct,
    baseCurrentA: circuit.baseCurrentA,
    torqueBaseKNm: circuit.torqueBaseKNm,
    maxSurgeCurrentPU: 0,
    maxSurgeInWindowPU: 0,
  };
  return { map, basis, circuit, shiftS: angleAxis === 'command' ? c.breakerClosingMs / 1000 : 0 };
}

/** Whether cell (slip `s`, angle `a`) lies inside the map's window rectangle. */
export function inWindow(map: ClosingMap, s: number, a: number): boolean {
  const w = map.window;
  return s >= w.slipMinHz - 1e-12 && s <= w.slipMaxHz + 1e-12 && Math.abs(a) <= w.angleDeg + 1e-12;
}
