/**
 * Grades a synchronizing close: the contact against the window the exercise grades to,
 * the surge and torque step against the machine's limits, a score and a plain-language
 * verdict, plus the traces of the first seconds after closing.
 */
import type { Plant, SyncLimits, TrainerCheck, TrainerPassCriteria, TrainerState, TrainerTraces, TrainerVerdict } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { afterCloseTraces } from './after-close';
import { afterClosePlantTraces } from './after-close-plant';
import type { AfterCloseOptions } from './after-close';
import { contactStress } from './contact-stress';
import { DEAD_BUS_CLOSE_LIMITS, MACHINE_STANDARD_WINDOW } from './levels';
import { breakerActualMs, governorDroopPU } from './live-model';
import { judgePass } from './pass';
import { wrapAngleDeg } from '../sync/phasor';
import { advanceAngleDeg } from '../sync/slip-timing';
import { formatNumber } from '../../../shared-types';

const f = (v: number, d: number): string => formatNumber(v, d);
const signed = (v: number, d: number): string => (v > 0 ? '+' : '') + f(v, d);

/** A copy of `state` closed at the corner of the machine standard's window (+10°, +5 %, +0.067 Hz), running light. */
function cornerState(state: TrainerState): TrainerState {
  const m = state.machine;
  const fr = m.ratedFrequencyHz;
  const w = MACHINE_STANDARD_WINDOW;
  const fInc = state.busFrequencyHz + w.slipHz;
  const vInc = state.busVoltageV * (1 + w.voltagePct / 100);
  const mech = m.dampingPU * (fInc / fr - 1);
  const k = 1 + w.voltagePct / 100;
  const rad = (w.angleDeg * Math.PI) / 180;
  return {
    ...state,
    angleDeg: w.angleDeg,
    incomingFrequencyHz: fInc,
    incomingVoltageV: vInc,
    speedReferenceHz: fInc + mech * governorDroopPU(m) * fr,
    voltageReferenceV: vInc,
    actuatorPU: mech,
    mechanicalPU: mech,
    emfPU: vInc / m.ratedVoltageV,
    fieldPU: vInc / m.ratedVoltageV,
    contact: {
      atS: state.contact?.atS ?? 0,
      angleDeg: w.angleDeg,
      slipHz: w.slipHz,
      voltageDifferencePct: w.voltagePct,
      deltaVPU: Math.sqrt(1 + k * k - 2 * k * Math.cos(rad)),
      commandAngleDeg: w.angleDeg,
    },
  };
}

/** The trainee's window is looser than the graded one in at least one limit. */
function looserWindow(set: SyncLimits | null, ref: SyncLimits): string[] {
  if (!set) return [];
  const out: string[] = [];
  if (set.angleDeg > ref.angleDeg) out.push(`angle ±${f(set.angleDeg, 1)}° is wider than ±${f(ref.angleDeg, 1)}°`);
  if (set.slipHz > ref.slipHz) out.push(`slip ${f(set.slipHz, 3)} Hz is wider than ${f(ref.slipHz, 3)} Hz`);
  if (set.voltagePct > ref.voltagePct) out.push(`voltage ${f(set.voltagePct, 1)} % is wider than ${f(ref.voltagePct, 1)} %`);
  return out;
}

/**
 * The verdict of a closed exercise. With `plant` (the one the exercise came from) the
 * traces come from the plant's simulator, else from the two-machine swing model.
 * @throws InvalidInput when the breaker has not closed yet.
 */
export function judgeClose(state: TrainerState, options: Partial<AfterCloseOptions> = {}, plant?: Plant, pass?: TrainerPassCriteria): TrainerVerdict {
  const v = judgeContact(state, options, plant);
  return pass ? { ...v, pass: judgePass(v, pass) } : v;
}

