import 'vitest-canvas-mock';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import type { VueWrapper } from '@vue/test-utils';
import WindowPlane from '../../renderer/components/sync/WindowPlane.vue';
import SynchronizingView from '../../renderer/views/SynchronizingView.vue';
import {
  angleAtX,
  CONTACT_R,
  contactMarker,
  keepRecent,
  POINT_R,
  planeFrame,
  planeSlipSpanHz,
  planeX,
  planeY,
  slipAtY,
  tracePath,
  windowRect,
  windowSlipEdges,
} from '../../renderer/components/sync/window-plane';
import { usePlantStore } from '../../renderer/stores/plant';
import { useSyncStore } from '../../renderer/stores/sync';
import { evaluateSync } from '../../electron/engine';
import type { SyncCase } from '../../shared-types';
import { freshStores, holdFrames } from './view-harness';
import { expectClose } from '../helpers/expect-close';

/** The (angle, slip) a drawn marker stands for, read back through the plane's inverse. */
function drawnPoint(w: Pick<VueWrapper, 'get'>, test: string): { angleDeg: number; slipHz: number } {
  const span = Number(w.get('svg').attributes('data-slip-span'));
  const f = planeFrame(span);
  const el = w.get(`[data-test="${test}"]`);
  return { angleDeg: angleAtX(f, Number(el.attributes('cx'))), slipHz: slipAtY(f, Number(el.attributes('cy'))) };
}

const CASE: SyncCase = {
  bus: { frequencyHz: 50, voltageV: 400 },
  incoming: { frequencyHz: 50.12, voltageV: 408, angleDeg: -41.3, ratedKVA: 500, xddpPU: 0.15 },
  busSource: { ratedKVA: 2000, xPU: 0.15 },
  breakerClosingMs: 120,
  limits: { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true },
};

describe('window plane geometry', () => {
  it('puts −180° at the left edge, +180° at the right, zero slip in the middle, and inverts exactly', () => {
    const f = planeFrame(0.5);
    // Closed form of the frame: plot from pad.l to width − pad.r across, pad.t to height − pad.b down.
    expect(planeX(f, -180)).toBe(f.pad.l);
    expect(planeX(f, 180)).toBe(f.width - f.pad.r);
    expectClose(planeY(f, 0), f.pad.t + (f.height - f.pad.t - f.pad.b) / 2, { abs: 1e-12 }, 'zero slip mid-height');
    expect(planeY(f, 0.5)).toBe(f.pad.t);
    for (const a of [-179.5, -37.2, 0, 12.5, 180]) expectClose(angleAtX(f, planeX(f, a)), a, { abs: 1e-9 }, `angle ${a}`);
    for (const s of [-0.5, -0.013, 0, 0.2, 0.47]) expectClose(slipAtY(f, planeY(f, s)), s, { abs: 1e-12 }, `slip ${s}`);
  });

  it('sizes the slip axis for 2.5 × the limit, the slip now and the map, on a round value', () => {
    expect(planeSlipSpanHz(0.2, 0.1)).toBe(0.5);
    expect(planeSlipSpanHz(0.2, 0.9)).toBeGreaterThanOrEqual(1.125);
    expect(planeSlipSpanHz(0.1, 0.05, 0.6)).toBeGreaterThanOrEqual(0.6);
    expect(planeSlipSpanHz(null, null)).toBe(0.2);
  });

  it('draws a one-sided window from zero slip up when the incoming set must run faster', () => {
    const f = planeFrame(0.5);
    const r = windowRect(f, { angleDeg: 10, ...windowSlipEdges({ slipHz: 0.2, incomingFaster: true }) });
    expectClose(r.x, planeX(f, -10), { abs: 1e-9 }, 'left edge');
    expectClose(r.x + r.w, planeX(f, 10), { abs: 1e-9 }, 'right edge');
    expectClose(r.y, planeY(f, 0.2), { abs: 1e-9 }, 'top edge at the limit');
    expectClose(r.y + r.h, planeY(f, 0), { abs: 1e-9 }, 'bottom edge at zero slip');
    const two = windowRect(f, { angleDeg: 10, ...windowSlipEdges({ slipHz: 0.2 }) });
    expectClose(two.y + two.h, planeY(f, -0.2), { abs: 1e-9 }, 'two-sided bottom edge');
  });

  it('breaks the trace where the angle wraps through ±180° and keeps a fast slip turning the right way', () => {
    const f = planeFrame(2);
    // 1 Hz slip sampled every 0.2 s: 72° a sample, from 150° across +180° to −138°.
    const d = tracePath(f, [
      { tS: 0, angleDeg: 150, slipHz: 1 },
      { tS: 0.2, angleDeg: -138, slipHz: 1 },
    ]);
    const moves = d.match(/M/g)!.length;
    expect(moves).toBe(2);
    expect(d).toContain(`L ${planeX(f, 180).toFixed(1)}`);
    expect(d).toContain(`M ${planeX(f, -180).toFixed(1)}`);
    // Slow incoming (−1 Hz): from −150° back across −180° to +138°.
    const back = tracePath(f, [
      { tS: 0, angleDeg: -150, slipHz: -1 },
      { tS: 0.2, angleDeg: 138, slipHz: -1 },
    ]);
    expect(back).toContain(`L ${planeX(f, -180).toFixed(1)}`);
    expect(back).toContain(`M ${planeX(f, 180).toFixed(1)}`);
    // A 3 Hz slip sampled every 0.2 s turns 216° a sample: the unwrap follows the slip, crossing once, not going back.
    const fast = tracePath(f, [
      { tS: 0, angleDeg: 0, slipHz: 3 },
      { tS: 0.2, angleDeg: -144, slipHz: 3 },
    ]);
    expect(fast.match(/M/g)!.length).toBe(2);
    expect(
      keepRecent(
        [
          { tS: 1, angleDeg: 0, slipHz: 0 },
          { tS: 5, angleDeg: 0, slipHz: 0 },
        ],
        6,
        3,
      ),
    ).toHaveLength(1);
  });
});

