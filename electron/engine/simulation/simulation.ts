/**
 * `createSimulation`: a plant in motion, stepped by the caller. Fixed-step RK4 over the
 * plant's state (machines, governors, regulators), the bus solved at every evaluation,
 * events applied at step boundaries, protection (reverse power) checked every step,
 * results recorded and decimated. Used by `simulate` for whole runs and by live views
 * (the operator trainer) a frame at a time.
 */
import type {
  CloseRecord,
  ProtectionTrip,
  Scenario,
  ScenarioEvent,
  SharingResult,
  SimulationLogEntry,
  SimulationResult,
  SimulationSnapshot,
  SetSnapshot,
} from '../../../shared-types';
import { Diverged, InvalidInput } from '../errors';
import { wrapAngleDeg } from '../../../shared-types/angle';
import { ratedCurrentA } from '../../../shared-types/laws';
import { DELTA, EFD, OMEGA, PMECH, STATES_PER_SET } from './layout';
import { GOV_DROOP } from '../mode-codes';
import { PROTECTION_DEVICES, buildSimModel } from './sim-model';
import type { Outputs, SimModel } from './sim-types';
import { createOutputs, evaluatePlant } from './plant-dynamics';
import { createRk4, rk4StepFromK1 } from './integrator';
import type { Rhs, Rk4 } from './integrator';
import { initialiseAtRest } from './initialise';
import { applyEvent } from './events';
import type { EventTarget } from './events';
import { Recorder } from './recorder';
import type { SetSample } from './recorder';
import { computeMetrics } from './metrics';
import { steadyTarget } from './steady-target';
import { fieldCeiling } from './excitation';
import { formatMs, formatNumber } from '../../../shared-types';

/** Default integration step, ms. */
export const DEFAULT_STEP_MS = 1;
/** Default number of plotted points. */
export const DEFAULT_OUTPUT_POINTS = 2000;
/** Largest step the simulator accepts, ms (RK4 stability with the fastest lags). */
export const MAX_STEP_MS = 20;

/** A running simulation. */
export interface Simulation {
  /** Simulated time now, s. */
  readonly timeS: number;
  /** Integration step, s. */
  readonly stepS: number;
  /** Runs whole steps until `seconds` more have passed, applying due scenario events. */
  advance(seconds: number): void;
  /** Applies an event now (its `atS` is ignored). */
  applyEvent(event: ScenarioEvent): void;
  /** The plant now. */
  snapshot(): SimulationSnapshot;
  /** Metrics, series and log of the run so far. */
  result(): SimulationResult;
}

/** An angle in radians as degrees in (−180°, 180°] (the one wrap convention, `wrapAngleDeg`). */
function wrapDeg(rad: number): number {
  return wrapAngleDeg((rad * 180) / Math.PI);
}

class Run implements Simulation {
  readonly stepS: number;
  private k = 0;
  /** Time `advance` has been asked to reach, s (kept apart from k·h so frame times do not drift). */
  private targetS = 0;
  private readonly m: SimModel;
  private readonly y: Float64Array;
  private readonly out: Outputs;
  private readonly rk: Rk4;
  private readonly rhs: Rhs;
  private readonly events: ScenarioEvent[];
  private nextEvent = 0;
  private readonly pending: { atS: number; run: () => void }[] = [];
  private readonly recorder: Recorder;
  private readonly logs: SimulationLogEntry[] = [];
  private readonly warnings: string[] = [];
  private readonly closes: CloseRecord[] = [];
  private readonly target: EventTarget;
  private readonly sample: SetSample;
  private readonly reverseTimer: Float64Array;
  private readonly protTimer: Float64Array;
  private readonly oelTimer: Float64Array;
  private readonly trips: ProtectionTrip[] = [];
  private readonly currentScaleA: number;
  private disturbanceS: number | null = null;
  private initialF = 0;
  private initialV = 0;
  private nadir = Infinity;
  private peak = -Infinity;
  private vMin = Infinity;
  private vMax = -Infinity;
  private lastF = 0;
  private lastV = 0;
  private collapsed = false;
  /** Low-voltage episode of constant-power loads: start time (null when none runs), its worst kW, totals. */
  private lowVStartS: number | null = null;
  private lowVKind: 'low' | 'dead' | null = null;
  private lowVMaxKW = 0;
  private lowVEpisodes = 0;
  private unservedKWs = 0;
  private maxUnservedKW = 0;
  private lowVTotalS = 0;