/** Sentences about the faults the instructor scripted, said after the close (the trainee was not told before). */
function faultSentences(state: TrainerState): string[] {
  const fault = state.faults;
  if (!fault) return [];
  const out: string[] = [];
  if (fault.breakerSlowMs) {
    const set = state.level.breakerClosingMs;
    const c = state.contact;
    const s = c ? c.slipHz : 0;
    out.push(
      `The breaker took ${f(breakerActualMs(state), 0)} ms, ${f(fault.breakerSlowMs, 0)} ms slower than its ${f(set, 0)} ms setting: ` +
        `at this slip the angle moved ${f(advanceAngleDeg(s, fault.breakerSlowMs), 1)}° more than the advance the setting allows for.`,
    );
  }
  if (fault.wrongWindow && !state.level.mustSetWindow) {
    const w = fault.wrongWindow;
    const r = state.referenceWindow;
    out.push(
      `The sync-check window you were shown (±${f(w.angleDeg, 1)}°, ${f(w.slipHz, 3)} Hz, ${f(w.voltagePct, 1)} %) was set wrong; ` +
        `the close is graded to ±${f(r.angleDeg, 1)}°, ${f(r.slipHz, 3)} Hz, ${f(r.voltagePct, 1)} %.`,
    );
  }
  if (fault.busDriftHz !== undefined && fault.busDriftHz > 0 && !fault.deadBus) out.push(`The droop bus wandered by up to ±${f(fault.busDriftHz, 2)} Hz.`);
  return out;
}

/** The verdict of a dead-bus close: the incoming set's voltage and frequency against rated; no surge, no swing. */
function judgeDeadBus(state: TrainerState, c: NonNullable<TrainerState['contact']>): TrainerVerdict {
  const L = DEAD_BUS_CLOSE_LIMITS;
  const source = 'dead-bus close (common practice)';
  const checks: TrainerCheck[] = [
    {
      quantity: 'Incoming voltage from rated',
      unit: '%',
      value: c.voltageDifferencePct,
      limit: L.voltagePct,
      source,
      within: Math.abs(c.voltageDifferencePct) <= L.voltagePct,
    },
    { quantity: 'Incoming frequency from rated', unit: 'Hz', value: c.slipHz, limit: L.frequencyHz, source, within: Math.abs(c.slipHz) <= L.frequencyHz },
  ];
  const insideWindow = checks.every((k) => k.within);
  const rv = Math.abs(c.voltageDifferencePct) / L.voltagePct;
  const rf = Math.abs(c.slipHz) / L.frequencyHz;
  const raw = insideWindow ? 100 - 25 * rv - 25 * rf : 50 * Math.pow(0.5, Math.max(rv, rf, 1) - 1);
  const score = Math.round(Math.min(100, Math.max(0, raw)));
  const grade: TrainerVerdict['grade'] = !insideWindow ? 'rough' : score >= 80 ? 'good' : 'fair';
  const m = state.machine;
  const at = `${f(m.ratedVoltageV * (1 + c.voltageDifferencePct / 100), 0)} V (${signed(c.voltageDifferencePct, 1)} % of rated), ${f(m.ratedFrequencyHz + c.slipHz, 2)} Hz (${signed(c.slipHz, 2)} Hz from rated)`;
  const parts = [
    insideWindow ? `Dead bus energised at ${at}: the bus takes rated voltage and frequency.` : `Dead bus energised off rated, at ${at}.`,
    ...checks
      .filter((k) => !k.within)
      .map(
        (k) =>
          `${k.quantity} ${signed(k.value, k.unit === 'Hz' ? 2 : 1)} ${k.unit} exceeded the ±${f(k.limit, k.unit === 'Hz' ? 2 : 1)} ${k.unit} a dead-bus close allows.`,
      ),
    'A dead bus has no voltage to synchronize to: no surge from an angle or slip; the loads the bus then picks up are not modelled here.',
    ...faultSentences(state),
  ];
  const verdict = parts.join(' ');
  const none: TrainerTraces = { tS: [], angleDeg: [], currentPU: [], powerPU: [], speedHz: [], source: 'two-machine' };
  return {
    contact: { ...c },
    surgeCurrentPU: 0,
    surgeCurrentA: 0,
    peakCurrentA: 0,
    torqueStepPU: 0,
    torqueStepKNm: 0,
    peakTorquePU: 0,
    peakTorqueKNm: 0,
    machineLimits: {
      surgeCurrentPU: 0,
      torqueStepPU: 0,
      peakTorquePU: 0,
      peakCurrentPU: 0,
      peakPowerPU: 0,
      source: 'none: a dead-bus close has no synchronizing surge',
    },
    checks,
    insideWindow,
    withinMachineLimits: true,
    score,
    grade,
    verdict,
    deadBusClose: true,
    traces: none,
    tracesNote: 'A dead-bus close has no synchronizing swing: no traces.',
    attempt: {
      seed: state.seed,
      level: state.levelId,
      angleAtContactDeg: c.angleDeg,
      slipAtContactHz: c.slipHz,
      voltageDifferencePct: c.voltageDifferencePct,
      surgeCurrentPU: 0,
      torqueStepPU: 0,
      score,
      verdict,
    },
  };
}