describe('contact marker beside the operating point', () => {
  const f = planeFrame(0.5);
  const at = (angleDeg: number, slipHz: number) => ({ x: planeX(f, angleDeg), y: planeY(f, slipHz) });

  it('stays on its place when it is clear of the point', () => {
    // 20° apart: 20/360 of the 568-unit plot is about 32 units, well beyond the two radii.
    const m = contactMarker(f, at(-30, 0.1), at(-10, 0.1));
    expect(m).toEqual({ ...at(-10, 0.1), lifted: false, leader: null });
  });

  it('is lifted clear of the point at a small advance, keeping its angle, with a leader across the slip line at that angle', () => {
    // Closed form: slip 0.1 Hz, breaker 50 ms → advance 360 × 0.1 × 0.05 = 1.8°, about 3 units on the plane.
    const point = at(-20, 0.1);
    const contact = at(-20 + 1.8, 0.1);
    expect(Math.hypot(contact.x - point.x, contact.y - point.y)).toBeLessThan(POINT_R + CONTACT_R);
    const m = contactMarker(f, point, contact);
    expect(m.lifted).toBe(true);
    // Both markers readable: their edges at least a gap apart.
    expect(Math.hypot(m.x - point.x, m.y - point.y)).toBeGreaterThanOrEqual(POINT_R + CONTACT_R + 4);
    // The angle is the contact's, read back through the plane's inverse; lifted above the slip line.
    expectClose(angleAtX(f, m.x), -18.2, { abs: 1e-9 }, 'marker angle = contact angle');
    expect(m.y).toBeLessThan(contact.y);
    // The leader runs from the marker's edge down across the slip line at the contact's angle.
    expect(m.leader!.x).toBe(contact.x);
    expect(m.leader!.y1).toBeCloseTo(m.y + CONTACT_R, 9);
    expect(m.leader!.y1).toBeLessThan(contact.y);
    expect(m.leader!.y2).toBeGreaterThan(contact.y);
  });

  it('goes below the slip line near the top edge, and is lifted when it sits exactly on the point (no advance)', () => {
    const top = at(40, 0.5);
    const m = contactMarker(f, top, top);
    expect(m.lifted).toBe(true);
    expect(m.y).toBeGreaterThan(top.y);
    expect(m.y - CONTACT_R).toBeGreaterThanOrEqual(top.y + POINT_R);
    expect(m.leader!.y2).toBeLessThan(top.y);
  });

  it('is not moved when there is no point to keep clear of (after a close)', () => {
    expect(contactMarker(f, null, at(3, 0)).lifted).toBe(false);
  });
});