  constructor(
    private readonly scenario: Scenario,
    atRest?: SharingResult,
  ) {
    const stepMs = scenario.stepMs ?? DEFAULT_STEP_MS;
    if (!(stepMs > 0 && stepMs <= MAX_STEP_MS)) throw new InvalidInput(`stepMs: must be greater than 0 and at most ${MAX_STEP_MS} ms.`);
    if (!(scenario.durationS > 0 && Number.isFinite(scenario.durationS))) throw new InvalidInput('durationS: must be greater than 0.');
    this.stepS = stepMs / 1000;
    const plant = scenario.plant;
    this.m = buildSimModel(plant, this.stepS);
    const n = this.m.n;
    this.y = new Float64Array(n * STATES_PER_SET);
    this.out = createOutputs(n);
    this.rk = createRk4(this.y.length, this.stepS);
    const m = this.m;
    const out = this.out;
    // The later RK4 stages of a step: loads and breakers stay as the step's first evaluation found them.
    this.rhs = (y, dy) => evaluatePlant(m, y, dy, out, true);
    const deExcited = new Set(scenario.startDeExcited ?? []);
    for (const id of deExcited) {
      const i = m.ids.indexOf(id);
      if (i < 0) throw new InvalidInput(`startDeExcited: there is no set "${id}" in the plant.`);
      if (m.online[i]) throw new InvalidInput(`startDeExcited: set "${id}" is on line; only an off-line set can start de-excited.`);
    }
    const init = initialiseAtRest(m, plant, this.y, deExcited, atRest);
    out.bus.re = init.busPU;
    out.bus.im = 0;
    this.events = [...scenario.events].sort((a, b) => a.atS - b.atS);
    const totalSteps = Math.round(scenario.durationS / this.stepS);
    this.recorder = new Recorder(m.ids, totalSteps, scenario.outputPoints ?? DEFAULT_OUTPUT_POINTS);
    this.sample = {
      kW: new Float64Array(n),
      kVAR: new Float64Array(n),
      currentA: new Float64Array(n),
      speedHz: new Float64Array(n),
      terminalV: new Float64Array(n),
    };
    this.reverseTimer = new Float64Array(n);
    this.protTimer = new Float64Array(PROTECTION_DEVICES.length * n);
    this.oelTimer = new Float64Array(n);
    this.currentScaleA = ratedCurrentA(m.baseKVA, m.ratedVoltageV);
    this.target = {
      m,
      y: this.y,
      out,
      log: (atS, text) => this.logs.push({ atS, text }),
      warn: (text) => this.warnings.push(text),
      closed: (record) => this.closes.push(record),
      later: (atS, run) => {
        this.pending.push({ atS, run });
        this.pending.sort((a, b) => a.atS - b.atS);
      },
    };
    for (const s of plant.sets) {
      const w = fieldCeiling(s).warning;
      if (w) this.warnings.push(`${s.id}: ${w}`);
    }
    if (m.raised.length > 0)
      this.warnings.push(`Lags shorter than two steps were taken as two steps (${formatMs(2 * this.stepS * 1000, 1)}): ${m.raised.join(', ')}.`);
    this.evaluateNow();
    this.initialF = this.frequencyHz();
    this.initialV = this.voltageV();
    this.lastF = this.initialF;
    this.lastV = this.initialV;
  }

  /**
   * Evaluates the plant now and at the present state: outputs into `out`, f(t, y) into `rk.k1`.
   * (The methods run every step work the time out as k·h rather than take it as an argument or read the
   * `timeS` getter: a number passed to or returned from a call that is not inlined is boxed on the heap.)
   */
  private evaluateNow(): void {
    this.out.t = this.k * this.stepS;
    evaluatePlant(this.m, this.y, this.rk.k1, this.out);
  }

