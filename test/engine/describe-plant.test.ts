import { describe, it, expect } from 'vitest';
import { describePlant } from '../../electron/engine';
import { ratedCurrentA, ratedSpeedRpm, kVARBase } from '../../shared-types';
import { expectClose } from '../helpers/expect-close';
import { demoPlant, makePlant, rawSet } from '../helpers/plants';

describe('ratedSpeedRpm', () => {
  // REFERENCES §3: N = 120 f / P (common practice; 8-pole/50 Hz/750 rpm is a textbook example).
  it.each([
    [50, 4, 1500],
    [50, 6, 1000],
    [50, 8, 750],
    [60, 4, 1800],
    [60, 8, 900],
  ])('%d Hz, %d poles gives %d rpm', (f, poles, rpm) => {
    expectClose(ratedSpeedRpm(f, poles), rpm, {}, 'speed');
  });
});

describe('ratedCurrentA', () => {
  it('1000 kVA at 480 V is 1202.8 A (REFERENCES §3, circulating-current example I_base)', () => {
    expectClose(ratedCurrentA(1000, 480), 1202.8, { abs: 0.05 }, 'current');
  });
  it('1250 kVA at 400 V is 1804.2 A (closed form S / (√3 V))', () => {
    expectClose(ratedCurrentA(1250, 400), 1250e3 / Math.sqrt(3) / 400, {}, 'current');
  });
});

describe('kVARBase', () => {
  it('is 0.6 of kVA at 0.8 PF (closed form sqrt(1 − 0.8²) = 0.6)', () => {
    expectClose(kVARBase(1250, 0.8), 750, { rel: 1e-12 }, 'Qbase');
  });
});

describe('describePlant', () => {
  it('totals online and installed ratings and the connected load', () => {
    const plant = makePlant(
      [rawSet('A', { ratedKVA: 1000, ratedKW: 800 }), rawSet('B', { ratedKVA: 500, ratedKW: 400, online: false, poles: 6 })],
      [
        { id: 'L', kW: 300, kVAR: 100 },
        { id: 'M', kW: 50, kVAR: 20, online: false },
      ],
    );
    const d = describePlant(plant);
    expect(d.onlineKW).toBe(800);
    expect(d.onlineKVA).toBe(1000);
    expect(d.installedKW).toBe(1200);
    expect(d.installedKVA).toBe(1500);
    expect(d.loadKW).toBe(300);
    expect(d.loadKVAR).toBe(100);
    expect(d.sets[1]!.ratedSpeedRpm).toBe(1000);
  });

  it('does not mutate the plant it reads', () => {
    const plant = demoPlant();
    const before = JSON.stringify(plant);
    describePlant(plant);
    expect(JSON.stringify(plant)).toBe(before);
  });
});
