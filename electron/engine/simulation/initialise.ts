/**
 * The state at rest. On-line sets start at the steady-state solver's operating point
 * (`solveSharing`: bus frequency and voltage, each set's kW and kVAR); every dynamic
 * state is then back-computed from the machine, governor and regulator equations so
 * that all derivatives are zero. Off-line sets start unloaded at their own no-load
 * speed and voltage (or de-excited, when asked: at their residual voltage).
 */
import type { Plant, SharingResult } from '../../../shared-types';
import { solveSharing } from '../sharing';
import { ACTUATOR, AVR_INT, DELTA, ED2, EFD, EQ1, EQ2, GOV_INT, OMEGA, PMECH, STATES_PER_SET, VAR_TRIM } from './layout';
import { GOV_BASE, GOV_DROOP, REG_CROSS, REG_DROOP, REG_PF } from '../mode-codes';
import { voltageReference } from './regulator';
import type { SimModel } from './sim-types';

/** Steady state of set `i` when running unloaded with its breaker open. */
export function initialiseOffline(m: SimModel, i: number, y: Float64Array, deExcited: boolean, angleRad = 0): void {
  const o = i * STATES_PER_SET;
  const speed = m.govMode[i] === GOV_DROOP ? m.noLoadPU[i]! : m.setpointPU[i]!;
  // De-excited: no field voltage, so the open-circuit EMF is the residual voltage alone
  // (the steady state of the field equation with E_fd = 0: E'q = E_res).
  const v = deExcited ? m.residualPU[i]! : m.regMode[i] === REG_DROOP ? m.noLoadVPU[i]! : m.setpointVPU[i]!;
  y[o + DELTA] = angleRad;
  y[o + OMEGA] = speed;
  y[o + EQ1] = v;
  y[o + ED2] = 0;
  y[o + EQ2] = v;
  y[o + ACTUATOR] = 0;
  y[o + PMECH] = 0;
  y[o + GOV_INT] = 0;
  const efd = deExcited ? 0 : Math.max(0, v - m.residualPU[i]!);
  y[o + EFD] = efd;
  y[o + AVR_INT] = deExcited ? 0 : efd / m.gainPU[i]!;
  y[o + VAR_TRIM] = 0;
}

/**
 * Fills `y` with the plant at rest and returns the bus voltage phasor (pu, angle 0).
 * Sets listed in `deExcited` (off-line) start with no field voltage, at their residual voltage.
 * @throws NoSteadyState (from the sharing solver) when the on-line plant has no operating point.
 */
export function initialiseAtRest(
  m: SimModel,
  plant: Plant,
  y: Float64Array,
  deExcited: ReadonlySet<string>,
  atRest?: SharingResult,
): { busPU: number; frequencyPU: number } {
  let anyOnline = false;
  for (let i = 0; i < m.n; i++) {
    if (m.online[i]) anyOnline = true;
    else initialiseOffline(m, i, y, deExcited.has(m.ids[i]!));
  }
  if (!anyOnline) return { busPU: 0, frequencyPU: 1 };
  const op = atRest ?? solveSharing(plant);
  const vb = op.bus.voltageV / m.ratedVoltageV;
  const w = op.bus.frequencyHz / m.ratedFrequencyHz;
  const byId = new Map(op.sets.map((s) => [s.id, s]));
  const vts = new Float64Array(m.n);
  for (let i = 0; i < m.n; i++) {
    if (!m.online[i]) continue;
    const r = byId.get(m.ids[i]!)!;
    const o = i * STATES_PER_SET;
    const sk = m.ratedKVA[i]!;
    // Terminal powers on the system base; the terminal voltage through the feeder, in
    // closed form: with V_t real, V_b = (V_t² − a − jb) / V_t, a + jb = Z_f (P − jQ).
    const p = r.kW / m.baseKVA;
    const q = r.kVAR / m.baseKVA;
    const zr = m.zfRe[i]!;
    const zi = m.zfIm[i]!;
    const a = zr * p + zi * q;
    const b = zi * p - zr * q;
    const c = 2 * a + vb * vb;
    const vt2 = 0.5 * (c + Math.sqrt(Math.max(0, c * c - 4 * (a * a + b * b))));
    const vt = Math.sqrt(vt2);
    const th = Math.atan2(-b, vt2 - a); // bus angle seen from the terminal
    const tRe = vt * Math.cos(-th);
    const tIm = vt * Math.sin(-th);
    // I = (P − jQ) / V_t*, on the set's own base.
    const scale = m.baseKVA / sk;
    const den = vt2;
    const iRe = ((p * tRe + q * tIm) / den) * scale;
    const iIm = ((p * tIm - q * tRe) / den) * scale;
    // E' = V_t + jX'd I (along the q-axis: E' = E'q e^{jδ}); E'' = V_t + jX''d I.
    const x1 = m.xd1PU[i]!;
    const x2 = m.xd2PU[i]!;
    const e1Re = tRe - x1 * iIm;
    const e1Im = tIm + x1 * iRe;
    const delta = Math.atan2(e1Im, e1Re);
    const eq1 = Math.hypot(e1Re, e1Im);
    const e2Re = tRe - x2 * iIm;
    const e2Im = tIm + x2 * iRe;
    const s = Math.sin(delta);
    const co = Math.cos(delta);
    const id = iRe * s - iIm * co;
    const ed2 = e2Re * s - e2Im * co;
    const eq2 = e2Re * co + e2Im * s;
    const pOwn = r.kW / sk;
    y[o + DELTA] = delta;
    y[o + OMEGA] = w;
    y[o + EQ1] = eq1;
    y[o + ED2] = ed2;
    y[o + EQ2] = eq2;
    y[o + PMECH] = pOwn;
    y[o + ACTUATOR] = pOwn;
    y[o + GOV_INT] = m.govMode[i] === GOV_BASE ? 0 : pOwn / m.kwPU[i]! / m.isoGainPU[i]! - (m.setpointPU[i]! - w);
    const efd = eq1 + (m.xdPU[i]! - x1) * id - m.residualPU[i]!;
    y[o + EFD] = efd;
    y[o + VAR_TRIM] = m.regMode[i] === REG_PF ? vt - m.setpointVPU[i]! : 0;
    vts[i] = vt;
  }
  // Regulator integrators last: the cross-current sets need the group's means.
  let crossKVAR = 0;
  let crossKVA = 0;
  let crossV = 0;
  for (let i = 0; i < m.n; i++) {
    if (m.online[i] && m.regMode[i] === REG_CROSS) {
      crossKVAR += byId.get(m.ids[i]!)!.kVAR;
      crossV += vts[i]! * m.ratedKVA[i]!;
      crossKVA += m.ratedKVA[i]!;
    }
  }
  const qBarCross = crossKVA > 0 ? crossKVAR / crossKVA : 0;
  const vBarCross = crossKVA > 0 ? crossV / crossKVA : 0;
  for (let i = 0; i < m.n; i++) {
    if (!m.online[i]) continue;
    const o = i * STATES_PER_SET;
    const qOwn = byId.get(m.ids[i]!)!.kVAR / m.ratedKVA[i]!;
    const sensed = m.regMode[i] === REG_CROSS ? vBarCross : vts[i]!;
    const e = voltageReference(m, i, y, o, qOwn, qBarCross) - sensed;
    y[o + AVR_INT] = y[o + EFD]! / m.gainPU[i]! - e;
  }
  return { busPU: vb, frequencyPU: w };
}
