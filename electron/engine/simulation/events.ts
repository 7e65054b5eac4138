/**
 * Scenario events applied to a running simulation: load steps, trips, breaker closes,
 * setpoint changes, ramps and motor starts. Each changes the simulator's own model or
 * state at a step boundary, never the caller's data, and writes a line to the log.
 */
import type { CloseRecord, ScenarioEvent } from '../../../shared-types';
import { syncCheck } from '../sync/permissives';
import { syncPreset } from '../sync/presets';
import { InvalidInput } from '../errors';
import { DELTA, ED2, EQ2, GOV_INT, OMEGA, STATES_PER_SET } from './layout';
import { GOV_BASE, GOV_DROOP, REG_DROOP } from '../mode-codes';
import { initialiseOffline } from './initialise';
import { plainLoadSlot } from './sim-model';
import type { LoadSlot, Outputs, SimModel } from './sim-types';
import { formatNumber } from '../../../shared-types';

/** What an event may touch. */
export interface EventTarget {
  m: SimModel;
  y: Float64Array;
  out: Outputs;
  log(atS: number, text: string): void;
  /** Schedules an internal follow-up (the end of a motor start). */
  later(atS: number, run: () => void): void;
  /** Adds a sentence to the run's warnings. */
  warn(text: string): void;
  /** Records a breaker close onto a live bus (for the metrics). */
  closed(record: CloseRecord): void;
}

/**
 * A motor's locked-rotor kVA over its running kVA: 6 (direct-on-line induction motors draw
 * 5–7 × their running current at start; common practice, value from memory). Used for the
 * running load a motor start leaves when the event gives none.
 */
export const MOTOR_LOCKED_ROTOR_RATIO = 6;
/** Running power factor of an induction motor near full load: 0.85 (common practice, value from memory). */
export const MOTOR_RUNNING_PF = 0.85;

/**
 * The sync-check window a close in a run is judged against: the common-practice settings
 * between generating sets (the sync engine's preset; no standard behind it).
 */
export const RUN_SYNC_PRESET_ID = 'practice-generating-sets';

function setIndex(m: SimModel, id: string, what: string): number {
  const i = m.ids.indexOf(id);
  if (i < 0) throw new InvalidInput(`${what}: there is no set "${id}" in the plant.`);
  return i;
}

function fmt(v: number, digits: number): string {
  return formatNumber(v, digits);
}

/**
 * Applies `ev` at time `t`.
 * @throws InvalidInput for an unknown set or load id, or a load step without a load.
 */
