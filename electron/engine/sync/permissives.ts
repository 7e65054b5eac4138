/**
 * The sync-check (device 25, IEEE C37.2) decision: which side is live or dead, and — with both live — slip,
 * phase angle and voltage difference against the limits, plus the "incoming faster" and "incoming higher"
 * options. Every failed check becomes a reason, in words.
 */
import type { DeadPermissives, SyncCheck, SyncLimits } from '../../../shared-types';
import { formatNumber, formatSigned } from '../../../shared-types';

/**
 * Dead-bus / dead-line defaults: neither permitted; live above 80 %, dead below 25 % of the base voltage.
 * The thresholds are common practice for sync-check relays, not a standard's values.
 */
export const DEFAULT_DEAD_PERMISSIVES: Readonly<DeadPermissives> = Object.freeze({ deadBus: false, deadLine: false, livePct: 80, deadPct: 25 });

/** What the sync-check sees at one instant. */
export interface SyncCheckInput {
  slipHz: number;
  /** Phase angle of the incoming relative to the bus, degrees, wrapped to ±180°. */
  angleDeg: number;
  /** (V_incoming − V_bus) / V_base × 100. */
  voltageDifferencePct: number;
  /** Bus and incoming voltage, % of the base voltage. */
  busPct: number;
  incomingPct: number;
  limits: SyncLimits;
  dead?: DeadPermissives;
}

/** The decision. */
export interface SyncCheckOutcome {
  permissive: boolean;
  checks: SyncCheck[];
  /** Messages of the failed checks, in the order checked. */
  reasons: string[];
  deadBusClose: boolean;
  deadLineClose: boolean;
}

/** Signed number with fixed decimals ("+0.25", "−3.0"); never NaN in a message (the shared signed format). */
const signed = (v: number, decimals: number): string => formatSigned(v, decimals);

/** A side's state by its voltage: live at or above `livePct`, dead at or below `deadPct`, else between. */
export type SideState = 'live' | 'dead' | 'between';

/** The state of a side at `pct` % of the base voltage. */
export function sideState(pct: number, d: DeadPermissives = DEFAULT_DEAD_PERMISSIVES): SideState {
  if (pct >= d.livePct) return 'live';
  if (pct <= d.deadPct) return 'dead';
  return 'between';
}

function na(id: SyncCheck['id'], unit: string, message: string): SyncCheck {
  return { id, ok: null, value: null, limit: null, unit, message };
}

/** Slip, angle, voltage and the two options, for two live sides. */
function liveChecks(x: SyncCheckInput): SyncCheck[] {
  const L = x.limits;
  const slipOk = Math.abs(x.slipHz) <= L.slipHz;
  const angleOk = Math.abs(x.angleDeg) <= L.angleDeg;
  const voltOk = Math.abs(x.voltageDifferencePct) <= L.voltagePct;
  const checks: SyncCheck[] = [
    {
      id: 'slip',
      ok: slipOk,
      value: x.slipHz,
      limit: L.slipHz,
      unit: 'Hz',
      message: slipOk ? `Slip ${signed(x.slipHz, 3)} Hz is within ±${L.slipHz} Hz.` : `Slip ${signed(x.slipHz, 3)} Hz is beyond the ±${L.slipHz} Hz limit.`,
    },
    {
      id: 'angle',
      ok: angleOk,
      value: x.angleDeg,
      limit: L.angleDeg,
      unit: '°',
      message: angleOk
        ? `Phase angle ${signed(x.angleDeg, 1)}° is inside the ±${L.angleDeg}° window.`
        : `Phase angle ${signed(x.angleDeg, 1)}° is outside the ±${L.angleDeg}° window.`,
    },
    {
      id: 'voltage',
      ok: voltOk,
      value: x.voltageDifferencePct,
      limit: L.voltagePct,
      unit: '%',
      message: voltOk
        ? `Voltage difference ${signed(x.voltageDifferencePct, 2)} % is within ±${L.voltagePct} %.`
        : `Voltage difference ${signed(x.voltageDifferencePct, 2)} % is beyond the ±${L.voltagePct} % limit.`,
    },
  ];
  if (L.incomingFaster) {
    const ok = x.slipHz > 0;
    checks.push({
      id: 'incoming-faster',
      ok,
      value: x.slipHz,
      limit: 0,
      unit: 'Hz',
      message: ok
        ? 'The incoming set runs faster than the bus, as required.'
        : `The incoming set must run faster than the bus, but the slip is ${signed(x.slipHz, 3)} Hz.`,
    });
  }
  if (L.incomingHigher) {
    const ok = x.voltageDifferencePct >= 0;
    checks.push({
      id: 'incoming-higher',
      ok,
      value: x.voltageDifferencePct,
      limit: 0,
      unit: '%',
      message: ok
        ? 'The incoming voltage is at or above the bus, as required.'
        : `The incoming voltage must be at or above the bus, but it is ${signed(x.voltageDifferencePct, 2)} %.`,
    });
  }
  return checks;
}

