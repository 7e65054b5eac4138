/** The set sheet's "Advanced: dynamics" section: every simulator constant a user may change, units, typical ranges, the derived field ceiling and refused values with their reason. */
import { describe, it, expect, beforeEach } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import PlantView from '../../renderer/views/PlantView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { setEngineClient } from '../../renderer/transport';
import { fieldCeiling } from '../../electron/engine';
import { directClient } from '../helpers/direct-client';
import { demoPlant } from '../helpers/plants';

describe('Advanced: dynamics section', () => {
  beforeEach(() => {
    setActivePinia(createPinia());
    setEngineClient(directClient());
  });

  it('shows governor, regulator, machine and protection constants with units and typical ranges', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    const g = w.get('[data-test="group-dynamics"]');
    expect(g.text()).toContain('Advanced: dynamics');
    for (const key of ['governor.engineLagS', 'regulator.gainPU', 'regulator.ceilingPU', 'regulator.vhzKneeBelowHz', 'regulator.oelPct', 'machine.dampingPU', 'protection.underFrequencyPct', 'protection.overVoltageDelayS']) {
      expect(g.find(`[data-test="field-sets[0].${key}"]`).exists(), key).toBe(true);
    }
    expect(g.text()).toContain('Under-frequency 81U pickup');
    expect(g.text()).toContain('% f');
    expect(g.text()).toContain('90–96');
    // The derived ceiling with its reason, as the engine computes it for the demo plant's first set.
    const fc = fieldCeiling(demoPlant().sets[0]!);
    const cell = w.get('[data-test="ceiling-0"]');
    expect(cell.text()).toContain(`${fc.ceilingPU.toFixed(2)} / ${fc.ratedFieldPU.toFixed(2)}`);
    expect(cell.text()).toContain(fc.derived ? 'derived' : 'set in the plant file');
  });

  it('refuses an over-frequency pickup below 100 % with the reason beside it and keeps the last good plant', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    const input = w.get('[data-test="field-sets[0].protection.overFrequencyPct"]');
    await input.trigger('focus');
    await input.setValue('95');
    await flushPromises();
    expect(w.text()).toContain('must be 0 (off) or from 100 to 150 %');
    expect(store.plant?.sets[0]?.protection?.overFrequencyPct).toBe(108);
  });

  it('an emptied field ceiling goes back to the derived one', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    await store.edit('sets[0].regulator.ceilingPU', 2.5);
    expect(store.plant?.sets[0]?.regulator.ceilingPU).toBe(2.5);
    await store.edit('sets[0].regulator.ceilingPU', null);
    expect(store.plant?.sets[0]?.regulator.ceilingPU).toBeUndefined();
    expect(store.description?.sets[0]?.fieldCeilingDerived).toBe(true);
  });
});
