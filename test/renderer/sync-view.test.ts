import 'vitest-canvas-mock';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import PhasorScope from '../../renderer/components/sync/PhasorScope.vue';
import SynchronizingView from '../../renderer/views/SynchronizingView.vue';
import { angleOfTip, phasorTip, REACH_FRACTION, windowOutlinePath } from '../../renderer/components/sync/phasor-geometry';
import { usePlantStore } from '../../renderer/stores/plant';
import { DEFAULT_SYNC_SETTINGS, useSyncStore } from '../../renderer/stores/sync';
import { evaluateSync } from '../../electron/engine';
import { freshStores, holdFrames } from './view-harness';
import { directClient } from '../helpers/direct-client';
import { expectClose } from '../helpers/expect-close';
import type { VueWrapper } from '@vue/test-utils';

/** The angle a drawn phasor line makes, clockwise on screen from the reference axis, degrees. */
function drawnAngle(w: VueWrapper, test: string, size = 320): number {
  const line = w.get(`[data-test="${test}"]`);
  const c = size / 2;
  return angleOfTip(c, c, { x: Number(line.attributes('x2')), y: Number(line.attributes('y2')) });
}

describe('phasor diagram geometry', () => {
  it('draws phasor tips at the given angle, clockwise on screen from the reference axis (the trade convention)', () => {
    // Closed form, screen y down: +90° (incoming a quarter-cycle ahead) is straight down, −90° straight up, 180° left.
    expectClose(phasorTip(100, 100, 50, 90).y, 150, { abs: 1e-12 }, 'y at +90°');
    expectClose(phasorTip(100, 100, 50, -90).y, 50, { abs: 1e-12 }, 'y at −90°');
    expectClose(phasorTip(100, 100, 50, 180).x, 50, { abs: 1e-12 }, 'x at 180°');
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
    expect(w.get('[data-test="scope-window"]').attributes('d')).toBe(windowOutlinePath(160, 160, 320 * REACH_FRACTION, 10));
    expect(w.find('[data-test="scope-advance"]').exists()).toBe(true);
    expect(w.get('svg').attributes('aria-label')).toContain('incoming 37.5 degrees ahead of the bus');
  });

  it('turns clockwise on screen as the angle grows (incoming fast), counter-clockwise as it falls, and says so in words', () => {
    // Screen cross product of two successive tips: positive z (y down) is a clockwise turn.
    const turn = (a: number, b: number): number => {
      const p = phasorTip(0, 0, 1, a);
      const q = phasorTip(0, 0, 1, b);
      return p.x * q.y - p.y * q.x;
    };
    for (const a of [-170, -60, 0, 35, 120, 179]) {
      expect(turn(a, a + 1)).toBeGreaterThan(0);
      expect(turn(a, a - 1)).toBeLessThan(0);
    }
    const fast = mount(PhasorScope, { props: { angleDeg: 5, slipHz: 0.1 } });
    expect(fast.get('svg').attributes('data-turning')).toBe('clockwise');
    expect(fast.get('[data-test="scope-words"]').text()).toBe('incoming fast: the diagram turns clockwise');
    const slow = mount(PhasorScope, { props: { angleDeg: 5, slipHz: -0.1 } });
    expect(slow.get('svg').attributes('data-turning')).toBe('counter-clockwise');
    expect(slow.get('[data-test="scope-words"]').text()).toBe('incoming slow: the diagram turns counter-clockwise');
  });

  it('draws the window as an outline, with no dial ticks and no filled wedge', () => {
    const w = mount(PhasorScope, { props: { angleDeg: 0, windowDeg: 10 } });
    expect(w.findAll('.tick')).toHaveLength(0);
    expect(w.get('[data-test="scope-window"]').attributes('d')).not.toMatch(/Z\s*$/);
  });

  it('draws no window until a window is given', () => {
    const w = mount(PhasorScope, { props: { angleDeg: 0 } });
    expect(w.find('[data-test="scope-window"]').exists()).toBe(false);
  });
});

