/** An edit reaches the sharing table in one engine request (`checkPlant`), and a stale answer never wins. */
import { beforeEach, describe, expect, it } from 'vitest';
import { usePlantStore } from '../../renderer/stores/plant';
import { useSharingStore } from '../../renderer/stores/sharing';
import type { EngineClient } from '../../renderer/transport';
import { directClient } from '../helpers/direct-client';
import { freshStores } from './view-harness';

function countingClient(): { client: EngineClient; calls: string[] } {
  const inner = directClient();
  const calls: string[] = [];
  return {
    calls,
    client: {
      call(method, request, options) {
        calls.push(method);
        return inner.call(method, request, options);
      },
    },
  };
}

describe('edit → sharing table', () => {
  let calls: string[];
  beforeEach(() => {
    const c = countingClient();
    calls = c.calls;
    freshStores(c.client);
  });

  it('costs one request that validates and solves; the table is up to date with the edited plant', async () => {
    const plant = usePlantStore();
    const sharing = useSharingStore();
    await plant.loadDemo();
    await sharing.settled();
    const before = sharing.result!.sets[1]!.kW;
    calls.length = 0;
    await plant.edit('sets[1].governor.noLoadHz', 51.4);
    await sharing.settled();
    // The rated figures come in the same answer: no describePlant after it.
    expect(calls).toEqual(['checkPlant']);
    expect(sharing.upToDate).toBe(true);
    expect(sharing.resultPlant).toBe(plant.plant);
    expect(plant.plant!.sets[1]!.governor.noLoadHz).toBe(51.4);
    // A higher no-load speed on the droop line takes more of the load (the droop definition).
    expect(sharing.result!.sets[1]!.kW).toBeGreaterThan(before);
  });

  it('solves the edit at the slider position when the slider is away from the plant load', async () => {
    const plant = usePlantStore();
    const sharing = useSharingStore();
    await plant.loadDemo();
    await sharing.setLoadPct(80);
    await sharing.settled();
    calls.length = 0;
    await plant.edit('sets[0].governor.droopPct', 5);
    await sharing.settled();
    expect(calls).toEqual(['checkPlant']);
    expect(sharing.resultLoadPct).toBe(80);
    expect(sharing.upToDate).toBe(true);
    // 80 % of the demo plant's 2040 kW on line (the slider's definition); the sets also cover the feeder losses.
    expect(sharing.resultLoad!.kW).toBeCloseTo(0.8 * 2040, 6);
    expect(sharing.result!.totals.kW).toBeGreaterThan(0.8 * 2040);
    expect(sharing.result!.totals.kW).toBeLessThan(0.8 * 2040 * 1.03);
  });

  it('keeps the rated figures’ object when an edit leaves them as they were, and replaces it when a droop or a rating changes', async () => {
    const plant = usePlantStore();
    const sharing = useSharingStore();
    await plant.loadDemo();
    await sharing.settled();
    const shown = plant.description;
    expect(shown).not.toBeNull();
    // An inertia changes only the transients: the rated table, capability limits and droop lines have nothing to redraw.
    const inertia = plant.plant!.sets[1]!.machine.inertiaS + 0.5;
    await plant.edit('sets[1].machine.inertiaS', inertia);
    await sharing.settled();
    expect(plant.plant!.sets[1]!.machine.inertiaS).toBe(inertia);
    expect(plant.description).toBe(shown);
    // A droop changes the set's speed characteristic (its slope), which the description carries for the droop charts.
    await plant.edit('sets[1].governor.droopPct', 5);
    await sharing.settled();
    expect(plant.plant!.sets[1]!.governor.droopPct).toBe(5);
    expect(plant.description).not.toBe(shown);
    const afterDroop = plant.description!;
    expect(afterDroop.sets[1]!.characteristics).not.toEqual(shown!.sets[1]!.characteristics);
    // A rating does change them (the online kW is the sum of the online sets' ratings).
    const before = shown!.onlineKW;
    await plant.edit('sets[0].ratedKW', plant.plant!.sets[0]!.ratedKW + 100);
    await sharing.settled();
    expect(plant.description).not.toBe(afterDroop);
    expect(plant.description!.onlineKW).toBeCloseTo(before + 100, 9);
  });

  it('a slider move answered after a newer edit does not replace the edited plant’s result', async () => {
    const plant = usePlantStore();
    const sharing = useSharingStore();
    await plant.loadDemo();
    await sharing.settled();
    const slider = sharing.setLoadPct(60);
    const edit = plant.edit('sets[2].governor.noLoadHz', 51.3);
    await Promise.all([slider, edit]);
    await sharing.settled();
    expect(sharing.resultPlant).toBe(plant.plant);
    expect(sharing.resultLoadPct).toBe(60);
    expect(sharing.upToDate).toBe(true);
  });
});
