import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import type { VueWrapper } from '@vue/test-utils';
import PlannerView from '../../renderer/views/PlannerView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { planInputProblem, usePlannerStore } from '../../renderer/stores/planner';
import { planDroop } from '../../electron/engine';
import { mountView, settle } from './view-harness';

describe('Planner view', () => {
  let w: VueWrapper;
  beforeEach(async () => {
    w = await mountView(PlannerView);
  });
  afterEach(() => w.unmount());

  it('defaults the bands from the plant ratings and shows the engine’s proposal beside today’s settings', async () => {
    const planner = usePlannerStore();
    // 400 V, 50 Hz demo plant: ±1 % frequency (common practice) and ±2.5 % voltage (ISO 8528-5 G2).
    expect(planner.hzBand).toEqual({ min: 49.5, max: 50.5 });
    expect(planner.vBand).toEqual({ min: 390, max: 410 });
    planner.loadRange = { min: 0, max: 95 };
    await w.get('[data-test="plan"]').trigger('submit');
    await settle();
    expect(w.get('section').attributes('data-plan-state')).toBe('done');
    const expected = planDroop({
      plant: usePlantStore().plant!,
      frequencyBandHz: planner.hzBand,
      voltageBandV: planner.vBand,
      loadRangePct: { min: 0, max: 95 },
      pf: 0.8,
    });
    expect(w.get('[data-test="plan-verdict"]').text()).toContain(expected.feasible ? 'holds both bands' : 'No setting');
    expect(w.get('[data-test="plan-table"]').text()).toContain(expected.settings[0]!.droopPct.toFixed(2));
    expect(w.get('[data-test="worst-error"]').text()).toContain(expected.proposal.worstKVARErrorPct!.toFixed(2));
    expect(w.text()).not.toContain('NaN');
  });

  it('applies the proposal as one undoable edit', async () => {
    const planner = usePlannerStore();
    const plant = usePlantStore();
    planner.loadRange = { min: 0, max: 95 };
    await planner.runPlan();
    await settle();
    const before = plant.plant!.sets[1]!.regulator.droopPct;
    await w.get('[data-test="apply"]').trigger('click');
    await settle();
    expect(plant.plant!.sets[1]!.regulator.droopPct).toBeCloseTo(planner.plan!.settings[1]!.reactiveDroopPct, 12);
    expect(w.get('[data-test="applied-note"]').text()).toContain('Undo');
    await plant.undo();
    await settle();
    expect(plant.plant!.sets[1]!.regulator.droopPct).toBe(before);
  });

  it('keeps the settings ticked under "Keep as they are" and plans the rest around them', async () => {
    const planner = usePlannerStore();
    planner.loadRange = { min: 0, max: 90 };
    planner.hzBand = { min: 49, max: 51 };
    await w.get('[data-test="keep-G2-droopPct"]').setValue(true);
    await planner.runPlan();
    await settle();
    // G2's speed droop is 4 % in the demo plant: every droop set gets 4 % to share in proportion.
    expect(planner.plan!.settings.map((s) => s.droopPct)).toEqual([4, 4, 4]);
  });

  it('draws the tolerance samples over the load range when asked', async () => {
    const planner = usePlannerStore();
    planner.tolerance.samples = 200;
    planner.loadRange = { min: 20, max: 80 };
    planner.toleranceOver = 'range';
    await planner.runTolerance();
    await settle();
    expect(planner.toleranceState).toBe('done');
    // Loading of G1 spreads over most of the 20–80 % range (it is drawn, not fixed).
    const g1 = planner.toleranceResult!.sets[0]!.loadingPct;
    expect(g1.max - g1.min).toBeGreaterThan(40);
  });

  it('refuses a band upside down with words, not field names, and keeps the plant', async () => {
    const planner = usePlannerStore();
    planner.hzBand = { min: 51, max: 49 };
    await planner.runPlan();
    await settle();
    expect(w.get('[data-test="plan-error"]').text()).toContain('Frequency band: the lower edge must be below the upper edge.');
    expect(planInputProblem({ min: 49, max: 51 }, { min: 390, max: 410 }, { min: 0, max: 100 }, 1.3)).toContain('Load power factor');
  });

  it('takes the frequency band through the number inputs and says beside an edge which rule it breaks', async () => {
    const planner = usePlannerStore();
    await w.get('[data-test="hz-min"]').setValue('-1');
    await settle();
    expect(planner.hzBand.min).toBe(-1);
    expect(w.get('[data-test="error-hz-min"]').text()).toBe('lowest bus frequency must be above 0 Hz');
    await w.get('[data-test="hz-min"]').setValue('49');
    await w.get('[data-test="hz-max"]').setValue('48.5');
    await settle();
    expect(planner.hzBand).toEqual({ min: 49, max: 48.5 });
    expect(w.find('[data-test="error-hz-min"]').exists()).toBe(false);
    expect(w.get('[data-test="error-hz-max"]').text()).toBe('highest bus frequency must be above the lowest edge');
    await w.get('[data-test="hz-max"]').setValue('abc');
    await settle();
    expect(w.get('[data-test="error-hz-max"]').text()).toBe('highest bus frequency must be a number');
    expect((w.get('[data-test="hz-max"]').element as HTMLInputElement).value).toBe('abc');
    await w.get('[data-test="hz-max"]').setValue('51');
    await settle();
    expect(planner.hzBand).toEqual({ min: 49, max: 51 });
    expect(w.find('[data-test="error-hz-max"]').exists()).toBe(false);
  });

  it('refuses unreadable or out-of-rule text in the power factor and samples fields beside the field, keeping the last good value', async () => {
    const planner = usePlannerStore();
    const pf = w.get('[data-test="pf"]');
    expect(pf.attributes('type')).toBe('text');
    await pf.setValue('abc');
    await settle();
    expect(planner.pf).toBe(0.8); // the last good value stays in the store
    expect(w.get('[data-test="error-pf"]').text()).toBe('load power factor must be a number');
    expect((pf.element as HTMLInputElement).value).toBe('abc'); // the text typed stays on show beside its reason
    expect(pf.attributes('aria-invalid')).toBe('true');
    // The plan is not run on the kept value while the field shows refused text.
    await w.get('[data-test="plan"]').trigger('submit');
    await settle();
    expect(planner.planState).toBe('error');
    expect(w.get('[data-test="plan-error"]').text()).toContain('load power factor must be a number');
    // Power factor is above 0 and at most 1 (closed form: cos φ).
    await pf.setValue('1.2');
    await settle();
    expect(planner.pf).toBe(0.8);
    expect(w.get('[data-test="error-pf"]').text()).toBe('load power factor must be above 0 and at most 1');
    await pf.setValue('0.9');
    await settle();
    expect(planner.pf).toBe(0.9);
    expect(w.find('[data-test="error-pf"]').exists()).toBe(false);

    const samples = w.get('[data-test="tol-samples"]');
    await samples.setValue('');
    await settle();
    expect(planner.tolerance.samples).toBe(10_000);
    expect(w.get('[data-test="error-tol-samples"]').text()).toBe('samples must be a number');
    await samples.setValue('2.5');
    await settle();
    expect(w.get('[data-test="error-tol-samples"]').text()).toBe('samples must be a whole number from 10 to 1 000 000');
    await w.get('[data-test="tol-run"]').trigger('submit');
    await settle();
    expect(planner.toleranceState).toBe('error');
    expect(planner.toleranceError).toContain('samples must be a whole number');
    // A value from elsewhere replaces the refused text, and its reason goes with it.
    planner.tolerance.samples = 500;
    await settle();
    expect(w.find('[data-test="error-tol-samples"]').exists()).toBe(false);
    expect((samples.element as HTMLInputElement).value).toBe('500');
    expect(w.text()).not.toContain('NaN');
  });

  it('takes the voltage band and load range through number inputs with their units and steps', async () => {
    const planner = usePlannerStore();
    await w.get('[data-test="v-min"]').setValue('-5');
    await settle();
    expect(planner.vBand.min).toBe(390);
    expect(w.get('[data-test="error-v-min"]').text()).toBe('lowest bus voltage must be above 0 V');
    await w.get('[data-test="load-max"]').setValue('250');
    await settle();
    expect(planner.loadRange.max).toBe(100);
    expect(w.get('[data-test="error-load-max"]').text()).toBe('heaviest load must be from 0 to 200 %');
    // Up steps the field by its step (5 %) and the store takes it.
    const from = w.get('[data-test="load-min"]');
    await from.trigger('focus');
    await from.trigger('keydown', { key: 'ArrowUp' });
    await settle();
    expect(planner.loadRange.min).toBe(5);
    expect(w.get('label:has([data-test="load-max"])').text()).toContain('% of online rated kW');
  });

  it('marks the largest sensitivity entries in words', async () => {
    await w.get('[data-test="sensitivity"]').trigger('click');
    await settle();
    expect(w.get('[data-test="sens-kWPerSpeed"]').text()).toContain('(largest)');
    expect(w.get('[data-test="sens-kVARPerVoltage"]').text()).toContain('(largest)');
  });

  it('runs the tolerance analysis with progress to the end and shows the statistics', async () => {
    const planner = usePlannerStore();
    planner.tolerance.samples = 300;
    await planner.runTolerance();
    await settle();
    expect(planner.toleranceState).toBe('done');
    expect(w.get('[data-test="tol-table"]').text()).toContain('Bus frequency, Hz');
    expect(w.get('[data-test="tol-probabilities"]').text()).toContain('exceeds its rating');
    expect(w.text()).not.toContain('NaN');
  });
});
