/**
 * The trainer's live model of an incoming set running light before its breaker closes:
 * speed from a droop governor with actuator and engine lags acting on the swing
 * equation, voltage from a regulator with exciter lag and ceiling acting on the
 * open-circuit field (T'd0). One call advances a frame; state in, state out.
 *
 * Simplifications (documented for trainees and reviewers): running light, the set's
 * electrical output is zero, so the swing equation reads 2H dω/dt = Pm − D(ω − 1)
 * (Kundur 1994, eq. 3.215 with Pe = 0); the regulator feeds its reference forward so
 * it holds the reference at no load without an integrator (a proportional-plus-bias
 * stand-in for an IEEE Std 421.5 type with integral action).
 */
import type { TrainerInputs, TrainerMachine, TrainerState } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { angleAfterDeg } from '../sync/phasor';

/** Raise/lower rate of the speed reference while a control is held, Hz/s. */
export const SPEED_RAISE_HZ_PER_S = 0.2;
/** Raise/lower rate of the voltage reference while held, fraction of rated per second (1 %/s). */
export const VOLTAGE_RAISE_PU_PER_S = 0.01;
/** Internal integration step, s (explicit Euler is stable: the shortest lag is 50 ms). */
const SUBSTEP_S = 0.001;
/** Longest frame a single call will advance, s. */
export const MAX_FRAME_S = 0.25;

/** Governor droop as a fraction; a set in isochronous (0 %) is modelled with 1 % so the loop stays defined at no load. */
export function governorDroopPU(machine: TrainerMachine): number {
  return Math.max(machine.droopPct, 1) / 100;
}

/** The breaker's real closing time, ms: the level's setting plus any slow-down scripted as a fault. */
export function breakerActualMs(state: TrainerState): number {
  return state.level.breakerClosingMs + (state.faults?.breakerSlowMs ?? 0);
}

/** Bus frequency at time `tS` with its drift (two slow sines of seeded phase), Hz. */
export function busFrequencyAt(state: TrainerState, tS: number): number {
  const a = state.level.busDriftHz;
  if (a === 0) return state.busBaseFrequencyHz;
  const d = state.drift;
  return (
    state.busBaseFrequencyHz + a * (0.65 * Math.sin((2 * Math.PI * tS) / d.period1S + d.phase1) + 0.35 * Math.sin((2 * Math.PI * tS) / d.period2S + d.phase2))
  );
}

/**
 * Advances the exercise by `dtS` seconds under the held `inputs`. A close command starts
 * the breaker's closing time; when it runs out the contact is recorded and the phase
 * becomes `closed` (the step stops exactly at contact). Steps after contact return the
 * state unchanged. Never mutates `state`.
 * @throws InvalidInput for a negative or over-long step, or a close before the window is set.
 */