  get timeS(): number {
    return this.k * this.stepS;
  }

  private frequencyHz(): number {
    return this.out.anyOnline ? this.out.omegaBus * this.m.ratedFrequencyHz : 0;
  }

  private voltageV(): number {
    return Math.sqrt(this.out.bus.re * this.out.bus.re + this.out.bus.im * this.out.bus.im) * this.m.ratedVoltageV;
  }

  private markDisturbance(t: number): void {
    if (this.disturbanceS !== null) return;
    this.disturbanceS = t;
    this.initialF = this.lastF;
    this.initialV = this.lastV;
    this.nadir = Infinity;
    this.peak = -Infinity;
    this.vMin = Infinity;
    this.vMax = -Infinity;
  }

  private applyDue(): void {
    const t = this.k * this.stepS;
    const half = 0.5 * this.stepS;
    const dueEvent = this.nextEvent < this.events.length && this.events[this.nextEvent]!.atS <= t + half;
    const duePending = this.pending.length > 0 && this.pending[0]!.atS <= t + half;
    if (!dueEvent && !duePending) return;
    // Fresh outputs at this exact state (bus angle for a close, present kW for a ramp).
    this.evaluateNow();
    if (dueEvent) this.markDisturbance(t);
    while (this.nextEvent < this.events.length && this.events[this.nextEvent]!.atS <= t + half) {
      applyEvent(this.target, this.events[this.nextEvent++]!, t);
    }
    while (this.pending.length > 0 && this.pending[0]!.atS <= t + half) this.pending.shift()!.run();
  }

  private observe(force: boolean): void {
    const t = this.k * this.stepS;
    const f = this.frequencyHz();
    const v = this.voltageV();
    this.lastF = f;
    this.lastV = v;
    if (!this.collapsed && this.out.anyOnline && f < 0.9 * this.m.ratedFrequencyHz) {
      this.collapsed = true;
      this.warnings.push(
        `Frequency fell below 90 % of rated (${formatNumber(0.9 * this.m.ratedFrequencyHz, 1)} Hz) at t = ${formatNumber(t, 2)} s: the sets on line cannot carry the load.`,
      );
    }
    // A dead bus has no frequency: extremes are taken while some set is on line.
    if (this.out.anyOnline) {
      if (f < this.nadir) this.nadir = f;
      if (f > this.peak) this.peak = f;
      if (v < this.vMin) this.vMin = v;
      if (v > this.vMax) this.vMax = v;
    }
    this.watchLowVoltage();
    this.recorder.trace(this.k, t, f, v, force);
    if (!this.recorder.wants(this.k, force)) return;
    const m = this.m;
    const out = this.out;
    const s = this.sample;
    for (let i = 0; i < m.n; i++) {
      const sk = m.ratedKVA[i]!;
      s.kW[i] = out.pOwn[i]! * sk;
      s.kVAR[i] = out.qOwn[i]! * sk;
      const ir = out.iRe[i]!;
      const ii = out.iIm[i]!;
      s.currentA[i] = Math.sqrt(ir * ir + ii * ii) * this.currentScaleA;
      s.speedHz[i] = this.y[i * STATES_PER_SET + OMEGA]! * m.ratedFrequencyHz;
      s.terminalV[i] = out.vt[i]! * m.ratedVoltageV;
    }
    this.recorder.record(this.k, t, f, v, s);
  }

