import { describe, it, expect, beforeEach } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import ScenarioEditor from '../../renderer/components/transients/ScenarioEditor.vue';
import TransientsView from '../../renderer/views/TransientsView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { useTransientsStore } from '../../renderer/stores/transients';
import { scenarioIssues } from '../../renderer/stores/transients-rules';
import { freshStores } from './view-harness';
import { demoPlant } from '../helpers/plants';

async function ready() {
  freshStores();
  await usePlantStore().loadDemo();
  const store = useTransientsStore();
  store.ensureScenarios();
  return store;
}

describe('ScenarioEditor validation', () => {
  beforeEach(async () => {
    await ready();
  });

  it('starts with valid starter scenarios on the demo plant', () => {
    const store = useTransientsStore();
    expect(store.scenarios.map((s) => s.id)).toEqual(['block-load', 'set-trip']);
    expect(store.issues).toEqual([]);
    expect(store.canRun).toBe(true);
  });

  it('names the field and the rule for blank and out-of-range inputs, and turns Run off', async () => {
    const w = mount(TransientsView);
    await flushPromises();
    await w.get('[data-test="scenario-duration"]').setValue('');
    await w.get('[data-test="event-kW"]').setValue('');
    const text = w.get('[data-test="scenario-issues"]').text();
    expect(text).toContain('length: must be a number');
    expect(text).toContain('event 1, active power: must be a number');
    expect(w.get('[data-test="run"]').attributes('disabled')).toBeDefined();
    await w.get('[data-test="scenario-duration"]').setValue('5');
    await w.get('[data-test="event-at"]').setValue('7');
    expect(w.get('[data-test="scenario-issues"]').text()).toContain('event 1, time: must be before the end of the run (5 s)');
    await w.get('[data-test="scenario-step"]').setValue('50');
    expect(w.get('[data-test="scenario-issues"]').text()).toContain('time step: must be at most 20 ms');
  });

  it('adds, retypes and removes events; checks set ids against the plant', async () => {
    const store = useTransientsStore();
    const w = mount(ScenarioEditor);
    await w.get('[data-test="event-add-type"]').setValue('motor-start');
    await w.get('[data-test="event-add"]').trigger('click');
    expect(store.selected!.events.map((e) => e.type)).toEqual(['load-step', 'motor-start']);
    expect(w.findAll('[data-test="timeline-mark-1"]').length).toBe(1);
    await w.get('[data-test="event-pf"]').setValue('1.4');
    expect(w.get('[data-test="scenario-issues"]').text()).toContain('event 2, power factor: must be at most 1');
    await w.findAll('[data-test="event-type"]')[1]!.setValue('trip');
    expect(store.selected!.events[1]).toMatchObject({ type: 'trip', setId: 'G1' });
    store.updateEvent(1, { atS: 2, type: 'trip', setId: 'G9' });
    await flushPromises();
    expect(w.get('[data-test="scenario-issues"]').text()).toContain('event 2, set: "G9" is not a set of the plant');
    await w.findAll('[data-test="event-remove"]')[1]!.trigger('click');
    expect(store.selected!.events.length).toBe(1);
    expect(w.find('[data-test="scenario-issues"]').exists()).toBe(false);
  });

  it("switches one of the plant's loads instead of adding a block", async () => {
    const store = useTransientsStore();
    const w = mount(ScenarioEditor);
    await w.get('[data-test="event-loadId"]').setValue('L2');
    expect(store.selected!.events[0]).toEqual({ atS: 1, type: 'load-step', loadId: 'L2', online: true });
    expect(w.find('[data-test="event-kW"]').exists()).toBe(false);
    await w.get('[data-test="event-online"]').setValue('off');
    expect(store.selected!.events[0]).toMatchObject({ loadId: 'L2', online: false });
    expect(store.issues).toEqual([]);
    await w.get('[data-test="event-loadId"]').setValue('');
    expect(store.selected!.events[0]).toEqual({ atS: 1, type: 'load-step', kW: 100, kVAR: 75 });
  });

  it('moves an event along the time line with the arrow keys and keeps events in time order', async () => {
    const store = useTransientsStore();
    const w = mount(ScenarioEditor);
    store.addEvent('trip');
    await flushPromises();
    expect(store.selected!.events.map((e) => e.atS)).toEqual([1, 2]);
    // Each arrow press moves 1 % of the 12 s run: 0.12 s.
    for (let k = 0; k < 9; k++) await w.get('[data-test="timeline-mark-0"]').trigger('keydown', { key: 'ArrowRight' });
    expect(store.selected!.events.map((e) => e.type)).toEqual(['trip', 'load-step']);
    expect(store.selected!.events[1]!.atS).toBeCloseTo(2.08, 9);
  });

  it('checks every event type', () => {
    const plant = demoPlant();
    const issues = scenarioIssues(
      {
        id: 'x',
        name: ' ',
        durationS: 10,
        stepMs: 1,
        events: [
          { atS: -1, type: 'load-step', kW: 0, kVAR: 0 },
          { atS: 1, type: 'close', setId: 'G2', angleDeg: 270 },
          { atS: 1, type: 'setpoint', setId: 'G1' },
          { atS: 1, type: 'ramp', setId: '', toKW: 100, durationS: 0 },
          { atS: 1, type: 'motor-start', kVA: -5, pf: 0.3, durationS: 2 },
          { atS: 1, type: 'load-step', loadId: 'L9', online: false },
        ],
      },
      plant,
    );
    expect(issues.map((i) => `${i.path}: ${i.message}`)).toEqual([
      'name: must not be empty',
      'events[0].atS: must be 0 or more',
      'events[0].kW: a load step of 0 kW and 0 kVAR does nothing',
      'events[1].angleDeg: must be at most 180',
      'events[2].frequencyHz: give a new frequency, voltage or kW',
      'events[3].setId: must name a set',
      'events[3].durationS: must be greater than 0',
      'events[4].kVA: must be greater than 0',
      'events[5].loadId: "L9" is not a load of the plant',
    ]);
  });

  it('keeps scenarios with the project through snapshot and restore', () => {
    const store = useTransientsStore();
    const snap = store.snapshot();
    store.selected!.events[0]!.atS = 3;
    expect(snap[0]!.events[0]!.atS).toBe(1);
    store.restore([{ id: 'only', name: 'Only', durationS: 4, stepMs: 2, events: [] }]);
    expect(store.selectedId).toBe('only');
    expect(store.snapshot()).toEqual([{ id: 'only', name: 'Only', durationS: 4, stepMs: 2, events: [] }]);
  });
});