export function applyEvent(target: EventTarget, ev: ScenarioEvent, t: number): void {
  const { m, y, out } = target;
  const vr = m.ratedVoltageV;
  const fr = m.ratedFrequencyHz;
  switch (ev.type) {
    case 'load-step': {
      if (ev.loadId !== undefined) {
        const l = m.loads.find((x) => x.id === ev.loadId);
        if (!l) throw new InvalidInput(`load-step: there is no load "${ev.loadId}" in the plant.`);
        l.on = ev.online ?? !l.on;
        target.log(t, `load ${l.id} ${l.on ? 'switched on' : 'switched off'}`);
        return;
      }
      if (ev.kW === undefined && ev.kVAR === undefined) throw new InvalidInput('load-step: give loadId, or kW and kVAR.');
      m.loads.push(plainLoadSlot(`step@${fmt(t, 3)}s`, ev.kW ?? 0, ev.kVAR ?? 0, m.baseKVA, ev.model ?? 'constant-power'));
      target.log(t, `load step ${fmt(ev.kW ?? 0, 0)} kW, ${fmt(ev.kVAR ?? 0, 0)} kVAR (${ev.model ?? 'constant-power'})`);
      return;
    }
    case 'trip': {
      const i = setIndex(m, ev.setId, 'trip');
      const shutdown = ev.shutdown ?? true;
      const open = ev.openBreaker ?? true;
      if (!open && !shutdown) throw new InvalidInput('trip: with openBreaker false the engine must shut down (shutdown true), or nothing trips.');
      if (open) m.online[i] = 0;
      if (shutdown) m.shutdown[i] = 1;
      target.log(
        t,
        !open ? `${ev.setId} engine shut down, breaker still closed` : `${ev.setId} tripped${shutdown ? ' and shut down' : ' (breaker open, set running)'}`,
      );
      return;
    }
    case 'close': {
      const i = setIndex(m, ev.setId, 'close');
      if (m.online[i]) {
        target.log(t, `close ${ev.setId}: breaker already closed, nothing done`);
        return;
      }
      if (m.shutdown[i]) throw new InvalidInput(`close: set "${ev.setId}" is shut down and cannot be closed onto the bus.`);
      const o = i * STATES_PER_SET;
      if (ev.voltageV !== undefined || ev.frequencyHz !== undefined) {
        const speed = ev.frequencyHz !== undefined ? ev.frequencyHz / fr : y[o + OMEGA]!;
        const v = ev.voltageV !== undefined ? ev.voltageV / vr : Math.hypot(y[o + ED2]!, y[o + EQ2]!);
        if (m.govMode[i] === GOV_DROOP) m.noLoadPU[i] = speed;
        else m.setpointPU[i] = speed;
        if (m.regMode[i] === REG_DROOP) m.noLoadVPU[i] = v;
        else m.setpointVPU[i] = v;
        const angle = y[o + DELTA]!;
        initialiseOffline(m, i, y, false, angle);
        y[o + OMEGA] = speed;
      }
      const busAngle = out.anyOnline ? Math.atan2(out.bus.im, out.bus.re) : 0;
      if (ev.angleDeg !== undefined) {
        // Off line, E'' lies along the rotor's q-axis: its angle is δ.
        y[o + DELTA] = busAngle + (ev.angleDeg * Math.PI) / 180;
      }
      const rel = (((y[o + DELTA]! - busAngle) * 180) / Math.PI) % 360;
      const relDeg = rel > 180 ? rel - 360 : rel < -180 ? rel + 360 : rel;
      if (out.anyOnline) {
        // Off line the terminal voltage is E''; the bus voltage is the last bus solve.
        const vIn = Math.hypot(y[o + ED2]!, y[o + EQ2]!);
        const vBus = Math.hypot(out.bus.re, out.bus.im);
        const slipHz = (y[o + OMEGA]! - out.omegaBus) * fr;
        const dvPct = (vIn - vBus) * 100;
        const preset = syncPreset(RUN_SYNC_PRESET_ID);
        const check = syncCheck({ slipHz, angleDeg: relDeg, voltageDifferencePct: dvPct, busPct: vBus * 100, incomingPct: vIn * 100, limits: preset.limits });
        const given = ev.angleDeg !== undefined || ev.frequencyHz !== undefined || ev.voltageV !== undefined;
        target.closed({
          setId: ev.setId,
          atS: t,
          angleDeg: relDeg,
          slipHz,
          voltageDifferencePct: dvPct,
          insideWindow: check.permissive,
          reasons: check.reasons,
          stateGiven: given,
        });
        const contact = `angle ${fmt(relDeg, 1)}°, slip ${fmt(slipHz, 3)} Hz, ΔV ${fmt(dvPct, 1)} % of rated at contact`;
        if (!given) target.warn(`${ev.setId} closed at t = ${fmt(t, 3)} s as the run had it (no angle, slip or voltage given): ${contact}.`);
        if (!check.permissive) {
          target.warn(
            `${ev.setId} closed outside the sync-check window (${preset.label}: ±${preset.limits.angleDeg}°, ±${preset.limits.slipHz} Hz, ±${preset.limits.voltagePct} %) at t = ${fmt(t, 3)} s — ${check.reasons.join(' ')}`,
          );
        }
      }
      m.online[i] = 1;
      target.log(
        t,
        out.anyOnline
          ? `${ev.setId} breaker closed at ${fmt(relDeg, 1)}° (slip ${fmt((y[o + OMEGA]! - out.omegaBus) * fr, 3)} Hz)`
          : `${ev.setId} breaker closed onto a dead bus`,
      );
      return;
    }
    case 'setpoint': {
      const i = setIndex(m, ev.setId, 'setpoint');
      const parts: string[] = [];
      if (ev.frequencyHz !== undefined) {
        if (m.govMode[i] === GOV_DROOP) m.noLoadPU[i] = ev.frequencyHz / fr;
        else m.setpointPU[i] = ev.frequencyHz / fr;
        parts.push(`${m.govMode[i] === GOV_DROOP ? 'no-load' : 'speed'} setpoint ${fmt(ev.frequencyHz, 3)} Hz`);
      }
      if (ev.voltageV !== undefined) {
        if (m.regMode[i] === REG_DROOP) m.noLoadVPU[i] = ev.voltageV / vr;
        else m.setpointVPU[i] = ev.voltageV / vr;
        parts.push(`${m.regMode[i] === REG_DROOP ? 'no-load' : 'voltage'} setpoint ${fmt(ev.voltageV, 1)} V`);
      }
      if (ev.kW !== undefined) {
        m.basePU[i] = ev.kW / (m.kwPU[i]! * m.ratedKVA[i]!);
        m.rampT0[i] = Infinity;
        m.rampT1[i] = Infinity;
        parts.push(`base load ${fmt(ev.kW, 0)} kW`);
      }
      target.log(t, `${ev.setId}: ${parts.join(', ') || 'no change'}`);
      return;
    }
    case 'ramp': {
      const i = setIndex(m, ev.setId, 'ramp');
      const o = i * STATES_PER_SET;
      const ratedKW = m.kwPU[i]! * m.ratedKVA[i]!;
      const from = out.pOwn[i]! / m.kwPU[i]!;
      // Change to load control; the reference starts at the present output, so the
      // actuator and engine lags carry on without a bump.
      if (m.govMode[i] !== GOV_BASE) {
        m.govMode[i] = GOV_BASE;
        y[o + GOV_INT] = 0;
      }
      m.rampFrom[i] = from;
      m.rampTo[i] = ev.toKW / ratedKW;
      m.rampT0[i] = t;
      m.rampT1[i] = t + Math.max(ev.durationS, 1e-9);
      m.basePU[i] = ev.toKW / ratedKW;
      target.log(t, `${ev.setId} ramps from ${fmt(from * ratedKW, 0)} kW to ${fmt(ev.toKW, 0)} kW over ${fmt(ev.durationS, 1)} s (load control)`);
      return;
    }
    case 'motor-start': {
      const sin = Math.sqrt(Math.max(0, 1 - ev.pf * ev.pf));
      const slot: LoadSlot = plainLoadSlot(`motor@${fmt(t, 3)}s`, ev.kVA * ev.pf, ev.kVA * sin, m.baseKVA, 'constant-impedance');
      m.loads.push(slot);
      target.log(t, `motor start: locked rotor ${fmt(ev.kVA, 0)} kVA at pf ${fmt(ev.pf, 2)} for ${fmt(ev.durationS, 2)} s`);
      // Default running load: the locked-rotor kVA over the typical ratio, at the typical running power factor.
      const runKVA = ev.kVA / MOTOR_LOCKED_ROTOR_RATIO;
      const defaulted = ev.runningKW === undefined && ev.runningKVAR === undefined;
      const runKW = ev.runningKW ?? (ev.runningKVAR === undefined ? runKVA * MOTOR_RUNNING_PF : 0);
      const runKVAR = ev.runningKVAR ?? (ev.runningKW === undefined ? runKVA * Math.sqrt(1 - MOTOR_RUNNING_PF * MOTOR_RUNNING_PF) : 0);
      target.later(t + ev.durationS, () => {
        slot.on = false;
        if (runKW !== 0 || runKVAR !== 0) {
          m.loads.push(plainLoadSlot(`${slot.id}-running`, runKW, runKVAR, m.baseKVA, 'constant-power'));
        }
        const how = defaulted ? ` (not given: locked-rotor ${fmt(ev.kVA, 0)} kVA / ${MOTOR_LOCKED_ROTOR_RATIO} at ${MOTOR_RUNNING_PF} power factor)` : '';
        target.log(t + ev.durationS, `motor up to speed: running load ${fmt(runKW, 0)} kW, ${fmt(runKVAR, 0)} kVAR${how}`);
      });
      return;
    }
  }
}