function judgeContact(state: TrainerState, options: Partial<AfterCloseOptions>, plant?: Plant): TrainerVerdict {
  const c = state.contact;
  if (state.phase !== 'closed' || !c) throw new InvalidInput('state: the breaker has not closed yet; give the close command and step until contact.');
  if (state.faults?.deadBus) return judgeDeadBus(state, c);
  const m = state.machine;
  const ref = state.referenceWindow;
  const busPU = state.busVoltageV / m.ratedVoltageV;
  const stress = contactStress(m, state.bus, c.angleDeg, 1 + c.voltageDifferencePct / 100, state.incomingFrequencyHz / m.ratedFrequencyHz, busPU);
  // Machine limits: the stress of a close at the corner of the machine standard's window (angle and voltage at their limits).
  const edge = contactStress(m, state.bus, MACHINE_STANDARD_WINDOW.angleDeg, 1 + MACHINE_STANDARD_WINDOW.voltagePct / 100);
  const machineLimits = {
    surgeCurrentPU: edge.surgeCurrentPU,
    torqueStepPU: Math.abs(edge.torqueStepPU),
    peakTorquePU: Math.abs(edge.peakTorquePU),
    peakCurrentPU: 0,
    peakPowerPU: 0,
    source: 'stress of a close at ±10°, +5 %, +0.067 Hz (IEEE C50.12/C50.13 synchronizing limits, from memory) on this machine',
  };
  // Traces of the first seconds: the plant's simulator when the exercise came from a plant, else the two-machine swing.
  let tracesNote: string | null = null;
  let usePlant = !!(plant && state.incomingSetId);
  const tracesOf = (x: TrainerState): TrainerTraces => {
    if (usePlant && plant && x.incomingSetId) {
      try {
        return afterClosePlantTraces(x, plant, x.incomingSetId, options.durationS === undefined ? {} : { durationS: options.durationS });
      } catch (e) {
        usePlant = false;
        tracesNote = `The plant's simulator could not run this close (${e instanceof Error ? e.message : String(e)}); the traces come from the two-machine model.`;
      }
    }
    return afterCloseTraces(x, options);
  };
  const traces = tracesOf(state);
  // The same model run for a close at the corner of the machine standard's window sets the limits for the swing.
  const edgeTraces = tracesOf(cornerState(state));
  const peak = (xs: number[]): number => xs.reduce((a, v) => Math.max(a, Math.abs(v)), 0);
  const peakCurrentPU = peak(traces.currentPU);
  const peakPowerPU = peak(traces.powerPU);
  machineLimits.peakCurrentPU = peak(edgeTraces.currentPU);
  machineLimits.peakPowerPU = peak(edgeTraces.powerPU);
  const windowSource = state.level.mustSetWindow ? 'exercise window (graded)' : 'exercise window';
  const checks: TrainerCheck[] = [
    {
      quantity: 'Phase angle at contact',
      unit: '°',
      value: c.angleDeg,
      limit: ref.angleDeg,
      source: windowSource,
      within: Math.abs(c.angleDeg) <= ref.angleDeg,
    },
    { quantity: 'Slip at contact', unit: 'Hz', value: c.slipHz, limit: ref.slipHz, source: windowSource, within: Math.abs(c.slipHz) <= ref.slipHz },
    {
      quantity: 'Voltage difference',
      unit: '%',
      value: c.voltageDifferencePct,
      limit: ref.voltagePct,
      source: windowSource,
      within: Math.abs(c.voltageDifferencePct) <= ref.voltagePct,
    },
  ];
  if (ref.incomingFaster)
    checks.push({ quantity: 'Incoming faster than bus', unit: 'Hz', value: c.slipHz, limit: 0, source: windowSource, within: c.slipHz > 0 });
  if (ref.incomingHigher) {
    checks.push({
      quantity: 'Incoming voltage at or above bus',
      unit: '%',
      value: c.voltageDifferencePct,
      limit: 0,
      source: windowSource,
      within: c.voltageDifferencePct >= 0,
    });
  }
  const windowChecks = checks.length;
  checks.push(
    {
      quantity: 'Surge current',
      unit: 'pu',
      value: stress.surgeCurrentPU,
      limit: machineLimits.surgeCurrentPU,
      source: 'machine limit',
      within: stress.surgeCurrentPU <= machineLimits.surgeCurrentPU * (1 + 1e-9),
    },
    {
      quantity: 'Torque step',
      unit: 'pu',
      value: stress.torqueStepPU,
      limit: machineLimits.torqueStepPU,
      source: 'machine limit',
      within: Math.abs(stress.torqueStepPU) <= machineLimits.torqueStepPU * (1 + 1e-9),
    },
    {
      quantity: 'Peak air-gap torque, first cycle',
      unit: 'pu',
      value: stress.peakTorquePU,
      limit: machineLimits.peakTorquePU,
      source: 'machine limit',
      within: Math.abs(stress.peakTorquePU) <= machineLimits.peakTorquePU * (1 + 1e-9),
    },
    {
      quantity: 'Peak current, first seconds',
      unit: 'pu',
      value: peakCurrentPU,
      limit: machineLimits.peakCurrentPU,
      source: 'machine limit (swing)',
      within: peakCurrentPU <= machineLimits.peakCurrentPU * (1 + 1e-9),
    },
    {
      quantity: 'Peak power swing',
      unit: 'pu',
      value: peakPowerPU,
      limit: machineLimits.peakPowerPU,
      source: 'machine limit (swing)',
      within: peakPowerPU <= machineLimits.peakPowerPU * (1 + 1e-9),
    },
  );
  const insideWindow = checks.slice(0, windowChecks).every((k) => k.within);
  const withinMachineLimits = checks.slice(windowChecks).every((k) => k.within);
  // The three checks of the contact itself (surge, step, peak torque); the swing's two follow.
  const closeLimitsOk = checks.slice(windowChecks, windowChecks + 3).every((k) => k.within);

  const ra = Math.abs(c.angleDeg) / ref.angleDeg;
  const rs = Math.abs(c.slipHz) / ref.slipHz;
  const rv = Math.abs(c.voltageDifferencePct) / ref.voltagePct;
  let score: number;
  if (insideWindow) {
    // Inside: 100 for a perfect close, down to 55 at the window's corner; angle weighs most (it sets the surge).
    score = 100 - 25 * ra - 10 * rs - 10 * rv;
  } else {
    // Outside: 50 at the edge, halving for every further window's width.
    const worst = Math.max(ra, rs, rv, 1);
    score = 50 * Math.pow(0.5, worst - 1);
    if (ref.incomingFaster && c.slipHz <= 0) score = Math.min(score, 40);
  }
  if (!withinMachineLimits) {
    const over = Math.max(
      stress.surgeCurrentPU / machineLimits.surgeCurrentPU,
      Math.abs(stress.torqueStepPU) / machineLimits.torqueStepPU,
      Math.abs(stress.peakTorquePU) / machineLimits.peakTorquePU,
      peakCurrentPU / machineLimits.peakCurrentPU,
      peakPowerPU / machineLimits.peakPowerPU,
    );
    score = Math.min(score, 20 / over);
  }
  const loose = looserWindow(state.level.mustSetWindow ? state.window : null, ref);
  if (loose.length) score -= 10;
  score = Math.round(Math.min(100, Math.max(0, score)));

  const grade: TrainerVerdict['grade'] = !withinMachineLimits ? 'harmful' : !insideWindow ? 'rough' : score >= 80 ? 'good' : 'fair';
  const at = `${signed(c.angleDeg, 1)}°, slip ${signed(c.slipHz, 3)} Hz, voltage ${signed(c.voltageDifferencePct, 1)} %`;
  const parts: string[] = [];
  if (grade === 'good') parts.push(`Good close at ${at}: inside the window with margin.`);
  else if (grade === 'fair') parts.push(`Acceptable close at ${at}: inside the window, but near its edge.`);
  else parts.push(`Closed outside the window at ${at}.`);
  const outside = checks.slice(0, windowChecks).filter((k) => !k.within);
  for (const k of outside) {
    if (k.limit === 0) parts.push(`${k.quantity} was required and not met.`);
    else
      parts.push(`${k.quantity} ${signed(k.value, k.unit === 'Hz' ? 3 : 1)} ${k.unit} exceeded the ±${f(k.limit, k.unit === 'Hz' ? 3 : 1)} ${k.unit} limit.`);
  }
  parts.push(
    `Surge ${f(stress.surgeCurrentPU, 2)} pu (${f(stress.surgeCurrentA, 0)} A), torque step ${f(stress.torqueStepPU, 2)} pu (${f(stress.torqueStepKNm, 2)} kN·m) ` +
      `and first-cycle peak torque ${f(stress.peakTorquePU, 2)} pu (${f(stress.peakTorqueKNm, 2)} kN·m) ` +
      (closeLimitsOk
        ? `are within the machine's limits (${f(machineLimits.surgeCurrentPU, 2)} pu, ${f(machineLimits.torqueStepPU, 2)} pu, ${f(machineLimits.peakTorquePU, 2)} pu).`
        : `exceed the machine's limits (${f(machineLimits.surgeCurrentPU, 2)} pu, ${f(machineLimits.torqueStepPU, 2)} pu, ${f(machineLimits.peakTorquePU, 2)} pu): on a real set this strains shaft, coupling and windings and may trip the protection.`),
  );
  const swingOver = checks.slice(windowChecks + 3).filter((k) => !k.within);
  if (swingOver.length) {
    parts.push(
      `In the first seconds the set swung to ${f(peakCurrentPU, 2)} pu current and ${f(peakPowerPU, 2)} pu power against ${f(machineLimits.peakCurrentPU, 2)} and ${f(machineLimits.peakPowerPU, 2)} pu for a close at the window's edge: it was pulled into step hard.`,
    );
  }
  if (c.slipHz < 0 && Math.abs(c.angleDeg) < 90)
    parts.push('The incoming set was slower than the bus, so it took power from the bus at first (motoring) — reverse-power protection may see it.');
  // The angle the set gained during the breaker's travel, the short way round (−34°, not 326°).
  const travel = wrapAngleDeg(c.angleDeg - c.commandAngleDeg);
  if (Math.abs(c.slipHz) > 1e-6 && Math.abs(c.angleDeg) > 3) {
    parts.push(
      `The command went at ${signed(c.commandAngleDeg, 1)}°; during the breaker's ${f(breakerActualMs(state), 0)} ms the angle moved ${signed(travel, 1)}° (the incoming set ran ${c.slipHz > 0 ? 'fast' : 'slow'}), to ${signed(c.angleDeg, 1)}° at contact.`,
    );
  }
  if (loose.length) parts.push(`The window you set was too loose: ${loose.join('; ')}.`);
  parts.push(...faultSentences(state));

  const verdict = parts.join(' ');
  return {
    contact: { ...c },
    surgeCurrentPU: stress.surgeCurrentPU,
    surgeCurrentA: stress.surgeCurrentA,
    peakCurrentA: stress.peakCurrentA,
    torqueStepPU: stress.torqueStepPU,
    torqueStepKNm: stress.torqueStepKNm,
    peakTorquePU: stress.peakTorquePU,
    peakTorqueKNm: stress.peakTorqueKNm,
    machineLimits,
    checks,
    insideWindow,
    withinMachineLimits,
    score,
    grade,
    verdict,
    traces,
    tracesNote,
    attempt: {
      seed: state.seed,
      level: state.levelId,
      angleAtContactDeg: c.angleDeg,
      slipAtContactHz: c.slipHz,
      voltageDifferencePct: c.voltageDifferencePct,
      surgeCurrentPU: stress.surgeCurrentPU,
      torqueStepPU: stress.torqueStepPU,
      score,
      verdict,
    },
  };
}