/**
 * Decides whether closing is permitted now and gives every reason it is not. Both sides live: slip, angle,
 * voltage and the options apply. Bus dead, incoming live: only the dead-bus permissive. Bus live, incoming
 * dead: only the dead-line permissive. Both dead, or a side between the dead and live thresholds: no close.
 */
export function syncCheck(x: SyncCheckInput): SyncCheckOutcome {
  const d = x.dead ?? DEFAULT_DEAD_PERMISSIVES;
  const bus = sideState(x.busPct, d);
  const inc = sideState(x.incomingPct, d);
  const checks: SyncCheck[] = [];
  let deadBusClose = false;
  let deadLineClose = false;
  const notNeeded = 'Not checked: one side is dead.';
  if (bus === 'live' && inc === 'live') {
    checks.push(...liveChecks(x));
  } else {
    checks.push(na('slip', 'Hz', notNeeded), na('angle', '°', notNeeded), na('voltage', '%', notNeeded));
    const busTxt = `${formatNumber(x.busPct, 1)} %`;
    const incTxt = `${formatNumber(x.incomingPct, 1)} %`;
    if (bus === 'between' || inc === 'between') {
      const which = bus === 'between' ? `The bus voltage (${busTxt} of base)` : `The incoming voltage (${incTxt} of base)`;
      checks.push({
        id: 'live-state',
        ok: false,
        value: bus === 'between' ? x.busPct : x.incomingPct,
        limit: d.livePct,
        unit: '%',
        message: `${which} is between the dead (${d.deadPct} %) and live (${d.livePct} %) thresholds: neither live nor dead, so no close is permitted.`,
      });
    } else if (bus === 'dead' && inc === 'dead') {
      checks.push({
        id: 'live-state',
        ok: false,
        value: x.busPct,
        limit: d.livePct,
        unit: '%',
        message: `Both the bus (${busTxt}) and the incoming set (${incTxt}) are dead: one side must be live to close.`,
      });
    } else if (bus === 'dead') {
      deadBusClose = d.deadBus;
      checks.push({
        id: 'dead-bus',
        ok: d.deadBus,
        value: x.busPct,
        limit: d.deadPct,
        unit: '%',
        message: d.deadBus
          ? `The bus is dead (${busTxt}) and the incoming set live: closing onto the dead bus is permitted.`
          : `The bus is dead (${busTxt}) and dead-bus closing is not enabled.`,
      });
    } else {
      deadLineClose = d.deadLine;
      checks.push({
        id: 'dead-line',
        ok: d.deadLine,
        value: x.incomingPct,
        limit: d.deadPct,
        unit: '%',
        message: d.deadLine
          ? `The incoming side is dead (${incTxt}) and the bus live: closing the dead side onto the bus is permitted.`
          : `The incoming side is dead (${incTxt}) and dead-line closing is not enabled.`,
      });
    }
  }
  const failed = checks.filter((c) => c.ok === false);
  return { permissive: failed.length === 0, checks, reasons: failed.map((c) => c.message), deadBusClose, deadLineClose };
}
