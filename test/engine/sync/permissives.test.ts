import { describe, it, expect } from 'vitest';
import { sideState, syncCheck } from '../../../electron/engine';
import type { SyncCheckInput } from '../../../electron/engine';
import type { DeadPermissives, SyncLimits } from '../../../shared-types';

// Limits of the IEEE 1547-2018 > 500–1 500 kVA band [memory] plus options; permissive thresholds are common practice.
const limits: SyncLimits = { slipHz: 0.2, angleDeg: 15, voltagePct: 5 };
const dead: DeadPermissives = { deadBus: true, deadLine: false, livePct: 80, deadPct: 25 };
const live = { slipHz: 0.1, angleDeg: 5, voltageDifferencePct: 1, busPct: 100, incomingPct: 101, limits };

type Row = [string, Partial<SyncCheckInput>, boolean, string[]];

// Each row: what is set, whether closing is permitted, and the reasons expected (by their words).
const table: Row[] = [
  ['everything inside', {}, true, []],
  ['slip too high', { slipHz: 0.25 }, false, ['Slip +0.250 Hz is beyond the ±0.2 Hz limit.']],
  ['slip too low (negative)', { slipHz: -0.3 }, false, ['Slip −0.300 Hz is beyond the ±0.2 Hz limit.']],
  ['slip exactly at the limit', { slipHz: 0.2 }, true, []],
  ['angle outside', { angleDeg: -16 }, false, ['Phase angle −16.0° is outside the ±15° window.']],
  ['angle on the edge', { angleDeg: 15 }, true, []],
  ['voltage too high', { voltageDifferencePct: 6 }, false, ['Voltage difference +6.00 % is beyond the ±5 % limit.']],
  ['all three out', { slipHz: 0.5, angleDeg: 90, voltageDifferencePct: -8 }, false, ['Slip', 'Phase angle', 'Voltage difference −8.00 %']],
  [
    'faster option, incoming slow',
    { slipHz: -0.05, limits: { ...limits, incomingFaster: true } },
    false,
    ['The incoming set must run faster than the bus, but the slip is −0.050 Hz.'],
  ],
  ['faster option, zero slip', { slipHz: 0, limits: { ...limits, incomingFaster: true } }, false, ['must run faster']],
  ['faster option, incoming fast', { slipHz: 0.05, limits: { ...limits, incomingFaster: true } }, true, []],
  [
    'higher option, incoming low',
    { voltageDifferencePct: -1, limits: { ...limits, incomingHigher: true } },
    false,
    ['The incoming voltage must be at or above the bus, but it is −1.00 %.'],
  ],
  ['higher option, equal voltage', { voltageDifferencePct: 0, limits: { ...limits, incomingHigher: true } }, true, []],
  [
    'faster and higher both fail, slip also out',
    { slipHz: -0.4, voltageDifferencePct: -2, limits: { ...limits, incomingFaster: true, incomingHigher: true } },
    false,
    ['Slip', 'must run faster', 'must be at or above'],
  ],
  ['dead bus, permissive on', { busPct: 3, dead, slipHz: 60, angleDeg: 170 }, true, []],
  ['dead bus, permissive off', { busPct: 3, dead: { ...dead, deadBus: false } }, false, ['The bus is dead (3.0 %) and dead-bus closing is not enabled.']],
  ['dead bus, no permissives given (defaults off)', { busPct: 0 }, false, ['dead-bus closing is not enabled']],
  ['dead incoming, dead-line off', { incomingPct: 10, dead }, false, ['The incoming side is dead (10.0 %) and dead-line closing is not enabled.']],
  ['dead incoming, dead-line on', { incomingPct: 10, dead: { ...dead, deadLine: true } }, true, []],
  ['both dead', { busPct: 0, incomingPct: 0, dead: { ...dead, deadLine: true } }, false, ['Both the bus (0.0 %) and the incoming set (0.0 %) are dead']],
  ['bus between thresholds', { busPct: 50, dead }, false, ['The bus voltage (50.0 % of base) is between the dead (25 %) and live (80 %) thresholds']],
  ['incoming between thresholds', { incomingPct: 60, dead }, false, ['The incoming voltage (60.0 % of base) is between']],
];

describe('syncCheck: permissive logic table', () => {
  it.each(table)('%s', (_what, over, permissive, reasons) => {
    const r = syncCheck({ ...live, ...over });
    expect(r.permissive).toBe(permissive);
    expect(r.reasons).toHaveLength(reasons.length);
    reasons.forEach((text, i) => expect(r.reasons[i]).toContain(text));
  });

  it('lists every check with its value and limit, failed ones matching the reasons', () => {
    const r = syncCheck({ ...live, slipHz: 0.3, limits: { ...limits, incomingFaster: true, incomingHigher: true } });
    expect(r.checks.map((c) => c.id)).toEqual(['slip', 'angle', 'voltage', 'incoming-faster', 'incoming-higher']);
    expect(r.checks[0]).toMatchObject({ ok: false, value: 0.3, limit: 0.2, unit: 'Hz' });
    expect(r.reasons).toEqual(r.checks.filter((c) => c.ok === false).map((c) => c.message));
  });

  it('flags a dead-bus close and marks slip, angle and voltage not applicable', () => {
    const r = syncCheck({ ...live, busPct: 0, dead });
    expect(r.deadBusClose).toBe(true);
    expect(r.deadLineClose).toBe(false);
    expect(r.checks.filter((c) => c.ok === null).map((c) => c.id)).toEqual(['slip', 'angle', 'voltage']);
  });
});

describe('sideState', () => {
  it('is live at or above livePct, dead at or below deadPct, else between (defaults 80 / 25 %, common practice)', () => {
    expect(sideState(80)).toBe('live');
    expect(sideState(79.9)).toBe('between');
    expect(sideState(25)).toBe('dead');
    expect(sideState(40, { deadBus: false, deadLine: false, livePct: 90, deadPct: 40 })).toBe('dead');
  });
});
