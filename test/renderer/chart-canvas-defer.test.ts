/**
 * A deferred chart (`ChartCanvas` with `defer-update`, the Plant view's capability charts) is drawn at an
 * animation frame and only while on screen or near it: off screen it keeps the change and draws it when it
 * comes back, and asking for the chart brings it up to date at once.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { mount } from '@vue/test-utils';
import { Chart } from 'chart.js';
import type { ChartConfiguration } from 'chart.js';
import ChartCanvas from '../../renderer/components/charts/ChartCanvas.vue';

/** An IntersectionObserver the test drives: `show(true)` puts the observed canvas on screen. */
class FakeObserver {
  static last: FakeObserver | null = null;
  constructor(private readonly callback: (entries: { isIntersecting: boolean }[]) => void) {
    FakeObserver.last = this;
  }
  observe(): void {}
  disconnect(): void {}
  show(on: boolean): void {
    this.callback([{ isIntersecting: on }]);
  }
}

let frames: FrameRequestCallback[] = [];
function runFrames(): void {
  const now = frames;
  frames = [];
  for (const f of now) f(0);
}

const config = (label: string): ChartConfiguration => ({
  type: 'scatter',
  data: { datasets: [{ label, data: [{ x: 1, y: 2 }] }] },
  options: { animation: false },
});

describe('ChartCanvas with defer-update', () => {
  beforeEach(() => {
    frames = [];
    vi.stubGlobal('IntersectionObserver', FakeObserver);
    vi.stubGlobal('requestAnimationFrame', (f: FrameRequestCallback) => frames.push(f));
    vi.stubGlobal('cancelAnimationFrame', () => undefined);
  });
  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it('draws only on screen, at a frame, with the newest configuration', async () => {
    const w = mount(ChartCanvas, { props: { config: config('first'), label: 'test chart', deferUpdate: true }, attachTo: document.body });
    const canvas = w.find('canvas').element as HTMLCanvasElement;
    const labelNow = () => (Chart.getChart(canvas)?.data.datasets[0] as { label?: string } | undefined)?.label;
    runFrames();
    // Not drawn while the observer has not put it on screen.
    expect(Chart.getChart(canvas)).toBeUndefined();
    await w.setProps({ config: config('second') });
    runFrames();
    expect(Chart.getChart(canvas)).toBeUndefined();

    FakeObserver.last!.show(true);
    expect(Chart.getChart(canvas)).toBeUndefined(); // at the frame, not in the observer's callback
    runFrames();
    expect(labelNow()).toBe('second');

    // On screen: several changes before a frame draw once, the newest.
    await w.setProps({ config: config('third') });
    await w.setProps({ config: config('fourth') });
    expect(frames).toHaveLength(1);
    expect(labelNow()).toBe('second');
    runFrames();
    expect(labelNow()).toBe('fourth');

    // Scrolled away: the change waits; back on screen, it is drawn.
    FakeObserver.last!.show(false);
    await w.setProps({ config: config('fifth') });
    runFrames();
    expect(labelNow()).toBe('fourth');
    FakeObserver.last!.show(true);
    runFrames();
    expect(labelNow()).toBe('fifth');

    // Asking for the chart brings a waiting change in at once.
    FakeObserver.last!.show(false);
    await w.setProps({ config: config('sixth') });
    const live = (w.vm as unknown as { chart: () => Chart | null }).chart();
    expect((live?.data.datasets[0] as { label?: string }).label).toBe('sixth');
    w.unmount();
  });

  it('draws at once without defer-update', async () => {
    const w = mount(ChartCanvas, { props: { config: config('first'), label: 'test chart' }, attachTo: document.body });
    const canvas = w.find('canvas').element as HTMLCanvasElement;
    expect((Chart.getChart(canvas)?.data.datasets[0] as { label?: string }).label).toBe('first');
    await w.setProps({ config: config('second') });
    expect((Chart.getChart(canvas)?.data.datasets[0] as { label?: string }).label).toBe('second');
    expect(frames).toHaveLength(0);
    w.unmount();
  });
});
