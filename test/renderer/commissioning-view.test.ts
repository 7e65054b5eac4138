import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import type { VueWrapper } from '@vue/test-utils';
import CommissioningView from '../../renderer/views/CommissioningView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { guessTest, useCommissioningStore } from '../../renderer/stores/commissioning';
import { mountView, settle } from './view-harness';

describe('Commissioning view', () => {
  let w: VueWrapper;
  beforeEach(async () => {
    w = await mountView(CommissioningView);
  });
  afterEach(() => w.unmount());

  it('refuses a malformed file in the dialog with the line, and imports nothing', async () => {
    const store = useCommissioningStore();
    await store.openText('bad.csv', 'time_s,frequency_Hz,voltage_V\n0,50,400\n0.1,abc,400\n');
    await settle();
    expect(w.get('[data-test="import-error"]').text()).toContain('line 3: frequency ("frequency_Hz"): "abc" is not a number');
    expect(w.get('[data-test="import-accept"]').attributes('disabled')).toBeDefined();
    expect(store.parsed).toBeNull();
  });

  it('imports the example record, fits it, shows the verdict and applies the values as one undoable edit', { timeout: 120_000 }, async () => {
    const store = useCommissioningStore();
    const plant = usePlantStore();
    await w.get('[data-test="record-example"]').trigger('click');
    await settle();
    expect(w.get('[data-test="import-ok"]').text()).toContain('401 samples over 8 s');
    await w.get('[data-test="import-accept"]').trigger('click');
    await settle();
    expect(store.test).toMatchObject({ setId: 'G1', startKW: 250, stepKW: 500, stepAtS: 2.01 });
    // Two parameters keep the component test quick; the engine tests fit four.
    for (const p of store.params) p.chosen = p.key === 'machine.inertiaS' || p.key === 'governor.engineLagS';
    await settle();
    await w.get('form').trigger('submit');
    await settle();
    expect(store.fitState).toBe('done');
    expect(w.get('[data-test="fit-values"]').text()).toContain('inertia constant H');
    expect(w.get('[data-test="measured-verdict"]').text()).toContain('class G2');
    expect(w.text()).not.toContain('NaN');
    const before = plant.plant!.sets[0]!.machine.inertiaS;
    const fitted = store.fit!.parameters.find((p) => p.key === 'machine.inertiaS')!.value;
    await w.get('[data-test="fit-apply"]').trigger('click');
    await settle();
    expect(plant.plant!.sets[0]!.machine.inertiaS).toBeCloseTo(fitted, 4);
    expect(plant.plant!.sets[0]!.governor.engineLagS).not.toBe(0.3);
    await plant.undo();
    await settle();
    expect(plant.plant!.sets[0]!.machine.inertiaS).toBe(before);
    expect(plant.plant!.sets[0]!.governor.engineLagS).toBe(0.3);
  });

  it('refuses unreadable or out-of-rule text in the test, bound and cap fields beside the field, keeping the last good value', async () => {
    const store = useCommissioningStore();
    await w.get('[data-test="record-example"]').trigger('click');
    await settle();
    await w.get('[data-test="import-accept"]').trigger('click');
    await settle();
    expect(store.fitProblems).toEqual([]);
    const step = w.get('[data-test="test-step-kw"]');
    expect(step.attributes('type')).toBe('text');
    await step.setValue('abc');
    await settle();
    expect(store.test.stepKW).toBe(500); // the example's step stays in the store
    expect(w.get('[data-test="error-test-step-kw"]').text()).toBe('load step must be a number');
    expect((step.element as HTMLInputElement).value).toBe('abc');
    // The fit waits, and says why.
    expect(w.get('[data-test="fit-run"]').attributes('disabled')).toBeDefined();
    expect(w.get('[data-test="fit-problems"]').text()).toContain('Correct the marked field first: load step must be a number.');
    await step.setValue('400');
    await settle();
    expect(store.test.stepKW).toBe(400);
    expect(w.find('[data-test="error-test-step-kw"]').exists()).toBe(false);

    const cap = w.get('[data-test="fit-cap"]');
    await cap.setValue('0');
    await settle();
    expect(store.maxIterations).toBe(30);
    expect(w.get('[data-test="error-fit-cap"]').text()).toBe('iteration cap must be a whole number from 1 to 200');
    await cap.setValue('40');
    await settle();
    expect(store.maxIterations).toBe(40);

    // A bound outside the parameter's own limits (inertia constant H: 0.05 to 30 s in FIT_PARAMETERS) is refused by name.
    const lowH = w.get('[data-test="param-machine.inertiaS-min"]');
    expect(lowH.attributes('aria-label')).toBe('lowest inertia constant H');
    await lowH.setValue('0.01');
    await settle();
    expect(w.get('[data-test="error-param-machine.inertiaS-min"]').text()).toBe('lowest inertia constant H must be from 0.05 to 30 s');
    await lowH.setValue('');
    await settle();
    expect(store.params.find((p) => p.key === 'machine.inertiaS')!.min).toBe(0.3);
    expect(w.get('[data-test="error-param-machine.inertiaS-min"]').text()).toBe('lowest inertia constant H must be a number');
    // Each bound keeps its own rule; the two together are checked before a fit, in words.
    await w.get('[data-test="param-machine.inertiaS-max"]').setValue('0.2');
    await settle();
    expect(store.params.find((p) => p.key === 'machine.inertiaS')!.max).toBe(0.2);
    expect(w.get('[data-test="fit-problems"]').text()).toContain('Parameters: the highest inertia constant H must be above its lowest.');
    // A parameter not chosen keeps its bounds but they cannot be edited.
    store.params.find((p) => p.key === 'machine.inertiaS')!.chosen = false;
    await settle();
    expect(lowH.attributes('disabled')).toBeDefined();
    expect(w.text()).not.toContain('NaN');
  });

  it('makes the commissioning record with the sign-off and the caution', async () => {
    const store = useCommissioningStore();
    store.recordSetId = 'G3';
    store.signOff = { by: 'R. Tester', date: '2026-12-02', remarks: 'witnessed' };
    await w.get('[data-test="record-build"]').trigger('submit');
    await settle();
    const text = w.get('[data-test="record"]').text();
    expect(text).toContain('Caution');
    expect(text).toContain('R. Tester');
    expect(text).toContain('51.10'); // G3's no-load frequency in the demo plant
    expect(store.record!.csv.startsWith('# Caution:')).toBe(true);
  });

  it('guesses the step from the kW column: halfway between the samples either side of the jump', () => {
    const g = guessTest({
      record: { tS: [0, 1, 2, 3], frequencyHz: [50, 50, 50, 50], voltageV: [400, 400, 400, 400], kW: [100, 100, 400, 400], kVAR: [50, 50, 250, 250] },
      rows: 4,
      skippedLines: 0,
      notes: [],
    });
    expect(g).toEqual({ stepAtS: 1.5, startKW: 100, stepKW: 300, startKVAR: 50, stepKVAR: 200 });
  });
});