  /**
   * Load the bus does not serve, said in the run: constant-power loads turn into constant
   * impedance below the plant's break voltage (`m.breakPU`; the bus solve needs it), and a dead bus serves
   * nothing (log lines, warning, energy).
   */
  private watchLowVoltage(): void {
    const t = this.k * this.stepS;
    const dead = !this.out.anyOnline;
    let kw = 0;
    if (dead) {
      for (const l of this.m.loads) if (l.on) kw += l.pPU;
      kw *= this.m.baseKVA;
    } else kw = this.out.unservedP * this.m.baseKVA;
    const kind = kw > 1e-6 ? (dead ? 'dead' : 'low') : null;
    if (kind !== this.lowVKind && this.lowVStartS !== null) this.endLowVoltage(t);
    if (kind === null) return;
    if (this.lowVStartS === null) {
      this.lowVStartS = t;
      this.lowVKind = kind;
      this.lowVMaxKW = 0;
      this.lowVEpisodes++;
      this.logs.push({
        atS: t,
        text:
          kind === 'dead'
            ? `bus dead: ${formatNumber(kw, 0)} kW of load not served`
            : `bus below ${formatNumber(this.m.breakPU * 100, 0)} % voltage: constant-power and constant-current loads now draw as constant impedance (${formatNumber(kw, 0)} kW not served)`,
      });
    }
    if (kw > this.lowVMaxKW) this.lowVMaxKW = kw;
    if (kw > this.maxUnservedKW) this.maxUnservedKW = kw;
    this.unservedKWs += kw * this.stepS;
    this.lowVTotalS += this.stepS;
  }

  private endLowVoltage(t: number): void {
    if (this.lowVStartS === null) return;
    const span = `up to ${formatNumber(this.lowVMaxKW, 0)} kW not served for ${formatNumber(t - this.lowVStartS, 2)} s`;
    this.logs.push({
      atS: t,
      text:
        this.lowVKind === 'dead'
          ? `bus live again (${span})`
          : `bus no longer below ${formatNumber(this.m.breakPU * 100, 0)} % voltage with constant-power and constant-current loads drawing as impedance (${span})`,
    });
    this.lowVStartS = null;
    this.lowVKind = null;
  }

  /**
   * Over-excitation limiter of each set: after the field has stayed above its limit for the
   * delay, the regulator holds it at the limit; once the regulator's demand has let the field
   * fall back below the limit and it has stayed there for the reset time (`oelResetS`), the
   * limiter lets go and the field may force again (common practice, values from memory).
   */
  private limitExcitation(): void {
    const t = this.k * this.stepS;
    const m = this.m;
    for (let i = 0; i < m.n; i++) {
      const lim = m.oelPU[i]!;
      if (!(lim > 0) || m.shutdown[i]) continue;
      const efd = this.y[i * STATES_PER_SET + EFD]!;
      if (m.oelActive[i]) {
        // Held, the field sits on the limit; below it the demand has fallen back.
        if (efd < lim * (1 - 1e-6)) {
          this.oelTimer[i] = this.oelTimer[i]! + this.stepS;
          if (this.oelTimer[i]! >= m.oelResetS[i]! - 1e-9) {
            m.oelActive[i] = 0;
            this.oelTimer[i] = 0;
            this.logs.push({ atS: t, text: `${m.ids[i]} over-excitation limiter resets: field below ${formatNumber(lim, 2)} pu for ${m.oelResetS[i]} s` });
          }
        } else this.oelTimer[i] = 0;
        continue;
      }
      if (efd > lim) {
        this.oelTimer[i] = this.oelTimer[i]! + this.stepS;
        if (this.oelTimer[i]! >= m.oelDelayS[i]! - 1e-9) {
          m.oelActive[i] = 1;
          this.oelTimer[i] = 0;
          this.logs.push({
            atS: t,
            text: `${m.ids[i]} over-excitation limiter acts: field held at ${formatNumber(lim, 2)} pu after ${m.oelDelayS[i]} s above it`,
          });
          this.warnings.push(
            `${m.ids[i]}: the over-excitation limiter held the field at ${formatNumber(lim, 2)} pu from t = ${formatNumber(t, 2)} s; the voltage may sag below its setting until the demand falls back below the limit for ${m.oelResetS[i]} s (its reset time).`,
          );
        }
      } else this.oelTimer[i] = 0;
    }
  }

