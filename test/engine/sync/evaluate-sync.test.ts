import { describe, it, expect } from 'vitest';
import { evaluateSync } from '../../../electron/engine';
import type { SyncCase } from '../../../shared-types';
import { demoPlant } from '../../helpers/plants';
import { expectClose } from '../../helpers/expect-close';

/** A 1000 kVA 480 V set coming onto a bus of the same size (a closed-form pair: I_base = S / (√3 V) = 1202.8 A). */
function baseCase(over: Partial<SyncCase> = {}, inc: Partial<SyncCase['incoming']> = {}): SyncCase {
  return {
    format: 'droopline.sync',
    version: 1,
    bus: { frequencyHz: 60, voltageV: 480 },
    incoming: { frequencyHz: 60.1, voltageV: 480, angleDeg: -10, ratedKVA: 1000, xddpPU: 0.15, rOverX: 0, ...inc },
    busSource: { ratedKVA: 1000, xPU: 0.15 },
    breakerClosingMs: 100,
    limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
    ...over,
  };
}

describe('evaluateSync', () => {
  it('computes slip, period, advance angle and window for 0.1 Hz and 100 ms (closed form)', () => {
    const r = evaluateSync(baseCase());
    expect(r.slipHz).toBe(0.1); // 60.1 − 60 Hz, rounded to 1 nHz (no 0.10000000000000142 in the output)
    expectClose(r.slipPeriodS!, 10, { rel: 1e-9 });
    expectClose(r.advanceAngleDeg, 3.6, { rel: 1e-9 }, '0.1 Hz × 100 ms → 3.6°');
    expectClose(r.closeCommandAngleDeg, -3.6, { rel: 1e-9 });
    expectClose(r.windowOpenS!, 0.556, { abs: 5e-4 }, '±10° at 0.1 Hz → 0.556 s');
  });

  it("is open on the window's edge at −10°, closes after 20/36 s, and times the command at −3.6°", () => {
    const r = evaluateSync(baseCase());
    expect(r.windowOpenNow).toBe(true);
    expect(r.permissive).toBe(true);
    expect(r.reasons).toEqual([]);
    expectClose(r.windowOpensInS!, 0, { abs: 1e-12 });
    expectClose(r.windowClosesInS!, 20 / 36, { rel: 1e-9 });
    expectClose(r.closeCommandInS!, 6.4 / 36, { rel: 1e-9 }, 'from −10° to −3.6° at 36 °/s');
  });

  it('gives the surge where the contacts touch if closed now: −10° + 3.6° = −6.4°', () => {
    const r = evaluateSync(baseCase());
    expectClose(r.closeNow.angleAtContactDeg, -6.4, { abs: 1e-9 });
    expectClose(r.closeNow.surgeCurrentPU, (2 * Math.sin((3.2 * Math.PI) / 180)) / 0.3, { rel: 1e-9 }, '2 sin(θ/2) / X');
    expect(r.closeNow.torqueStepPU).toBeLessThan(0);
  });

  it('reports the voltage difference in %, V and as a phasor (1 % high, in phase)', () => {
    const r = evaluateSync(baseCase({}, { voltageV: 484.8, angleDeg: 0 }));
    expectClose(r.voltageDifferencePct, 1, { rel: 1e-9 });
    expectClose(r.voltageDifferenceV, 4.8, { rel: 1e-9 });
    expectClose(r.deltaVPU, 0.01, { rel: 1e-9 });
    expectClose(r.deltaVAngleDeg, 0, { abs: 1e-9 });
  });

  it('uses the bus phase angle as the reference when given', () => {
    const r = evaluateSync(baseCase({ bus: { frequencyHz: 60, voltageV: 480, angleDeg: 350 } }, { angleDeg: 5 }));
    expectClose(r.angleNowDeg, 15, { abs: 1e-9 });
  });

  it('gives every reason it may not close, and warns when the contacts would land outside the window', () => {
    const r = evaluateSync(baseCase({ limits: { slipHz: 0.05, angleDeg: 10, voltagePct: 5, incomingHigher: true } }, { voltageV: 470, angleDeg: 40 }));
    expect(r.permissive).toBe(false);
    expect(r.reasons).toHaveLength(3);
    expect(r.reasons[0]).toContain('Slip +0.100 Hz is beyond the ±0.05 Hz limit.');
    expect(r.reasons[1]).toContain('Phase angle +40.0° is outside the ±10° window.');
    expect(r.reasons[2]).toContain('The incoming voltage must be at or above the bus');
    const edge = evaluateSync(baseCase({}, { angleDeg: 9 }));
    expect(edge.permissive).toBe(true);
    expect(edge.warnings[0]).toContain('the contacts touch at 12.6°');
  });

  it('warns when the advance angle is wider than the window (0.5 Hz × 100 ms = 18° > 10°)', () => {
    const r = evaluateSync(baseCase({ limits: { slipHz: 1, angleDeg: 10, voltagePct: 5 } }, { frequencyHz: 60.5 }));
    expect(r.warnings.some((w) => w.includes('advance angle (18.0°) is larger than the ±10° window'))).toBe(true);
  });

  it('permits a dead-bus close with no surge when enabled, and names the limits source', () => {
    const dead = { deadBus: true, deadLine: false, livePct: 80, deadPct: 25 };
    const r = evaluateSync(baseCase({ bus: { frequencyHz: 0, voltageV: 0 }, dead, ratedVoltageV: 480 }));
    expect(r.permissive).toBe(true);
    expect(r.deadBusClose).toBe(true);
    expect(r.slipHz).toBe(0);
    expect(r.closeNow.surgeCurrentA).toBe(0);
    expect(r.closeCommandInS).toBeNull();
    expect(r.busEquivalent.from).toBe('none');
    expect(r.limitsSource).toBe('User-defined limits');
    const off = evaluateSync(baseCase({ bus: { frequencyHz: 0, voltageV: 0 }, dead: { ...dead, deadBus: false }, ratedVoltageV: 480 }));
    expect(off.permissive).toBe(false);
    expect(off.reasons).toEqual(['The bus is dead (0.0 %) and dead-bus closing is not enabled.']);
  });

  it("names the preset as the source when the limits are the preset's, and says when they were edited", () => {
    const as = evaluateSync(baseCase({ presetId: 'ieee1547-2018-500-1500', limits: { slipHz: 0.2, voltagePct: 5, angleDeg: 15 } }));
    expect(as.limitsSource).toContain('IEEE Std 1547-2018');
    const edited = evaluateSync(baseCase({ presetId: 'ieee1547-2018-500-1500', limits: { slipHz: 0.1, voltagePct: 5, angleDeg: 15 } }));
    expect(edited.limitsSource).toMatch(/^User-defined limits \(edited from IEEE 1547-2018/);
  });

  it('builds the bus from the demo plant when G3 comes on (G1 and G2 running)', () => {
    const plant = demoPlant();
    const g3 = plant.sets[2]!;
    const r = evaluateSync({
      bus: { frequencyHz: 50, voltageV: 400 },
      incoming: { frequencyHz: 50.1, voltageV: 404, angleDeg: 2, ratedKVA: g3.ratedKVA, xddpPU: g3.machine.xddpPU },
      plant,
      incomingSetId: 'G3',
      breakerClosingMs: 60,
      limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5 },
    });
    expect(r.busEquivalent.setIds).toEqual(['G1', 'G2']);
    expect(r.base.voltageV).toBe(400);
    expectClose(r.base.currentA, 500000 / (Math.sqrt(3) * 400), { rel: 1e-12 }, 'G3 rated current');
    expect(r.base.ratedSpeedRpm).toBe(1500);
    expect(r.permissive).toBe(true);
    expect(Number.isFinite(r.closeNow.peakCurrentA)).toBe(true);
  });

  it('refuses a live bus at 0 Hz by field', () => {
    expect(() => evaluateSync(baseCase({ bus: { frequencyHz: 0, voltageV: 480 } }))).toThrow('bus.frequencyHz: must be greater than 0 when the bus is live.');
  });

  it('never mutates the case and gives finite numbers at zero slip', () => {
    const c = baseCase({}, { frequencyHz: 60 });
    const before = JSON.stringify(c);
    const r = evaluateSync(c);
    expect(JSON.stringify(c)).toBe(before);
    expect(r.slipPeriodS).toBeNull();
    expect(r.windowOpenS).toBeNull();
    expect(r.windowClosesInS).toBeNull();
    expect(JSON.stringify(r)).not.toContain('NaN');
  });
});
