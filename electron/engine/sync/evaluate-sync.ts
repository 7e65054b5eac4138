/**
 * The sync-check verdict for a case: slip, slip period, voltage difference (% and phasor), advance angle,
 * window timing, when to issue the close command, whether closing is permitted now and every reason it is
 * not, and the surge if the breaker is told to close now.
 */
import type { BusEquivalent, SyncCase, SyncResult } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { busEquivalent } from './bus-equivalent';
import { closingSurge, noSurge, surgeCircuit } from './closing-surge';
import { sideState, syncCheck } from './permissives';
import { phasorDifference, wrapAngleDeg } from './phasor';
import { listSyncPresets } from './presets';
import { advanceAngleDeg, angleAtContactDeg, closeCommandAngleDeg, slipPeriodS, timeToAngleS, windowOpenS, windowTiming } from './slip-timing';
import { syncBasis } from './sync-basis';
import { formatAngleDeg } from '../../../shared-types';

/** Where the limits came from, in words: the preset's standard and clause, or user-defined (edited from a preset). */
function limitsSource(c: SyncCase): string {
  const preset = c.presetId === undefined ? undefined : listSyncPresets().find((p) => p.id === c.presetId);
  if (!preset) return 'User-defined limits';
  const a = preset.limits;
  const b = c.limits;
  const same =
    a.slipHz === b.slipHz &&
    a.angleDeg === b.angleDeg &&
    a.voltagePct === b.voltagePct &&
    !!a.incomingFaster === !!b.incomingFaster &&
    !!a.incomingHigher === !!b.incomingHigher;
  return same ? preset.source : `User-defined limits (edited from ${preset.label})`;
}

/**
 * Evaluates a sync-check case. Pure: `c` is not touched.
 * @throws InvalidInput for an unknown `incomingSetId`, a plant with no running set besides the incoming one,
 * no base voltage, or a live side at 0 Hz.
 */
export function evaluateSync(c: SyncCase): SyncResult {
  const basis = syncBasis(c);
  const dead = c.dead;
  const busPct = (c.bus.voltageV / basis.voltageV) * 100;
  const incomingPct = (c.incoming.voltageV / basis.voltageV) * 100;
  const busState = sideState(busPct, dead);
  const bothLive = busState === 'live' && sideState(incomingPct, dead) === 'live';
  // A bus that is not live has no running source: no equivalent to build (a plant may have no set online).
  const bus: BusEquivalent = busState === 'live' ? busEquivalent(c, basis) : { from: 'none', rPU: 0, xPU: 0, shortCircuitKVA: null, setIds: [] };
  const circuit = surgeCircuit(c, basis, bus);
  if (bothLive && !(c.bus.frequencyHz > 0)) throw new InvalidInput('bus.frequencyHz: must be greater than 0 when the bus is live.');
  if (bothLive && !(c.incoming.frequencyHz > 0)) throw new InvalidInput('incoming.frequencyHz: must be greater than 0 when the incoming set is live.');

  // On a dead side frequency and angle mean nothing: report zero slip rather than a meaningless number.
  // Rounded to 1 nHz so that 60.1 − 60 reads 0.1, not 0.10000000000000142 (far below any meter's resolution).
  const slipHz = bothLive ? Math.round((c.incoming.frequencyHz - c.bus.frequencyHz) * 1e9) / 1e9 : 0;
  const angleNowDeg = wrapAngleDeg(c.incoming.angleDeg - (c.bus.angleDeg ?? 0));
  const voltageDifferenceV = c.incoming.voltageV - c.bus.voltageV;
  const voltageDifferencePct = (voltageDifferenceV / basis.voltageV) * 100;
  const phasor = phasorDifference(circuit.busVoltagePU, circuit.incomingVoltagePU, angleNowDeg);
  const L = c.limits;

  const outcome = syncCheck({ slipHz, angleDeg: angleNowDeg, voltageDifferencePct, busPct, incomingPct, limits: L, dead });
  const timing = windowTiming(angleNowDeg, L.angleDeg, slipHz);
  const cmdAngle = closeCommandAngleDeg(slipHz, c.breakerClosingMs);
  const contact = angleAtContactDeg(angleNowDeg, slipHz, c.breakerClosingMs);
  const advance = advanceAngleDeg(slipHz, c.breakerClosingMs);

  const warnings: string[] = [];
  if (bothLive) {
    if (outcome.permissive && Math.abs(contact) > L.angleDeg) {
      warnings.push(
        `Closed now, the contacts touch at ${formatAngleDeg(contact)} (the set gains ${formatAngleDeg(advance)} during the ${c.breakerClosingMs} ms closing time), outside the ±${L.angleDeg}° window.`,
      );
    }
    if (advance > L.angleDeg) {
      warnings.push(
        `At this slip the advance angle (${formatAngleDeg(advance)}) is larger than the ±${L.angleDeg}° window: no close the sync-check permits can land at 0°.`,
      );
    }
    if (slipHz === 0 && angleNowDeg !== 0) warnings.push('Zero slip: the phase angle stands still and will not come round to 0° by itself.');
  }
  if (bus.from === 'infinite' && bothLive) {
    warnings.push('No bus source given: the bus is taken as infinite (stiff), which gives the largest surge.');
  }

  return {
    slipHz,
    slipPeriodS: slipPeriodS(slipHz),
    advanceAngleDeg: advance,
    closeCommandAngleDeg: cmdAngle,
    windowOpenS: windowOpenS(L.angleDeg, slipHz),
    voltageDifferencePct,
    voltageDifferenceV,
    deltaVPU: phasor.magnitude,
    deltaVAngleDeg: phasor.angleDeg,
    angleNowDeg,
    windowOpenNow: timing.openNow,
    windowOpensInS: timing.opensInS,
    windowClosesInS: timing.closesInS,
    closeCommandInS: bothLive ? timeToAngleS(angleNowDeg, cmdAngle, slipHz) : null,
    permissive: outcome.permissive,
    reasons: outcome.reasons,
    checks: outcome.checks,
    warnings,
    closeNow: bothLive ? closingSurge(circuit, contact) : noSurge(circuit, contact),
    ...(outcome.deadBusClose ? { deadBusClose: true } : {}),
    ...(outcome.deadLineClose ? { deadLineClose: true } : {}),
    limits: { ...L },
    limitsSource: limitsSource(c),
    bus: { frequencyHz: c.bus.frequencyHz, voltageV: c.bus.voltageV, from: c.busFrom ?? 'given in the case' },
    busEquivalent: bus,
    base: {
      voltageV: basis.voltageV,
      currentA: basis.currentA,
      torqueKNm: basis.torqueKNm,
      ratedFrequencyHz: basis.ratedFrequencyHz,
      ratedSpeedRpm: basis.ratedSpeedRpm,
    },
  };
}