export function stepTrainer(state: TrainerState, inputs: TrainerInputs, dtS: number): TrainerState {
  if (!(dtS >= 0) || dtS > MAX_FRAME_S) throw new InvalidInput(`dtS: must be between 0 and ${MAX_FRAME_S} s (got ${dtS}).`);
  if (state.phase === 'closed') return state;
  const s: TrainerState = { ...state, drift: { ...state.drift } };
  if (inputs.window) s.window = { ...inputs.window };
  if (inputs.close && s.phase === 'running') {
    if (!s.window) throw new InvalidInput('close: set the sync-check window first (this level asks for it).');
    s.phase = 'closing';
    s.closeCommandAtS = s.tS;
    s.closeCommandAngleDeg = s.angleDeg;
  }

  const m = s.machine;
  const fr = m.ratedFrequencyHz;
  const vr = m.ratedVoltageV;
  const r = governorDroopPU(m);
  const fMin = 0.9 * fr;
  const fMax = 1.1 * fr;
  const vMin = 0.85 * vr;
  const vMax = 1.15 * vr;
  // The breaker's real closing time: its setting, plus the slow-down an instructor scripted.
  const contactAtS = s.closeCommandAtS === null ? Infinity : s.closeCommandAtS + breakerActualMs(s) / 1000;
  const endS = Math.min(s.tS + dtS, contactAtS);

  let t = s.tS;
  let speedPU = s.incomingFrequencyHz / fr;
  let angle = s.angleDeg;
  let act = s.actuatorPU;
  let mech = s.mechanicalPU;
  let field = s.fieldPU;
  let emf = s.emfPU;
  let fRef = s.speedReferenceHz;
  let vRef = s.voltageReferenceV;
  let fBus = s.busFrequencyHz;
  while (t < endS - 1e-12) {
    const h = Math.min(SUBSTEP_S, endS - t);
    fRef = Math.min(fMax, Math.max(fMin, fRef + inputs.speed * SPEED_RAISE_HZ_PER_S * h));
    vRef = Math.min(vMax, Math.max(vMin, vRef + inputs.voltage * VOLTAGE_RAISE_PU_PER_S * vr * h));
    // Governor: droop command through actuator and engine lags, limited to −10 %…110 % of rated kW (kVA base).
    const kwLimit = m.ratedKW / m.ratedKVA;
    const cmd = Math.min(1.1 * kwLimit, Math.max(-0.1 * kwLimit, (fRef / fr - speedPU) / r));
    // Lags advance by their exact first-order step, x += (target − x)(1 − e^(−h/T)) (closed form for a
    // target held over the substep): stable for any T > 0 and equal to "no lag" as T → 0.
    const actNext = m.actuatorLagS > 0 ? act + (cmd - act) * -Math.expm1(-h / m.actuatorLagS) : cmd;
    const mechNext = m.engineLagS > 0 ? mech + (act - mech) * -Math.expm1(-h / m.engineLagS) : act;
    // Regulator: reference fed forward plus gain on the error, through the exciter lag, within the ceiling.
    const vRefPU = vRef / vr;
    const fieldCmd = Math.min(m.ceilingPU, Math.max(0, vRefPU + m.regulatorGainPU * (vRefPU - emf)));
    const fieldNext = m.exciterLagS > 0 ? field + (fieldCmd - field) * -Math.expm1(-h / m.exciterLagS) : fieldCmd;
    const dEmf = (field - emf) / m.tdopS;

    // Swing equation 2H ds/dt = Pm − D (s − 1), the damping term taken implicitly (stable for any D/H).
    const k = (h * m.dampingPU) / (2 * m.inertiaS);
    speedPU = (speedPU + (h * (mech + m.dampingPU)) / (2 * m.inertiaS)) / (1 + k);
    act = actNext;
    mech = mechNext;
    field = fieldNext;
    emf += h * dEmf;
    t += h;
    fBus = busFrequencyAt(s, t);
    angle = angleAfterDeg(angle, speedPU * fr - fBus, h);
  }

  s.tS = t;
  s.incomingFrequencyHz = speedPU * fr;
  // Running light the terminal voltage is the internal EMF (open circuit).
  s.incomingVoltageV = emf * vr;
  s.angleDeg = angle;
  s.actuatorPU = act;
  s.mechanicalPU = mech;
  s.fieldPU = field;
  s.emfPU = emf;
  s.speedReferenceHz = fRef;
  s.voltageReferenceV = vRef;
  s.busFrequencyHz = fBus;

  if (t >= contactAtS - 1e-9 && s.faults?.deadBus) {
    // Energising a dead bus: no angle across the breaker; the incoming set's voltage and frequency against rated.
    s.phase = 'closed';
    s.contact = {
      atS: t,
      angleDeg: 0,
      slipHz: s.incomingFrequencyHz - fr,
      voltageDifferencePct: 100 * (s.incomingVoltageV / vr - 1),
      deltaVPU: s.incomingVoltageV / vr,
      commandAngleDeg: 0,
    };
  } else if (t >= contactAtS - 1e-9) {
    const vb = s.busVoltageV;
    const ratio = s.incomingVoltageV / vb;
    const rad = (angle * Math.PI) / 180;
    s.phase = 'closed';
    s.contact = {
      atS: t,
      angleDeg: angle,
      slipHz: s.incomingFrequencyHz - fBus,
      voltageDifferencePct: 100 * (ratio - 1),
      // Phasor difference (law of cosines): |ΔV| = sqrt(V1² + V2² − 2 V1 V2 cos θ), here in pu of the bus.
      deltaVPU: Math.sqrt(1 + ratio * ratio - 2 * ratio * Math.cos(rad)),
      commandAngleDeg: s.closeCommandAngleDeg ?? angle,
    };
  }
  return s;
}
