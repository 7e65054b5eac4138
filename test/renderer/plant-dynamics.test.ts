/** The set sheet's "Advanced: dynamics" section: every simulator constant a user may change, units, typical ranges, the derived field ceiling and refused values with their reason. */
import { describe, it, expect, beforeEach } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import PlantView from '../../renderer/views/PlantView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { fieldCeiling } from '../../electron/engine';
import { freshStores } from './view-harness';
import { demoPlant } from '../helpers/plants';

describe('Advanced: dynamics section', () => {
  beforeEach(() => {
    freshStores();
  });

  it('shows governor, regulator, machine and protection constants with units and typical ranges', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    const g = w.get('[data-test="group-dynamics"]');
    expect(g.text()).toContain('Advanced: dynamics');
    for (const key of [
      'governor.engineLagS',
      'governor.isoGainPU',
      'regulator.gainPU',
      'regulator.resetS',
      'regulator.pfTrimS',
      'regulator.ceilingPU',
      'regulator.vhzKneeBelowHz',
      'regulator.oelPct',
      'regulator.oelResetS',
      'machine.dampingPU',
      'machine.tddopS',
      'protection.underFrequencyPct',
      'protection.overVoltageDelayS',
    ]) {
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

  it("refuses a T''d0 not below T'd0 with the reason beside it", async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    await store.edit('sets[0].machine.tdopS', 0.2);
    await flushPromises();
    const input = w.get('[data-test="field-sets[0].machine.tddopS"]');
    await input.trigger('focus');
    await input.setValue('0.3');
    await flushPromises();
    expect(w.text()).toContain("must be less than T'd0");
    expect(store.plant?.sets[0]?.machine.tddopS).toBe(0.03);
  });
});

describe('load table: voltage law (ZIP) and under-frequency shedding', () => {
  beforeEach(() => {
    freshStores();
  });

  it('edits the ZIP shares, shows the constant-power rest, and refuses shares over 100 % by name', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    await store.edit('loads[0].model', 'zip');
    await flushPromises();
    const z = w.get('[data-test="field-loads[0].kWImpedancePct"]');
    await z.trigger('focus');
    await z.setValue('30');
    await flushPromises();
    const i = w.get('[data-test="field-loads[0].kWCurrentPct"]');
    await i.trigger('focus');
    await i.setValue('20');
    await flushPromises();
    expect(store.plant?.loads[0]?.kWImpedancePct).toBe(30);
    expect(store.plant?.loads[0]?.kWCurrentPct).toBe(20);
    expect(w.get('[data-test="load-kw-power-share-0"]').text()).toBe('50.0');
    await i.setValue('80');
    await flushPromises();
    expect(w.text()).toContain('with kWImpedancePct must not exceed 100 %');
    expect(store.plant?.loads[0]?.kWCurrentPct).toBe(20);
  });

  it('edits the shedding stage with its frequency in Hz, refuses 100 % and empties back to never', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    const f = w.get('[data-test="field-loads[0].shedFrequencyPct"]');
    await f.trigger('focus');
    await f.setValue('97');
    await flushPromises();
    expect(store.plant?.loads[0]?.shedFrequencyPct).toBe(97);
    const hz = store.plant!.ratedFrequencyHz;
    expect(w.get('[data-test="load-shed-hz-0"]').text()).toBe(`(${(0.97 * hz).toFixed(2)} Hz)`);
    await f.setValue('100');
    await flushPromises();
    expect(w.text()).toContain('must be below 100 %');
    expect(store.plant?.loads[0]?.shedFrequencyPct).toBe(97);
    await f.setValue('');
    await flushPromises();
    expect(store.plant?.loads[0]?.shedFrequencyPct).toBeUndefined();
    expect(w.get('[data-test="load-shed-hz-0"]').text()).toBe('(never shed)');
  });
});