describe('SynchronizingView with the engine', () => {
  beforeEach(() => {
    freshStores();
    holdFrames();
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
    expectClose(drawnAngle(w, 'scope-incoming-A', 300), engineResult.angleNowDeg, { abs: 1e-9 }, 'drawn angle = engine angle');
    expect(w.get('[data-test="permissive"]').text()).toContain('Blocked: closing is not allowed now');
    expect(w.get('[data-test="readout-angle"]').text()).toContain('-73.4 °');
    expect(w.get('[data-test="readout-angle"]').text()).toContain('✗ outside');
    expect(w.get('[data-test="readout-slip"]').text()).toContain('+0.100 Hz');
    // 0.1 Hz slip with a 100 ms breaker: advance angle 360 × 0.1 × 0.1 = 3.6° (closed form).
    expect(w.get('[data-test="readout-advance"]').text()).toContain('3.60 °');

    sync.setLive({ angleDeg: -2 }, 0);
    await flushPromises();
    expect(w.get('[data-test="permissive"]').text()).toContain('Permissive: closing is allowed now');
    expectClose(drawnAngle(w, 'scope-incoming-A', 300), -2, { abs: 1e-9 }, 'drawn angle after edit');
    w.unmount();
  });

  it("draws the closing map at the voltage difference typed, at the case's own when empty, and refuses unreadable text", async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    sync.setTurning(false, 0);
    const w = mount(SynchronizingView);
    await flushPromises();
    const asked = vi.spyOn(sync, 'computeMap').mockResolvedValue();
    const field = w.get('[data-test="map-dv"]');
    await field.setValue('3.5');
    await w.get('[data-test="map-compute"]').trigger('click');
    expect(asked.mock.calls.at(-1)?.[0]).toBe(3.5);
    await field.setValue('three');
    await flushPromises();
    expect(w.get('[data-test="error-map-dv"]').text()).toBe("voltage difference for the map must be a number, or empty for the case's own");
    await w.get('[data-test="map-compute"]').trigger('click');
    expect(asked.mock.calls.at(-1)?.[0]).toBe(3.5);
    await field.setValue('');
    await flushPromises();
    expect(w.find('[data-test="error-map-dv"]').exists()).toBe(false);
    await w.get('[data-test="map-compute"]').trigger('click');
    expect(asked.mock.calls.at(-1)?.[0]).toBe(undefined);
    w.unmount();
  });

  it.each([
    ['limit-slip', '-0.2', 'limits.slipHz', 'slip limit must be greater than 0'],
    ['limit-angle', '200', 'limits.angleDeg', 'angle limit must be 180° or less'],
    ['limit-voltage', '', 'limits.voltagePct', 'voltage difference limit must be a number'],
    ['breaker-ms', '-50', 'breakerClosingMs', 'breaker closing time must be greater than 0'],
    ['incoming-frequency', '500', 'incoming.frequencyHz', 'incoming frequency must be within 15 % of the rated 50 Hz (42.5–57.5 Hz)'],
    ['bus-voltage', '-400', 'bus.voltageV', 'bus voltage must be 0 or more'],
  ])('refuses %s = "%s" with the rule beside the field and "settings invalid" in place of any permissive', async (test, value, path, words) => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    sync.setTurning(false, 0);
    // A case that is permissive before the edit: 0.1 Hz fast, +1 %, −2°.
    sync.setLive({ busFrequencyHz: 50, incomingFrequencyHz: 50.1, busVoltageV: 400, incomingVoltageV: 404, angleDeg: -2 }, 0);
    const w = mount(SynchronizingView);
    await flushPromises();
    expect(w.get('[data-test="permissive"]').attributes('data-state')).toBe('permissive');
    const good = sync.snapshot();
    await w.get(`[data-test="${test}"]`).setValue(value);
    await flushPromises();
    expect(sync.error).toBe(null);
    expect(w.get(`[data-test="error-${path}"]`).text()).toContain(words);
    const panel = w.get('[data-test="permissive"]');
    expect(panel.attributes('data-state')).toBe('invalid');
    expect(panel.text()).toContain('Settings invalid');
    expect(panel.text()).not.toContain('Permissive');
    expect(w.findAll('[data-test^="readout-"]')).toHaveLength(0);
    expect(w.get('[data-test="map-compute"]').attributes('disabled')).toBeDefined();
    // The project keeps the last accepted settings; the typed value stays in the field.
    expect(sync.snapshot()).toEqual(good);
    // Putting the field right brings the verdict back.
    const fixed: Record<string, string> = {
      'limit-slip': '0.2',
      'limit-angle': '10',
      'limit-voltage': '5',
      'breaker-ms': '100',
      'incoming-frequency': '50.1',
      'bus-voltage': '400',
    };
    await w.get(`[data-test="${test}"]`).setValue(fixed[test]!);
    await flushPromises();
    await vi.waitFor(() => expect(w.get('[data-test="permissive"]').attributes('data-state')).toBe('permissive'));
    expect(w.find(`[data-test="error-${path}"]`).exists()).toBe(false);
    w.unmount();
  });

  it('shows the table and the verdict from one result: the angle in both is the same figure', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    // Set at the wall clock the view reads, so the angle shown is near 25° rather than wherever the slip took it.
    sync.setLive({ busFrequencyHz: 50, incomingFrequencyHz: 50.25, busVoltageV: 400, incomingVoltageV: 404, angleDeg: 25 }, performance.now());
    const w = mount(SynchronizingView);
    await flushPromises();
    const r = sync.result!;
    const shown = w.get('[data-test="readout-angle"]').text();
    // The readout's rule: one decimal, "+" above zero, and a figure that rounds to zero has no sign.
    const fixed = r.angleNowDeg.toFixed(1);
    const expected = /^-?0\.0$/.test(fixed) ? '0.0' : `${r.angleNowDeg > 0 ? '+' : ''}${fixed}`;
    expect(shown).toContain(`${expected} °`);
    const reason = r.reasons.find((x) => x.startsWith('Phase angle'));
    if (reason) expect(reason).toContain(Math.abs(r.angleNowDeg).toFixed(1));
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

  it('computes the time-domain map of the plant and says how long its cells ran', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    const w = mount(SynchronizingView);
    await flushPromises();
    expect(w.get('[data-test="map-method"]').text()).toContain('time-domain');
    await sync.computeMap(0, 9, 3, 'time-domain');
    await flushPromises();
    expect(sync.map!.method).toBe('time-domain');
    expect(sync.map!.cellRun!.capMs).toBeGreaterThan(0);
    expect(w.get('[data-test="map-cell-run"]').text()).toContain('climb back to its peak');
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
    expect(snap).toEqual({
      ...DEFAULT_SYNC_SETTINGS,
      presetId: null,
      limits: { ...DEFAULT_SYNC_SETTINGS.limits, angleDeg: 7 },
      breakerClosingMs: 250,
      dead: { ...DEFAULT_SYNC_SETTINGS.dead, deadBus: true },
    });
    sync.restore(null);
    expect(sync.settings).toEqual(DEFAULT_SYNC_SETTINGS);
    sync.restore(snap);
    expect(sync.snapshot()).toEqual(snap);
    snap.limits.angleDeg = 99;
    expect(sync.settings.limits.angleDeg).toBe(7);
  });
});

describe('the verdict asked only while a view shows it', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('asks no verdict for a plant edit while the Synchronizing view is closed, and asks again while it is open', async () => {
    const inner = directClient();
    const asked: string[] = [];
    freshStores({
      call: (method, request, options) => {
        asked.push(method);
        return inner.call(method, request, options);
      },
    });
    holdFrames();
    const plant = usePlantStore();
    await plant.loadDemo();
    useSyncStore();
    await plant.edit('sets[1].governor.droopPct', 4.5);
    await flushPromises();
    expect(asked.filter((m) => m === 'evaluateSync')).toHaveLength(0);
    // Open: the view asks as it opens, and each plant edit asks again.
    const w = mount(SynchronizingView);
    await flushPromises();
    expect(asked.filter((m) => m === 'evaluateSync')).toHaveLength(1);
    await plant.edit('sets[1].governor.droopPct', 3.5);
    await flushPromises();
    expect(asked.filter((m) => m === 'evaluateSync')).toHaveLength(2);
    // Closed again: edits ask nothing more.
    w.unmount();
    await plant.edit('sets[1].governor.droopPct', 4);
    await flushPromises();
    expect(asked.filter((m) => m === 'evaluateSync')).toHaveLength(2);
  });
});
