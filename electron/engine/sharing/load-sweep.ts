/**
 * `sweepLoad`: the operating point over a range of total load, for the droop-line and
 * sharing charts. Each point replaces the plant's loads by one constant-power load at
 * the chosen power factor; a point with no steady state carries its reason instead of numbers.
 */
import type { LoadSweep, Plant, SweepLoadRequest, SweepPoint } from '../../../shared-types';
import { tanPhi } from '../../../shared-types';
import { EngineError, InvalidInput } from '../errors';
import { buildSharingModel } from './sharing-model';
import { solveSharing } from './solve-sharing';

/** Default sweep range, % of the online sets' kW rating. */
export const SWEEP_FROM_PCT = 0;
export const SWEEP_TO_PCT = 110;

/** The power factor a load given only in kW takes, and where it came from. */
export interface ImpliedPowerFactor {
  /** Power factor magnitude (0..1]. */
  pf: number;
  /** kVAR per kW (negative when the plant's loads lead). */
  kVARPerKW: number;
  /** `plant loads`: the online loads' own kW and kVAR; `rated PF of the sets`: no load draws kW. */
  source: 'plant loads' | 'rated PF of the sets';
}

/**
 * The power factor of the plant's online loads (their sums at rated voltage), keeping a
 * leading sense; with no load drawing kW, the online sets' rated PF (kW-weighted, lagging).
 * The load sweep, the CLI's `--load-kw` alone and the report use it: a load given in kW is
 * never silently taken at unity power factor.
 */
export function impliedPowerFactor(plant: Plant): ImpliedPowerFactor {
  let p = 0;
  let q = 0;
  for (const l of plant.loads) {
    if (!l.online) continue;
    p += l.kW;
    q += l.kVAR;
  }
  if (p > 0) return { pf: p / Math.hypot(p, q), kVARPerKW: q / p, source: 'plant loads' };
  let w = 0;
  let pf = 0;
  for (const s of plant.sets) {
    if (!s.online) continue;
    w += s.ratedKW;
    pf += s.ratedKW * s.ratedPF;
  }
  const rated = w > 0 ? pf / w : 0.8;
  return { pf: rated, kVARPerKW: tanPhi(rated), source: 'rated PF of the sets' };
}

/**
 * Sweeps total load from `fromPct` (default 0) to `toPct` (default 110) % of the online
 * kW rating in `steps` points (≥ 2). The load's PF is `pf` (lagging) or the plant loads'
 * own; a plant whose loads are leading keeps its leading sense.
 * @throws InvalidInput for fewer than 2 steps or no set online.
 * @throws NoSteadyState when the control structure has no operating point at any load.
 */
export function sweepLoad(req: SweepLoadRequest): LoadSweep {
  const { plant, steps } = req;
  if (!(Number.isInteger(steps) && steps >= 2)) throw new InvalidInput('steps: must be a whole number of 2 or more');
  const fromPct = req.fromPct ?? SWEEP_FROM_PCT;
  const toPct = req.toPct ?? SWEEP_TO_PCT;
  let ratedKW = 0;
  for (const s of plant.sets) if (s.online) ratedKW += s.ratedKW;
  if (ratedKW === 0) throw new InvalidInput('sets: no set is online, so there is no kW rating to sweep over');
  // A control structure with no operating point fails every point: say so once, as an error.
  buildSharingModel(plant, { kW: 0, kVAR: 0 });
  const tanPhi = req.pf === undefined ? impliedPowerFactor(plant).kVARPerKW : Math.sqrt(Math.max(0, 1 - req.pf * req.pf)) / req.pf;
  const setIds = plant.sets.map((s) => s.id);
  const points: SweepPoint[] = [];
  for (let k = 0; k < steps; k++) {
    const loadPct = fromPct + ((toPct - fromPct) * k) / (steps - 1);
    const loadKW = (ratedKW * loadPct) / 100;
    const loadKVAR = loadKW * tanPhi;
    try {
      const r = solveSharing(plant, { kW: loadKW, kVAR: loadKVAR });
      points.push({
        loadPct,
        loadKW,
        loadKVAR,
        frequencyHz: r.bus.frequencyHz,
        voltageV: r.bus.voltageV,
        setKW: r.sets.map((s) => (s.online ? s.kW : null)),
        setKVAR: r.sets.map((s) => (s.online ? s.kVAR : null)),
      });
    } catch (e) {
      if (!(e instanceof EngineError) || e.code === 'INVALID_INPUT') throw e;
      points.push({
        loadPct,
        loadKW,
        loadKVAR,
        frequencyHz: null,
        voltageV: null,
        setKW: setIds.map(() => null),
        setKVAR: setIds.map(() => null),
        error: e.message,
      });
    }
  }
  return { setIds, points };
}