  private trip(i: number, t: number, device: ProtectionTrip['device'], text: string): void {
    const m = this.m;
    m.online[i] = 0;
    m.shutdown[i] = 1;
    this.reverseTimer[i] = 0;
    for (let d = 0; d < PROTECTION_DEVICES.length; d++) this.protTimer[d * m.n + i] = 0;
    const line = `${m.ids[i]} tripped on ${text}`;
    this.logs.push({ atS: t, text: line });
    this.trips.push({ atS: t, id: m.ids[i]!, kind: 'set', device, text: line });
  }

  /**
   * Protection of each on-line set (reverse power 32, frequency 81U/81O, voltage 27/59; a trip
   * opens the breaker and stops the engine) and the loads' under-frequency shedding stages;
   * true when anything operated.
   */
  private protect(): boolean {
    const t = this.k * this.stepS;
    const m = this.m;
    const n = m.n;
    const h = this.stepS;
    const fr = m.ratedFrequencyHz;
    const vr = m.ratedVoltageV;
    const online = m.online;
    const reverseTrip = m.reverseTripPU;
    const kwPU = m.kwPU;
    const pOwn = this.out.pOwn;
    const vt = this.out.vt;
    const y = this.y;
    const reverseTimer = this.reverseTimer;
    const protTimer = this.protTimer;
    const pickup = m.protPickupPU;
    let operated = false;
    for (let i = 0; i < n; i++) {
      if (!online[i]) {
        reverseTimer[i] = 0;
        for (let d = 0; d < 4; d++) protTimer[d * n + i] = 0;
        continue;
      }
      const limit = reverseTrip[i]! * kwPU[i]!;
      if (limit > 0 && pOwn[i]! < -limit) {
        reverseTimer[i] = reverseTimer[i]! + h;
        if (reverseTimer[i]! >= m.reverseDelayS[i]! - 1e-9) {
          const setKW = m.kwPU[i]! * m.ratedKVA[i]!;
          this.trip(
            i,
            t,
            '32',
            `reverse power (device 32): below −${formatNumber(m.reverseTripPU[i]! * 100, 0)} % of ${formatNumber(setKW, 0)} kW for ${m.reverseDelayS[i]} s`,
          );
          operated = true;
          continue;
        }
      } else reverseTimer[i] = 0;
      const f = y[i * STATES_PER_SET + OMEGA]!;
      const v = vt[i]!;
      // The usual case first: no element picked up, every timer back to zero (four compares, no loop).
      const uf = pickup[i]!;
      const of = pickup[n + i]!;
      const uv = pickup[2 * n + i]!;
      const ov = pickup[3 * n + i]!;
      if (!((uf > 0 && f < uf) || (of > 0 && f > of) || (uv > 0 && v < uv) || (ov > 0 && v > ov))) {
        protTimer[i] = 0;
        protTimer[n + i] = 0;
        protTimer[2 * n + i] = 0;
        protTimer[3 * n + i] = 0;
        continue;
      }
      for (let d = 0; d < 4; d++) {
        const k = d * n + i;
        const p = pickup[k]!;
        const x = d < 2 ? f : v;
        const picked = p > 0 && (d % 2 === 0 ? x < p : x > p);
        if (!picked) {
          protTimer[k] = 0;
          continue;
        }
        protTimer[k] = protTimer[k]! + h;
        if (protTimer[k]! >= m.protDelayS[k]! - 1e-9) {
          const dev = PROTECTION_DEVICES[d]!;
          const what = ['under-frequency', 'over-frequency', 'undervoltage', 'overvoltage'][d]!;
          const pick = d < 2 ? `${formatNumber(p * fr, 2)} Hz` : `${formatNumber(p * vr, 0)} V`;
          this.trip(
            i,
            t,
            dev,
            `${what} (device ${dev}): ${d % 2 === 0 ? 'below' : 'above'} ${pick} (${formatNumber(p * 100, 1)} % of rated) for ${m.protDelayS[k]} s`,
          );
          operated = true;
          break;
        }
      }
    }
    this.limitExcitation();
    // Under-frequency load shedding on the bus frequency.
    if (this.out.anyOnline) {
      const fb = this.out.omegaBus;
      for (const l of m.loads) {
        if (!l.on || l.shedPU <= 0) continue;
        if (fb < l.shedPU) {
          l.shedTimer += h;
          if (l.shedTimer >= l.shedDelayS - 1e-9) {
            l.on = false;
            l.shedTimer = 0;
            const line = `load ${l.id} shed on under-frequency (device 81U, load shedding): below ${formatNumber(l.shedPU * fr, 2)} Hz for ${l.shedDelayS} s (${formatNumber(l.pPU * m.baseKVA, 0)} kW)`;
            this.logs.push({ atS: t, text: line });
            this.trips.push({ atS: t, id: l.id, kind: 'load', device: '81U', text: line });
            operated = true;
          }
        } else l.shedTimer = 0;
      }
    }
    return operated;
  }

