import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import type { VueWrapper } from '@vue/test-utils';
import SharingView from '../../renderer/views/SharingView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { loadAtPct, useSharingStore } from '../../renderer/stores/sharing';
import { setEngineClient } from '../../renderer/transport';
import type { EngineClient } from '../../renderer/transport';
import { solveSharing } from '../../electron/engine';
import { sharingCsv, sharingText } from '../../renderer/components/sharing/sharing-export';
import type { LoadOverride, Plant } from '../../shared-types';
import { directClient } from '../helpers/direct-client';
import { freshStores, mountView, settle as settleOn } from './view-harness';
import { expectClose } from '../helpers/expect-close';

const settle = () => settleOn(useSharingStore());

const text = (w: VueWrapper, sel: string) => w.get(sel).text();
const pfText = (pf: number, lagging: boolean) => (pf.toFixed(2) === '1.00' ? '1.00' : `${pf.toFixed(2)} ${lagging ? 'lag' : 'lead'}`);

describe('Sharing view', () => {
  let w: VueWrapper;
  beforeEach(async () => {
    w = await mountView(SharingView, { settleOn: useSharingStore });
  });
  afterEach(() => w.unmount());

  it('shows the engine’s figures for every set, the totals and the bus', () => {
    const plant = usePlantStore().plant!;
    const r = solveSharing(plant);
    expect(text(w, '[data-test="bus-frequency"]')).toBe(`${r.bus.frequencyHz.toFixed(3)} Hz`);
    expect(text(w, '[data-test="bus-voltage"]')).toBe(`${r.bus.voltageV.toFixed(1)} V`);
    for (const s of r.sets) {
      const row = `[data-test="share-row-${s.id}"]`;
      expect(text(w, `${row} [data-test="share-kw"]`)).toBe(s.kW.toFixed(1));
      expect(text(w, `${row} [data-test="share-kvar"]`)).toBe(s.kVAR.toFixed(1));
      expect(text(w, `${row} [data-test="share-kva"]`)).toBe(s.kVA.toFixed(1));
      expect(text(w, `${row} [data-test="share-pf"]`)).toBe(pfText(s.pf, s.pfLagging));
      expect(text(w, `${row} [data-test="share-a"]`)).toBe(s.currentA.toFixed(1));
      expect(text(w, `${row} [data-test="share-v"]`)).toBe(s.terminalV.toFixed(1));
      expect(text(w, `${row} [data-test="share-loading"]`)).toBe(s.loadingPct.toFixed(1));
      expect(text(w, `${row} [data-test="share-circ"]`).replace('−', '-').replace('+', '')).toBe(s.circulatingA.toFixed(1));
    }
    expect(text(w, '[data-test="total-kw"]')).toBe(r.totals.kW.toFixed(1));
    expect(text(w, '[data-test="total-kvar"]')).toBe(r.totals.kVAR.toFixed(1));
    expect(w.text()).not.toContain('NaN');
    // Power balance (closed form): the sets supply the load plus the feeder losses.
    expectClose(r.totals.kW, r.totals.loadKW + r.totals.feederLossKW, { rel: 1e-9 }, 'kW balance');
  });

  it('says "computing" from an edit or a slider move until the result for it is shown, then "settled"', async () => {
    const sharing = useSharingStore();
    const plantStore = usePlantStore();
    const view = () => w.get('[data-test="sharing-view"]');
    expect(view().attributes('data-state')).toBe('settled');
    expect(view().attributes('data-load-pct')).toBe('plant');

    // A slider move: computing until the answer for 80 % is in, then settled at 80 %.
    const moved = sharing.setLoadPct(80);
    await w.vm.$nextTick();
    expect(view().attributes('data-state')).toBe('computing');
    await moved;
    await settle();
    expect(view().attributes('data-state')).toBe('settled');
    expect(view().attributes('data-load-pct')).toBe('80');
    expect(text(w, '[data-test="bus-frequency"]')).toBe(`${sharing.result!.bus.frequencyHz.toFixed(3)} Hz`);

    // An edit: computing while the draft is checked and solved, settled after.
    const edited = plantStore.edit('sets[0].governor.droopPct', 5);
    await w.vm.$nextTick();
    expect(plantStore.checking).toBe(true);
    expect(view().attributes('data-state')).toBe('computing');
    await edited;
    await settle();
    expect(plantStore.checking).toBe(false);
    expect(view().attributes('data-state')).toBe('settled');
    expect(sharing.resultPlant).toBe(plantStore.plant);
  });

  it('recomputes at the slider’s load and shows flags as words beside icons', async () => {
    const sharing = useSharingStore();
    const slider = w.get('[data-test="load-slider"]');
    await slider.setValue('90');
    await settle();
    expect(sharing.loadPct).toBe(90);
    const plant = usePlantStore().plant!;
    const r = solveSharing(plant, loadAtPct(plant, 90));
    expect(text(w, '[data-test="bus-frequency"]')).toBe(`${r.bus.frequencyHz.toFixed(3)} Hz`);
    // 90 % of 2040 kW online = 1836 kW (closed form: sum of the online sets' rated kW).
    expect(text(w, '[data-test="load-readout"]')).toContain('2040 kW online = 1836 kW');
    // Take G3 down to a 2 % droop: at 90 % load it takes more than its share and reaches its limit.
    await usePlantStore().edit('sets[2].governor.droopPct', 2);
    await settle();
    const r2 = solveSharing(usePlantStore().plant!, loadAtPct(usePlantStore().plant!, 90));
    const g3 = r2.sets.find((s) => s.id === 'G3')!;
    expect(g3.flags.length).toBeGreaterThan(0);
    const flags = w.get('[data-test="share-row-G3"] [data-test="share-flags"]');
    expect(flags.findAll('svg').length).toBe(g3.flags.length);
    expect(flags.text()).toMatch(/kW overload|at max kW/);
    await w.get('[data-test="load-reset"]').trigger('click');
    await settle();
    expect(sharing.loadPct).toBeNull();
  });

  it('exports the table as CSV and as text carrying the engine’s numbers, units and the caution', () => {
    const sharing = useSharingStore();
    const r = sharing.result!;
    const csv = sharingCsv(r, 'Demo', sharing.totalPF, sharing.totalLoadingPct);
    const lines = csv.split('\r\n');
    expect(lines[1]).toBe(`bus frequency (Hz),${r.bus.frequencyHz.toFixed(4)}`);
    const head = lines.findIndex((l) => l.startsWith('Set,'));
    expect(lines[head]).toContain('Current (A)');
    const g1 = lines[head + 1]!.split(',');
    expect(g1[0]).toBe('G1');
    expect(g1[2]).toBe(r.sets[0]!.kW.toFixed(1));
    expect(g1[6]).toBe(r.sets[0]!.currentA.toFixed(1));
    expect(lines[head + 4]!.startsWith('Total,')).toBe(true);
    expect(csv).toContain('Planning and training only');
    const txt = sharingText(r, 'Demo', sharing.totalPF, sharing.totalLoadingPct);
    expect(txt).toContain(`Bus frequency ${r.bus.frequencyHz.toFixed(3)} Hz`);
    expect(txt.split('\n').find((l) => l.startsWith('G2'))).toContain(r.sets[1]!.kVAR.toFixed(1));
    expect(txt).toContain('Planning and training only');
  });

  it('says so when the plant has no operating point, without NaN', async () => {
    // Two sets holding voltage with neither droop nor cross-current: no defined kVAR split (README "Definitions", cross-current).
    await usePlantStore().edit('sets[0].regulator.mode', 'voltage');
    await usePlantStore().edit('sets[1].regulator.mode', 'voltage');
    await settle();
    expect(w.find('[data-test="sharing-error"]').exists()).toBe(true);
    expect(w.text()).not.toContain('NaN');
  });
});

