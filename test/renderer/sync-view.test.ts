import 'vitest-canvas-mock';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import PhasorScope from '../../renderer/components/sync/PhasorScope.vue';
import SynchronizingView from '../../renderer/views/SynchronizingView.vue';
import { angleOfTip, phasorTip, RIM_FRACTION, sectorPath } from '../../renderer/components/sync/phasor-geometry';
import { usePlantStore } from '../../renderer/stores/plant';
import { DEFAULT_SYNC_SETTINGS, useSyncStore } from '../../renderer/stores/sync';
import { setEngineClient } from '../../renderer/transport';
import { evaluateSync } from '../../electron/engine';
import { directClient } from '../helpers/direct-client';
import { expectClose } from '../helpers/expect-close';
import type { VueWrapper } from '@vue/test-utils';

/** The angle a drawn phasor line makes, counter-clockwise from straight up, degrees. */
function drawnAngle(w: VueWrapper, test: string, size = 320): number {
  const line = w.get(`[data-test="${test}"]`);
  const c = size / 2;
  return angleOfTip(c, c, { x: Number(line.attributes('x2')), y: Number(line.attributes('y2')) });
}

describe('phasor scope geometry', () => {
  it('draws phasor tips at the given angle, counter-clockwise from straight up', () => {
    // Closed form: 90° counter-clockwise from up is left on screen; −90° is right.
    expectClose(phasorTip(100, 100, 50, 90).x, 50, { abs: 1e-12 }, 'x at +90°');
    expectClose(phasorTip(100, 100, 50, -90).x, 150, { abs: 1e-12 }, 'x at −90°');
    expectClose(phasorTip(100, 100, 50, 180).y, 150, { abs: 1e-12 }, 'y at 180°');
    for (const a of [-179, -120, -37.5, 0, 12.25, 90, 180]) expectClose(angleOfTip(100, 100, phasorTip(100, 100, 40, a)), a, { abs: 1e-9 }, `round trip ${a}°`);
  });

  it('draws the incoming three phases 120° apart at the given angle and the bus phase A straight up', () => {
    const w = mount(PhasorScope, { props: { angleDeg: 37.5, windowDeg: 10, commandAngleDeg: -3.6 } });
    expectClose(drawnAngle(w, 'scope-bus-A'), 0, { abs: 1e-9 }, 'bus A');
    expectClose(drawnAngle(w, 'scope-bus-B'), -120, { abs: 1e-9 }, 'bus B');
    expectClose(drawnAngle(w, 'scope-bus-C'), 120, { abs: 1e-9 }, 'bus C');
    expectClose(drawnAngle(w, 'scope-incoming-A'), 37.5, { abs: 1e-9 }, 'incoming A');
    expectClose(drawnAngle(w, 'scope-incoming-B'), 37.5 - 120, { abs: 1e-9 }, 'incoming B');
    expectClose(drawnAngle(w, 'scope-incoming-C'), 37.5 + 120, { abs: 1e-9 }, 'incoming C');
    expect(w.get('[data-test="scope-window"]').attributes('d')).toBe(sectorPath(160, 160, 320 * RIM_FRACTION, 10));
    expect(w.find('[data-test="scope-advance"]').exists()).toBe(true);
    expect(w.get('svg').attributes('aria-label')).toContain('incoming 37.5 degrees ahead of the bus');
  });

  it('draws no window sector until a window is given', () => {
    const w = mount(PhasorScope, { props: { angleDeg: 0 } });
    expect(w.find('[data-test="scope-window"]').exists()).toBe(false);
  });
});

