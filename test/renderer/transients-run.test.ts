import { describe, it, expect, beforeEach } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import MetricsTable from '../../renderer/components/transients/MetricsTable.vue';
import TransientsView from '../../renderer/views/TransientsView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { useTransientsStore } from '../../renderer/stores/transients';
import { EngineCallError, setEngineClient } from '../../renderer/transport';
import type { EngineClient } from '../../renderer/transport';
import { dispatch } from '../../electron/handlers';
import type { SimulationResult } from '../../shared-types';
import { directClient } from '../helpers/direct-client';
import { freshStores } from './view-harness';

// A short run keeps the test quick: 3 s at 2 ms steps, a 300 kW / 200 kVAR block at 0.5 s (our own example).
const SHORT = { id: 'short', name: 'Short block', durationS: 3, stepMs: 2, events: [{ atS: 0.5, type: 'load-step' as const, kW: 300, kVAR: 200 }] };

async function ready(client: EngineClient = directClient()) {
  freshStores(client);
  const plantStore = usePlantStore();
  await plantStore.loadDemo();
  const store = useTransientsStore();
  store.restore([structuredClone(SHORT)]);
  return { store, plant: plantStore.plant! };
}

describe('transients run and metrics table', () => {
  beforeEach(() => undefined);

  it("runs with progress and shows the engine's own metrics and class verdicts in words", async () => {
    const { store, plant } = await ready();
    const seen: number[] = [];
    const base = directClient();
    setEngineClient({
      call: (m, r, o) =>
        base.call(m, r, {
          ...o,
          onProgress: (f, l) => {
            seen.push(f);
            o?.onProgress?.(f, l);
          },
        }),
    });
    expect(await store.run()).toBe(true);
    expect(seen.length).toBeGreaterThan(0);
    const direct = await dispatch('simulate', { name: SHORT.name, plant, durationS: 3, stepMs: 2, outputPoints: 2000, events: SHORT.events });
    if (!direct.ok) throw new Error(direct.error.message);
    const m = direct.value.metrics;
    const w = mount(MetricsTable, { props: { run: store.current!, compare: null } });
    expect(w.get('[data-test="metric-nadirHz"] td').text()).toBe(m.frequencyNadirHz.toFixed(3));
    expect(w.get('[data-test="metric-vDipPct"] td').text()).toBe(m.voltageDipPct.toFixed(2));
    const classes = w.get('[data-test="class-table-A"]');
    expect(classes.findAll('tbody tr').length).toBe(m.classes.length);
    const words = classes.findAll('[data-test="verdict-G2"]').map((c) => c.text());
    expect(words.length).toBe(m.classes.length);
    for (const [i, c] of m.classes.entries()) {
      const word = c.pass.G2 === null ? 'not judged' : c.pass.G2 ? 'meets' : 'fails';
      expect(words[i]).toContain(word);
      expect(classes.findAll('tbody tr')[i]!.text()).toContain(c.source);
    }
    expect(w.text()).not.toContain('NaN');
  });

  it('overlays the run before as B and lists it in the metrics', async () => {
    const { store } = await ready();
    expect(await store.run()).toBe(true);
    store.selected!.events[0] = { ...SHORT.events[0]!, kW: 150 };
    expect(await store.run()).toBe(true);
    expect(store.compare?.id).toBe(1);
    const w = mount(TransientsView);
    await flushPromises();
    expect(w.get('[data-test="metrics-head-B"]').text()).toContain('Run 1');
    expect(w.find('[data-test="class-table-B"]').exists()).toBe(true);
    expect(w.get('[data-test="cursor-readout"]').text()).toContain('B · t =');
    // The smaller block dips less: the comparison shows a real difference.
    expect(store.current!.result.metrics.frequencyNadirHz).toBeGreaterThan(store.compare!.result.metrics.frequencyNadirHz);
  });

  it('cancel stops the run and keeps the last finished one', async () => {
    const { store } = await ready();
    expect(await store.run()).toBe(true);
    const first = store.current!.id;
    const p = store.run();
    store.cancel();
    expect(await p).toBe(false);
    expect(store.error).toContain('Run cancelled');
    expect(store.current!.id).toBe(first);
    expect(store.running).toBe(false);
  });

  it("shows the engine's message when the run fails", async () => {
    const base = directClient();
    const { store } = await ready({
      call: (m, r, o) =>
        m === 'simulate'
          ? Promise.reject(new EngineCallError({ name: 'EngineError', code: 'NO_STEADY_STATE', message: 'The plant has no steady state to start from.' }))
          : base.call(m, r, o),
    });
    expect(await store.run()).toBe(false);
    const w = mount(TransientsView);
    await flushPromises();
    expect(w.get('[data-test="run-error"]').text()).toContain('no steady state');
    expect(w.find('[data-test="metrics-table"]').exists()).toBe(false);
  });

  it('zoom window and cursor are shared and clamped', async () => {
    const { store } = await ready();
    await store.run();
    store.setWindow({ min: 1, max: 1.0000001 });
    expect(store.xWindow).toBeNull();
    store.setWindow({ min: 0.5, max: 1.5 });
    store.setCursor(1.2);
    const w = mount(TransientsView);
    await flushPromises();
    const t = Number(w.get('[data-test="readout-t"]').text());
    const r: SimulationResult = store.current!.result;
    expect(Math.abs(t - 1.2)).toBeLessThanOrEqual((r.series.t[1]! - r.series.t[0]!) / 2 + 1e-9);
    await w.get('[data-test="zoom-reset"]').trigger('click');
    expect(store.xWindow).toBeNull();
  });
});
