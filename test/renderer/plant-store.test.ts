import { describe, it, expect, beforeEach } from 'vitest';
import { usePlantStore } from '../../renderer/stores/plant';
import { keepDemoCheck, setEngineClient } from '../../renderer/transport';
import { useSharingStore } from '../../renderer/stores';
import type { EngineClient } from '../../renderer/transport';
import { directClient } from '../helpers/direct-client';
import { freshStores } from './view-harness';
import { demoPlantJson } from '../helpers/plants';

/** A client whose `validatePlant` answers wait until released, to reorder replies. */
function gatedClient(): { client: EngineClient; release(): void; pending(): number } {
  const inner = directClient();
  const waiting: (() => void)[] = [];
  const client: EngineClient = {
    async call(method, request, options) {
      if (method === 'validatePlant') await new Promise<void>((go) => waiting.push(go));
      return inner.call(method, request, options);
    },
  };
  return { client, release: () => waiting.shift()?.(), pending: () => waiting.length };
}

describe('plant store editing', () => {
  beforeEach(() => {
    freshStores();
  });

  it('accepts a valid edit: the plant follows, revision counts up, dirty is set', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const rev = store.revision;
    expect(store.dirty).toBe(false);
    await store.edit('sets[1].governor.droopPct', 5);
    expect(store.plant?.sets[1]?.governor.droopPct).toBe(5);
    expect(store.revision).toBe(rev + 1);
    expect(store.dirty).toBe(true);
    store.markSaved();
    expect(store.dirty).toBe(false);
  });

  it('refuses an invalid edit with the field and rule, and keeps computing from the last valid plant', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const before = store.plant;
    const rev = store.revision;
    await store.edit('sets[1].governor.droopPct', 0);
    expect(store.plant).toBe(before);
    expect(store.revision).toBe(rev);
    // The rule comes from the plant schema's cross-field check (plant-schema.ts).
    expect(store.draftIssues).toEqual([{ path: 'sets[1].governor.droopPct', message: 'must be greater than 0 in droop mode' }]);
    expect(store.issueAt('sets[1].governor.droopPct')).toBe('must be greater than 0 in droop mode');
    expect(store.error).toContain('results are from the last valid plant');
    await store.edit('sets[1].governor.droopPct', 3);
    expect(store.draftIssues).toEqual([]);
    expect(store.plant?.sets[1]?.governor.droopPct).toBe(3);
    expect(store.error).toBeNull();
  });

  it('names an emptied field by its path', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    await store.edit('sets[0].ratedKVA', null);
    expect(store.issueAt('sets[0].ratedKVA')).toBe('must be a number (kVA)');
  });

  it('makes successive keystrokes in one field a single undo step, and undo/redo walk the history', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    await store.edit('sets[0].governor.droopPct', 5);
    await store.edit('sets[0].governor.droopPct', 5.5);
    store.closeStep();
    await store.edit('sets[0].ratedKW', 900);
    expect(store.canUndo).toBe(true);
    await store.undo();
    expect(store.plant?.sets[0]?.ratedKW).toBe(1000);
    expect(store.plant?.sets[0]?.governor.droopPct).toBe(5.5);
    await store.undo();
    expect(store.plant?.sets[0]?.governor.droopPct).toBe(4);
    expect(store.canUndo).toBe(false);
    await store.redo();
    expect(store.plant?.sets[0]?.governor.droopPct).toBe(5.5);
    await store.redo();
    expect(store.plant?.sets[0]?.ratedKW).toBe(900);
    expect(store.canRedo).toBe(false);
    // A new edit after undo drops the redo branch.
    await store.undo();
    await store.edit('name', 'Renamed works');
    expect(store.canRedo).toBe(false);
  });

  it('undo returns from an invalid draft to the valid one', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    await store.edit('ratedVoltageV', -1);
    expect(store.issueAt('ratedVoltageV')).toBe('must be 100 V or more');
    await store.undo();
    expect(store.draftIssues).toEqual([]);
    expect(store.draft?.ratedVoltageV).toBe(400);
  });

  it('load() restarts the history; a refused file leaves plant, draft and history alone', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    await store.edit('sets[0].ratedKW', 900);
    const bad = demoPlantJson() as { ratedFrequencyHz: number };
    bad.ratedFrequencyHz = 55;
    expect(await store.load(bad, 'project')).toBe(false);
    expect(store.issuesFrom).toBe('load');
    expect(store.issues).toEqual([{ path: 'ratedFrequencyHz', message: 'must be 50 or 60 (Hz)' }]);
    expect(store.draft?.sets[0]?.ratedKW).toBe(900);
    expect(store.draftIssues).toEqual([]);
    expect(store.canUndo).toBe(true);
    expect(await store.load(demoPlantJson(), 'project')).toBe(true);
    expect(store.canUndo).toBe(false);
    expect(store.dirty).toBe(false);
    expect(store.source).toBe('project');
  });

  it('snapshot() is a deep copy of the last valid plant', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const snap = store.snapshot();
    expect(snap).toEqual(store.plant);
    snap!.sets[0]!.ratedKW = 1;
    expect(store.plant?.sets[0]?.ratedKW).toBe(1000);
  });

  it('validates only the newest draft when edits outrun the engine', async () => {
    const store = usePlantStore();
    await store.loadDemo();
    const gate = gatedClient();
    setEngineClient(gate.client);
    const done = [4.5, 0, 6].map((v) => store.edit('sets[2].governor.droopPct', v));
    // One request in flight (4.5); 0 was replaced by 6 while waiting and is never sent.
    expect(gate.pending()).toBe(1);
    gate.release();
    await new Promise((r) => setTimeout(r, 0));
    expect(gate.pending()).toBe(1);
    gate.release();
    await Promise.all(done);
    expect(gate.pending()).toBe(0);
    expect(store.plant?.sets[2]?.governor.droopPct).toBe(6);
    expect(store.draftIssues).toEqual([]);
  });
});

describe('the demo plant check the page asks for as it starts', () => {
  beforeEach(() => {
    freshStores();
  });

  it('is taken by the first demo load instead of a second request, and only once', async () => {
    const inner = directClient();
    const early = inner.call('checkPlant', { plant: demoPlantJson() });
    keepDemoCheck(early);
    const asked: string[] = [];
    setEngineClient({
      call(method, request, options) {
        asked.push(method);
        return inner.call(method, request, options);
      },
    });
    const store = usePlantStore();
    const sharing = useSharingStore();
    expect(await store.loadDemo()).toBe(true);
    // The check came from the page's request; only the rated figures were asked for here.
    expect(asked).not.toContain('checkPlant');
    expect(sharing.result?.bus.frequencyHz).toBe((await early).sharing?.bus.frequencyHz);
    expect(store.plant?.name).toBe((demoPlantJson() as { name: string }).name);
    // A later load asks for its own check (the early one is spent).
    expect(await store.loadDemo()).toBe(true);
    expect(asked).toContain('checkPlant');
  });

  it('reports a failed early check as the load failing, naming the demo plant', async () => {
    keepDemoCheck(Promise.reject(new Error('engine did not start')));
    const store = usePlantStore();
    useSharingStore();
    expect(await store.loadDemo()).toBe(false);
    expect(store.error).toMatch(/^demo plant: .*engine did not start/);
    expect(store.plant).toBeNull();
  });
});
