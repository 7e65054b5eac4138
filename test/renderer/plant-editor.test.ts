import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import type { VueWrapper } from '@vue/test-utils';
import PlantView from '../../renderer/views/PlantView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { useSharingStore } from '../../renderer/stores/sharing';
import { solveSharing } from '../../electron/engine';
import { cableImpedance } from '../../shared-types';
import { mountView, settle as settleOn } from './view-harness';
import { expectClose } from '../helpers/expect-close';

const field = (w: VueWrapper, path: string) => w.get(`[data-test="field-${path}"]`);
/** The reason shown in the same field wrapper as the input at `path`, or null. */
const reasonBeside = (w: VueWrapper, path: string) =>
  field(w, path).element.parentElement?.querySelector('[data-test="field-issue"]')?.textContent?.trim() ?? null;

const settle = () => settleOn(useSharingStore());

describe('Plant editor', () => {
  let w: VueWrapper;
  beforeEach(async () => {
    w = await mountView(PlantView, { settleOn: useSharingStore });
  });
  afterEach(() => w.unmount());

  it('shows the engine reason right beside a refused field and keeps the last valid plant computing', async () => {
    const store = usePlantStore();
    const lastGood = store.plant;
    await field(w, 'sets[1].governor.droopPct').setValue('0');
    await settle();
    expect(reasonBeside(w, 'sets[1].governor.droopPct')).toBe('must be greater than 0 in droop mode');
    expect(field(w, 'sets[1].governor.droopPct').attributes('aria-invalid')).toBe('true');
    expect(reasonBeside(w, 'sets[0].governor.droopPct')).toBeNull();
    expect(w.get('[data-test="edit-state"]').text()).toContain('1 field is refused');
    expect(store.plant).toBe(lastGood);
    // The operating point shown is still the engine's for the last valid plant.
    const expected = solveSharing(lastGood!);
    expect(w.get('[data-test="result-kw-1"]').text()).toBe(expected.sets[1]!.kW.toFixed(1));
  });

  it('names unreadable and empty numbers by the schema rule', async () => {
    await field(w, 'sets[0].ratedKVA').setValue('abc');
    await settle();
    expect(reasonBeside(w, 'sets[0].ratedKVA')).toBe('must be a number (kVA)');
    await field(w, 'ratedVoltageV').setValue('');
    await settle();
    expect(reasonBeside(w, 'ratedVoltageV')).toBe('must be a number (V)');
    await field(w, 'ratedVoltageV').setValue('400');
    await field(w, 'sets[0].ratedKVA').setValue('900');
    await settle();
    // 1000 kW on 900 kVA breaks the cross-field rule of the plant schema.
    // The screens speak in words: the engine's "must not exceed ratedKVA" reads as below.
    expect(reasonBeside(w, 'sets[0].ratedKW')).toBe('must not exceed rated apparent power');
  });

  it('shows the operating point the engine computes for each edit', async () => {
    const store = usePlantStore();
    await field(w, 'sets[0].governor.droopPct').setValue('5');
    await settle();
    expect(store.plant?.sets[0]?.governor.droopPct).toBe(5);
    const r = solveSharing(store.plant!);
    for (let i = 0; i < 3; i++) {
      expect(w.get(`[data-test="result-kw-${i}"]`).text()).toBe(r.sets[i]!.kW.toFixed(1));
      expect(w.get(`[data-test="result-kvar-${i}"]`).text()).toBe(r.sets[i]!.kVAR.toFixed(1));
      expect(w.get(`[data-test="result-loading-${i}"]`).text()).toBe(r.sets[i]!.loadingPct.toFixed(1));
    }
    expect(w.get('[data-test="plant-bus"]').text()).toContain(`${r.bus.frequencyHz.toFixed(3)} Hz`);
  });

  it('undoes with Ctrl+Z and redoes with Ctrl+Shift+Z, the field showing each value', async () => {
    await field(w, 'sets[2].governor.noLoadHz').setValue('51.4');
    await settle();
    expect(usePlantStore().plant?.sets[2]?.governor.noLoadHz).toBe(51.4);
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 'z', ctrlKey: true }));
    await settle();
    expect((field(w, 'sets[2].governor.noLoadHz').element as HTMLInputElement).value).toBe('51.1');
    expect(usePlantStore().plant?.sets[2]?.governor.noLoadHz).toBe(51.1);
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 'Z', ctrlKey: true, shiftKey: true }));
    await settle();
    expect((field(w, 'sets[2].governor.noLoadHz').element as HTMLInputElement).value).toBe('51.4');
    // Ctrl+Z typed in a text field outside the Plant view is that field's own undo.
    const elsewhere = document.createElement('input');
    document.body.appendChild(elsewhere);
    elsewhere.dispatchEvent(new KeyboardEvent('keydown', { key: 'z', ctrlKey: true, bubbles: true }));
    await settle();
    expect(usePlantStore().plant?.sets[2]?.governor.noLoadHz).toBe(51.4);
    elsewhere.remove();
    await w.get('[data-test="undo"]').trigger('click');
    await settle();
    expect(usePlantStore().plant?.sets[2]?.governor.noLoadHz).toBe(51.1);
  });

  it('adds, duplicates, moves, takes offline and removes sets', async () => {
    const store = usePlantStore();
    const ids = () => store.plant?.sets.map((s) => s.id);
    await w.get('[data-test="add-set"]').trigger('click');
    await settle();
    expect(ids()).toEqual(['G1', 'G2', 'G3', 'G4']);
    await w.get('[data-test="set-duplicate-0"]').trigger('click');
    await settle();
    expect(ids()).toEqual(['G1', 'G5', 'G2', 'G3', 'G4']);
    await w.get('[data-test="set-right-0"]').trigger('click');
    await settle();
    expect(ids()).toEqual(['G5', 'G1', 'G2', 'G3', 'G4']);
    await w.get('[data-test="set-remove-0"]').trigger('click');
    await w.get('[data-test="set-remove-3"]').trigger('click');
    await settle();
    expect(ids()).toEqual(['G1', 'G2', 'G3']);
    await field(w, 'sets[2].online').setValue(false);
    await settle();
    expect(store.plant?.sets[2]?.online).toBe(false);
    const r = solveSharing(store.plant!);
    expect(r.sets[2]?.flags).toContain('offline');
    expect(w.get('[data-test="result-kw-0"]').text()).toBe(r.sets[0]!.kW.toFixed(1));
  });

  it('shows rated speed n = 120 f / poles from the engine', async () => {
    // 4 poles at 50 Hz: 1500 rpm; 6 poles: 1000 rpm (closed form).
    expect(w.get('[data-test="speed-0"]').text()).toBe('1500');
    await field(w, 'sets[0].poles').setValue('6');
    await settle();
    expect(w.get('[data-test="speed-0"]').text()).toBe('1000');
  });

  it('switching to 60 Hz scales the frequency setpoints (one undo step)', async () => {
    await w.get('[data-test="field-ratedFrequencyHz"]').setValue('60');
    await settle();
    const store = usePlantStore();
    expect(store.plant?.ratedFrequencyHz).toBe(60);
    // 51.2 / 50 × 60 = 61.44 Hz (closed form).
    expectClose(store.plant?.sets[0]?.governor.noLoadHz ?? NaN, 61.44, { abs: 1e-9 }, 'noLoadHz');
    await store.undo();
    expect(store.plant?.ratedFrequencyHz).toBe(50);
    expect(store.plant?.sets[0]?.governor.noLoadHz).toBe(51.2);
  });

  it('fills typical machine data and writes a cable’s R and X into the feeder', async () => {
    const store = usePlantStore();
    await field(w, 'sets[1].machine.xdPU').setValue('9');
    await w.get('[data-test="typical-1"]').trigger('click');
    await settle();
    expect(store.plant?.sets[1]?.machine.xdPU).toBe(2.5);
    await w.get('[data-test="cable-1"]').trigger('click');
    await w.get('[data-test="cable-length"]').setValue('120');
    await w.get('[data-test="cable-size"]').setValue('185');
    await w.get('[data-test="cable-runs"]').setValue('3');
    const z = cableImpedance({ lengthM: 120, sizeMM2: 185, runs: 3, conductorC: 70, frequencyHz: 50 });
    if (!z.ok) throw new Error(z.message);
    await w.get('[data-test="cable-apply"]').trigger('click');
    await settle();
    expectClose(store.plant?.sets[1]?.feeder.rOhm ?? NaN, z.rOhm, { rel: 1e-3 }, 'R');
    expectClose(store.plant?.sets[1]?.feeder.xOhm ?? NaN, z.xOhm, { rel: 1e-3 }, 'X');
    expect(w.find('[data-test="cable-helper"]').exists()).toBe(false);
  });

  it('enters a load as kVA and power factor and stores kW and kVAR', async () => {
    const store = usePlantStore();
    await w.get('[data-test="load-entry-1"]').setValue('pf');
    await w.get('[data-test="load-kva-input-1"]').setValue('500');
    await settle();
    // L2 is 260 kW, 150 kVAR: PF = 260 / √(260² + 150²) = 0.86618; at 500 kVA, kW = 500 × PF (closed form).
    const pf = 260 / Math.hypot(260, 150);
    expectClose(store.plant?.loads[1]?.kW ?? NaN, 500 * pf, { rel: 1e-9 }, 'kW');
    expectClose(store.plant?.loads[1]?.kVAR ?? NaN, 500 * Math.sqrt(1 - pf * pf), { rel: 1e-9 }, 'kVAR');
    await w.get('[data-test="load-pf-input-1"]').setValue('0.8');
    await settle();
    expectClose(store.plant?.loads[1]?.kW ?? NaN, 400, { rel: 1e-9 }, 'kW at PF 0.8');
    expectClose(store.plant?.loads[1]?.kVAR ?? NaN, 300, { rel: 1e-9 }, 'kVAR at PF 0.8');
    await w.get('[data-test="load-sense-1"]').setValue('lead');
    await settle();
    expectClose(store.plant?.loads[1]?.kVAR ?? NaN, -300, { rel: 1e-9 }, 'kVAR leading');
    await w.get('[data-test="load-pf-input-1"]').setValue('1.3');
    await settle();
    expect(w.get('[data-test="load-pf-input-1"]').element.parentElement?.textContent).toContain('must be a number from 0 to 1');
    expectClose(store.plant?.loads[1]?.kVAR ?? NaN, -300, { rel: 1e-9 }, 'kVAR kept');
  });
});