describe('sharing store coalescing', () => {
  beforeEach(() => {
    freshStores();
  });

  it('sends only the newest slider position while a solve is running', async () => {
    await usePlantStore().loadDemo();
    const sharing = useSharingStore();
    await sharing.settled();
    const inner = directClient();
    const sent: (LoadOverride | undefined)[] = [];
    const gates: (() => void)[] = [];
    const client: EngineClient = {
      async call(method, request, options) {
        if (method === 'solveSharing') {
          sent.push((request as { load?: LoadOverride }).load);
          await new Promise<void>((go) => gates.push(go));
        }
        return inner.call(method, request, options);
      },
    };
    setEngineClient(client);
    for (const pct of [10, 20, 30, 40, 50]) void sharing.setLoadPct(pct);
    expect(sent).toHaveLength(1);
    gates.shift()?.();
    await new Promise((r) => setTimeout(r, 0));
    expect(sent).toHaveLength(2);
    gates.shift()?.();
    await sharing.settled();
    const plant: Plant = usePlantStore().plant!;
    expect(sent).toEqual([loadAtPct(plant, 10), loadAtPct(plant, 50)]);
    const r = solveSharing(plant, loadAtPct(plant, 50));
    expect(sharing.result?.bus.frequencyHz).toBe(r.bus.frequencyHz);
  });

  it('loadAtPct keeps the plant loads’ kVAR per kW', async () => {
    await usePlantStore().loadDemo();
    const plant = usePlantStore().plant!;
    const l = loadAtPct(plant, 50);
    // Demo: 2040 kW online; loads 1170 kW, 720 kVAR (closed form: sums of the demo file).
    expectClose(l.kW, 1020, { rel: 1e-12 }, 'kW');
    expectClose(l.kVAR, (1020 * 720) / 1170, { rel: 1e-12 }, 'kVAR');
  });
});