describe('SynchronizingView with the engine', () => {
  beforeEach(() => {
    setActivePinia(createPinia());
    setEngineClient(directClient());
    vi.stubGlobal('requestAnimationFrame', () => 1);
    vi.stubGlobal('cancelAnimationFrame', () => undefined);
  });
  afterEach(() => vi.unstubAllGlobals());

  it("draws the engine's angle and shows readouts and the permissive state in words", async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    sync.setTurning(false, 0);
    sync.setLive({ busFrequencyHz: 50, incomingFrequencyHz: 50.1, busVoltageV: 400, incomingVoltageV: 404, angleDeg: -73.4 }, 0);
    const w = mount(SynchronizingView);
    await flushPromises();
    const r = sync.result!;
    const engineResult = evaluateSync(sync.buildCase(-73.4));
    expect(r.angleNowDeg).toBe(engineResult.angleNowDeg);
    expectClose(drawnAngle(w, 'scope-incoming-A', 340), engineResult.angleNowDeg, { abs: 1e-9 }, 'drawn angle = engine angle');
    expect(w.get('[data-test="permissive"]').text()).toContain('Blocked: closing is not allowed now');
    expect(w.get('[data-test="readout-angle"]').text()).toContain('-73.4 °');
    expect(w.get('[data-test="readout-angle"]').text()).toContain('✗ outside');
    expect(w.get('[data-test="readout-slip"]').text()).toContain('+0.100 Hz');
    // 0.1 Hz slip with a 100 ms breaker: advance angle 360 × 0.1 × 0.1 = 3.6° (closed form).
    expect(w.get('[data-test="readout-advance"]').text()).toContain('3.60 °');

    sync.setLive({ angleDeg: -2 }, 0);
    await flushPromises();
    expect(w.get('[data-test="permissive"]').text()).toContain('Permissive: closing is allowed now');
    expectClose(drawnAngle(w, 'scope-incoming-A', 340), -2, { abs: 1e-9 }, 'drawn angle after edit');
    w.unmount();
  });

  it('turns the drawn angle at 360° × slip per second between engine evaluations', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    sync.setLive({ incomingFrequencyHz: 50.25, busFrequencyHz: 50, angleDeg: 10 }, 1000);
    await flushPromises();
    const at = sync.resultAtMs;
    // 0.25 Hz for 0.1 s: 9° (closed form).
    expectClose(sync.displayAngleDeg(at + 100) - sync.displayAngleDeg(at), 9, { abs: 1e-9 }, 'turned in 100 ms');
  });

  it('lists presets with their source and switches to custom limits when a limit is edited', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    const w = mount(SynchronizingView);
    await flushPromises();
    expect(sync.presets.length).toBeGreaterThan(2);
    expect(w.get('[data-test="preset-source"]').text()).toContain('Common practice');
    await w.get('[data-test="preset-select"]').setValue('ieee-c50.12-c50.13');
    expect(sync.settings.limits.slipHz).toBe(0.067);
    expect(w.get('[data-test="preset-source"]').text()).toContain('IEEE Std C50.12');
    await w.get('[data-test="limit-angle"]').setValue('15');
    expect(sync.settings.presetId).toBeNull();
    expect(sync.settings.limits.angleDeg).toBe(15);
    expect(w.get('[data-test="preset-source"]').text()).toContain('Custom limits');
    w.unmount();
  });

  it('computes the closing map with progress and draws it with a hover readout', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    const w = mount(SynchronizingView);
    await flushPromises();
    const seen: number[] = [];
    const p = sync.computeMap(0, 37, 21);
    expect(sync.mapBusy).toBe(true);
    await p;
    seen.push(sync.mapProgress);
    await flushPromises();
    expect(sync.mapBusy).toBe(false);
    expect(sync.map!.anglesDeg).toHaveLength(37);
    expect(w.find('[data-test="closing-map"]').exists()).toBe(true);
    expect(w.get('[data-test="map-hover"]').text()).toContain('Point at the map');
    await sync.computeMap(3, 19, 11);
    expect(sync.map!.voltageDifferencePct).toBe(3);
    w.unmount();
  });

  it('cancels a running map and says so', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    const p = sync.computeMap(0, 181, 101);
    sync.cancelMap();
    await p;
    expect(sync.map).toBeNull();
    expect(sync.mapError).toBe('Closing map cancelled.');
  });

  it('keeps its settings with the project: snapshot and restore', () => {
    const sync = useSyncStore();
    sync.setLimits({ angleDeg: 7 });
    sync.setBreakerClosingMs(250);
    sync.setDead({ deadBus: true });
    const snap = sync.snapshot();
    expect(snap).toEqual({ ...DEFAULT_SYNC_SETTINGS, presetId: null, limits: { ...DEFAULT_SYNC_SETTINGS.limits, angleDeg: 7 }, breakerClosingMs: 250, dead: { ...DEFAULT_SYNC_SETTINGS.dead, deadBus: true } });
    sync.restore(null);
    expect(sync.settings).toEqual(DEFAULT_SYNC_SETTINGS);
    sync.restore(snap);
    expect(sync.snapshot()).toEqual(snap);
    snap.limits.angleDeg = 99;
    expect(sync.settings.limits.angleDeg).toBe(7);
  });
});