  /** Throws `Diverged` when the state or the bus voltage is no longer finite (after a step: at the new time). */
  private checkFinite(): void {
    const t = this.k * this.stepS;
    const m = this.m;
    const y = this.y;
    for (let i = 0; i < m.n; i++) {
      const w = y[i * STATES_PER_SET + OMEGA]!;
      if (!(Math.abs(w) < 5) || !Number.isFinite(y[i * STATES_PER_SET + EFD]!)) {
        throw new Diverged(
          `The simulation diverged at t = ${formatNumber(t, 3)} s (set ${m.ids[i]} speed ${formatNumber(w * m.ratedFrequencyHz, 1)} Hz). Try a smaller step (stepMs, now ${formatNumber(this.stepS * 1000, 2)} ms) or check the machine data.`,
        );
      }
    }
    if (!Number.isFinite(this.out.bus.re) || !Number.isFinite(this.out.bus.im)) {
      throw new Diverged(`The bus voltage could not be solved at t = ${formatNumber(t, 3)} s: the load is more than the on-line sets can carry.`);
    }
  }

  private step(): void {
    this.applyDue();
    this.evaluateNow();
    this.observe(false);
    if (this.protect()) this.evaluateNow();
    rk4StepFromK1(this.rhs, this.out, this.y, this.rk);
    this.k++;
    this.checkFinite();
  }

  advance(seconds: number): void {
    if (!(seconds >= 0)) throw new InvalidInput('advance: seconds must be 0 or more.');
    // Re-anchor only when stepped past the target by other means (`steps`), not by rounding.
    if (this.targetS < this.timeS - 0.5 * this.stepS) this.targetS = this.timeS;
    this.targetS += seconds;
    const target = Math.round(this.targetS / this.stepS);
    while (this.k < target) this.step();
  }

  /** Runs `count` steps (for chunked runs). */
  steps(count: number): void {
    for (let j = 0; j < count; j++) this.step();
  }

  get stepCount(): number {
    return this.k;
  }

  applyEvent(event: ScenarioEvent): void {
    const t = this.k * this.stepS;
    this.evaluateNow();
    this.markDisturbance(t);
    applyEvent(this.target, event, t);
  }

  snapshot(): SimulationSnapshot {
    const t = this.k * this.stepS;
    this.evaluateNow();
    const m = this.m;
    const out = this.out;
    const busAngle = Math.atan2(out.bus.im, out.bus.re);
    const dead = !out.anyOnline;
    const sets: SetSnapshot[] = [];
    for (let i = 0; i < m.n; i++) {
      const o = i * STATES_PER_SET;
      const sk = m.ratedKVA[i]!;
      sets.push({
        id: m.ids[i]!,
        online: m.online[i] === 1,
        shutdown: m.shutdown[i] === 1,
        speedHz: this.y[o + OMEGA]! * m.ratedFrequencyHz,
        phaseAngleDeg: dead ? null : wrapDeg(Math.atan2(out.vtIm[i]!, out.vtRe[i]!) - busAngle),
        rotorAngleDeg: dead ? null : wrapDeg(this.y[o + DELTA]! - busAngle),
        kW: out.pOwn[i]! * sk,
        kVAR: out.qOwn[i]! * sk,
        mechanicalKW: this.y[o + PMECH]! * sk,
        currentA: Math.hypot(out.iRe[i]!, out.iIm[i]!) * this.currentScaleA,
        terminalV: out.vt[i]! * m.ratedVoltageV,
        fieldPU: this.y[o + EFD]!,
      });
    }
    return {
      timeS: t,
      frequencyHz: this.frequencyHz(),
      voltageV: this.voltageV(),
      deadBus: dead,
      loadKW: out.loadP * m.baseKVA,
      loadKVAR: out.loadQ * m.baseKVA,
      sets,
    };
  }

