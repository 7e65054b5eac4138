/**
 * The steady state a run should reach: the plant as the run leaves it (sets on line,
 * setpoints and modes changed by events, loads switched, load blocks and running motors
 * added) solved in closed form by the steady-state solver (`solveSharing`). ISO 8528-5
 * measures recovery into a band around the steady state the governor and regulator hold
 * for the new load, not around wherever a run happens to end; this is that steady state.
 */
import type { Governor, Load, Plant } from '../../../shared-types';
import { solveSharing } from '../sharing';
import { EngineError } from '../errors';
import { GOV_DROOP, GOV_ISO } from '../mode-codes';
import type { SimModel } from './sim-types';

/** The steady state the final plant should settle at, or why there is none. */
export type SteadyTarget = { frequencyHz: number; voltageV: number; note: null } | { frequencyHz: null; voltageV: null; note: string };

function governorMode(code: number): Governor['mode'] {
  return code === GOV_DROOP ? 'droop' : code === GOV_ISO ? 'isochronous' : 'baseload';
}

/** The plant as the run holds it now (a new object; `plant` is not touched). */
export function plantNow(m: SimModel, plant: Plant): Plant {
  const fr = m.ratedFrequencyHz;
  const vr = m.ratedVoltageV;
  const loads: Load[] = m.loads.map((l) => ({
    id: l.id,
    name: l.id,
    online: l.on,
    kW: l.pPU * m.baseKVA,
    kVAR: l.qPU * m.baseKVA,
    // The slot's own shares, written back as a ZIP load (exact for every model).
    model: 'zip',
    kWImpedancePct: l.pZ * 100,
    kWCurrentPct: l.pI * 100,
    kVARImpedancePct: l.qZ * 100,
    kVARCurrentPct: l.qI * 100,
    frequencySensitivity: l.frequencySensitivity,
    kVARFrequencySensitivity: l.kVARFrequencySensitivity,
  }));
  return {
    ...plant,
    sets: plant.sets.map((s, i) => ({
      ...s,
      // A set whose engine stopped with its breaker closed will be opened by its 32 relay.
      online: m.online[i] === 1 && m.shutdown[i] === 0,
      governor: {
        ...s.governor,
        mode: governorMode(m.govMode[i]!),
        noLoadHz: m.noLoadPU[i]! * fr,
        setpointHz: m.setpointPU[i]! * fr,
        baseKW: m.basePU[i]! * m.kwPU[i]! * m.ratedKVA[i]!,
      },
      regulator: { ...s.regulator, noLoadV: m.noLoadVPU[i]! * vr, setpointV: m.setpointVPU[i]! * vr },
    })),
    loads,
  };
}

/** Solves the final plant in closed form; a sentence instead when it has no steady state. */
export function steadyTarget(m: SimModel, plant: Plant): SteadyTarget {
  const now = plantNow(m, plant);
  if (!now.sets.some((s) => s.online)) return { frequencyHz: null, voltageV: null, note: 'no set is on line at the end of the run' };
  try {
    const r = solveSharing(now);
    return { frequencyHz: r.bus.frequencyHz, voltageV: r.bus.voltageV, note: null };
  } catch (e) {
    if (e instanceof EngineError) return { frequencyHz: null, voltageV: null, note: `the final loads have no steady state: ${e.message}` };
    throw e;
  }
}