describe('window plane component', () => {
  it("draws the operating point at the engine's angle and slip, and the command and contact points on its slip line", () => {
    const r = evaluateSync(CASE);
    const w = mount(WindowPlane, {
      props: {
        angleDeg: r.angleNowDeg,
        slipHz: r.slipHz,
        window: { angleDeg: r.limits.angleDeg, ...windowSlipEdges(r.limits) },
        commandAngleDeg: r.closeCommandAngleDeg,
        contactAngleDeg: r.closeNow.angleAtContactDeg,
      },
    });
    const p = drawnPoint(w, 'plane-point');
    expectClose(p.angleDeg, r.angleNowDeg, { abs: 1e-9 }, 'drawn angle = engine angle');
    expectClose(p.slipHz, r.slipHz, { abs: 1e-9 }, 'drawn slip = engine slip');
    // Closed form: slip 0.12 Hz, breaker 120 ms → advance 360 × 0.12 × 0.12 = 5.184°; contact now = −41.3 + 5.184.
    const contact = w.get('[data-test="plane-contact"] circle');
    const span = Number(w.get('svg').attributes('data-slip-span'));
    expectClose(angleAtX(planeFrame(span), Number(contact.attributes('cx'))), -41.3 + 5.184, { abs: 1e-9 }, 'contact if commanded now');
    const cmd = w.get('[data-test="plane-command"] path').attributes('d')!;
    const cmdX = Number(cmd.split(' ')[1]);
    expectClose(angleAtX(planeFrame(span), cmdX), -5.184, { abs: 1e-9 }, 'command point one advance angle before the in-phase moment');
    expect(w.get('[data-test="plane-now"]').text()).toContain('outside the window');
    expect(w.find('[data-test="plane-window"]').exists()).toBe(true);
  });

  it('draws the point and a lifted contact marker apart when the advance is small, the leader at the contact angle', () => {
    // Closed form: slip 0.08 Hz, breaker 40 ms → advance 360 × 0.08 × 0.04 = 1.152°; contact now = 12 + 1.152.
    const w = mount(WindowPlane, { props: { angleDeg: 12, slipHz: 0.08, commandAngleDeg: -1.152, contactAngleDeg: 12 + 1.152 } });
    const span = Number(w.get('svg').attributes('data-slip-span'));
    const f = planeFrame(span);
    const point = w.get('[data-test="plane-point"]');
    const marker = w.get('[data-test="plane-contact"] circle');
    const d = Math.hypot(Number(marker.attributes('cx')) - Number(point.attributes('cx')), Number(marker.attributes('cy')) - Number(point.attributes('cy')));
    expect(d).toBeGreaterThanOrEqual(Number(point.attributes('r')) + Number(marker.attributes('r')));
    expect(w.get('[data-test="plane-contact"]').attributes('data-lifted')).toBe('true');
    const leader = w.get('[data-test="plane-contact-leader"]');
    expectClose(angleAtX(f, Number(leader.attributes('x1'))), 13.152, { abs: 1e-9 }, 'leader at the contact angle');
    const lineY = planeY(f, 0.08);
    const [y1, y2] = [Number(leader.attributes('y1')), Number(leader.attributes('y2'))];
    expect(Math.min(y1, y2)).toBeLessThan(lineY);
    expect(Math.max(y1, y2)).toBeGreaterThan(lineY);
    // The point is drawn after the contact marker (on top of the leader's end), and the key says the marker was moved.
    const svg = w.get('svg').html();
    expect(svg.indexOf('data-test="plane-point"')).toBeGreaterThan(svg.indexOf('data-test="plane-contact"'));
    expect(w.get('figcaption').text()).toContain('drawn clear of the point');
  });

  it('draws no point without a verdict and says so', () => {
    const w = mount(WindowPlane, { props: { angleDeg: null, slipHz: null } });
    expect(w.find('[data-test="plane-point"]').exists()).toBe(false);
    expect(w.get('[data-test="plane-now"]').text()).toContain('No operating point');
  });
});

describe('window plane in the Synchronizing view', () => {
  beforeEach(() => {
    freshStores();
    holdFrames();
  });
  afterEach(() => vi.unstubAllGlobals());

  it("draws the store's verdict: the point is the engine's angle and slip for the case on the scope", async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    sync.setTurning(false, 0);
    sync.setLive({ busFrequencyHz: 50, incomingFrequencyHz: 49.93, busVoltageV: 400, incomingVoltageV: 398, angleDeg: 121.7 }, 0);
    const w = mount(SynchronizingView);
    await flushPromises();
    const engineResult = evaluateSync(sync.buildCase(121.7));
    const plane = w.getComponent(WindowPlane);
    const p = drawnPoint(plane, 'plane-point');
    expectClose(p.angleDeg, engineResult.angleNowDeg, { abs: 1e-9 }, 'drawn angle = engine angle');
    expectClose(p.slipHz, engineResult.slipHz, { abs: 1e-9 }, 'drawn slip = engine slip');
    expect(plane.get('[data-test="plane-now"]').text()).toContain('outside the window');

    // A refused field withdraws the point along with the verdict.
    sync.setBreakerClosingMs(-5);
    await flushPromises();
    expect(sync.invalid).toBe(true);
    expect(plane.find('[data-test="plane-point"]').exists()).toBe(false);
    w.unmount();
  });

  it('shades the closing map beneath the plane once it is computed', async () => {
    await usePlantStore().loadDemo();
    const sync = useSyncStore();
    const w = mount(SynchronizingView);
    await flushPromises();
    expect(w.find('[data-test="plane-map"]').exists()).toBe(false);
    await sync.computeMap(0, 19, 11);
    await flushPromises();
    expect(w.find('[data-test="plane-map"]').exists()).toBe(true);
    expect(w.get('[data-test="plane-map-legend"]').text()).toContain('surge current');
    w.unmount();
  });
});
