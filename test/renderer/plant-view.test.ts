import { describe, it, expect, beforeEach } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import PlantView from '../../renderer/views/PlantView.vue';
import StatusBar from '../../renderer/components/StatusBar.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { describePlant } from '../../electron/engine';
import { freshStores } from './view-harness';
import { demoPlant, demoPlantJson } from '../helpers/plants';

describe('PlantView with the demo plant', () => {
  beforeEach(() => {
    freshStores();
  });

  it('shows the rated figures the engine computed', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const w = mount(PlantView);
    await flushPromises();
    const expected = describePlant(demoPlant());
    const speeds = w.findAll('[data-test="rated-speed"]').map((c) => c.text());
    expect(speeds).toEqual(expected.sets.map((s) => s.ratedSpeedRpm.toFixed(0)));
    const currents = w.findAll('[data-test="rated-current"]').map((c) => c.text());
    expect(currents).toEqual(expected.sets.map((s) => s.ratedCurrentA.toFixed(1)));
    expect(w.get('[data-test="online-kw"]').text()).toBe('2040');
  });

  it('keeps the last good plant and lists the field problems of a refused one', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const bad = demoPlantJson() as { sets: { ratedKVA: number }[] };
    bad.sets[2]!.ratedKVA = 0;
    expect(await store.load(bad, 'edited plant')).toBe(false);
    expect(store.plant?.sets[2]?.ratedKVA).toBe(500);
    const w = mount(PlantView);
    expect(w.text()).toContain('set 3, rated apparent power');
    expect(w.text()).toContain('must be greater than 0');
    const bar = mount(StatusBar);
    expect(bar.get('[data-test="status-plant"]').text()).toBe('Kestrel Ford Water Treatment Works (demo) · 50 Hz · 400 V');
  });
});