  result(): SimulationResult {
    this.applyDue();
    this.evaluateNow();
    this.observe(true);
    const m = this.m;
    const out = this.out;
    const rec = this.recorder;
    let droopPct = 0;
    for (let i = 0; i < m.n; i++) if (m.online[i] && m.govMode[i] === GOV_DROOP) droopPct = Math.max(droopPct, m.droop[i]! * 100);
    const warnings = [...this.warnings];
    if (out.unconverged > 0)
      warnings.push(`The bus solve did not fully converge in ${out.unconverged} evaluation(s): treat the voltages around those instants with care.`);
    if (!out.anyOnline) warnings.push('No set is on line at the end of the run: the bus is dead.');
    if (this.lowVEpisodes > 0) {
      const still = this.lowVStartS !== null ? ` Load is still not served at the end of the run (since t = ${formatNumber(this.lowVStartS, 2)} s).` : '';
      warnings.push(
        `Load was not served for ${formatNumber(this.lowVTotalS, 2)} s in all (bus dead, or below ${formatNumber(this.m.breakPU * 100, 0)} % voltage where constant-power and constant-current loads draw as constant impedance): up to ${formatNumber(this.maxUnservedKW, 0)} kW, ${formatNumber(this.unservedKWs / 3600, 2)} kWh in all.${still}`,
      );
    }
    const metrics = computeMetrics({
      ratedFrequencyHz: m.ratedFrequencyHz,
      ratedVoltageV: m.ratedVoltageV,
      disturbanceS: this.disturbanceS ?? 0,
      initialFrequencyHz: this.initialF,
      initialVoltageV: this.initialV,
      nadirHz: this.nadir,
      peakHz: this.peak,
      minVoltageV: this.vMin,
      maxVoltageV: this.vMax,
      frequency: { t: rec.traceT.data, x: rec.traceF.data, length: rec.traceT.length },
      voltage: { t: rec.traceT.data, x: rec.traceV.data, length: rec.traceT.length },
      finalSets: m.ids.map((id, i) => ({ id, online: m.online[i] === 1, kW: out.pOwn[i]! * m.ratedKVA[i]!, kVAR: out.qOwn[i]! * m.ratedKVA[i]! })),
      droopPct,
      unservedKWh: this.unservedKWs / 3600,
      maxUnservedKW: this.maxUnservedKW,
      closes: this.closes,
      trips: this.trips,
      target: steadyTarget(m, this.scenario.plant),
    });
    return { metrics, series: rec.series(), log: [...this.logs], warnings, steps: this.k };
  }
}

/** A chunkable simulation (what `simulate` and the handler drive). */
export interface SteppedSimulation extends Simulation {
  /** Runs `count` integration steps. */
  steps(count: number): void;
  /** Steps taken so far. */
  readonly stepCount: number;
}

/**
 * Starts a simulation of `scenario` at rest (the on-line plant at its steady state,
 * from `solveSharing`). The scenario is copied where it matters; it is never mutated.
 * @throws InvalidInput for a step out of range or unknown set ids.
 * @param atRest `solveSharing(scenario.plant)` when the caller already has it (many runs of one
 *   plant, e.g. a time-domain closing map); it must be the solution of this very plant.
 * @throws NoSteadyState when the on-line plant has no operating point to start from.
 */
export function createSimulation(scenario: Scenario, atRest?: SharingResult): SteppedSimulation {
  return new Run(scenario, atRest);
}
