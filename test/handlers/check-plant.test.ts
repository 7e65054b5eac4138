/** `checkPlant`: an edit's validation and its operating point in one request. */
import { describe, expect, it } from 'vitest';
import { dispatch } from '../../electron/handlers';
import { loadAtPct } from '../../shared-types';
import type { CheckedPlant, Plant, PlantDescription, SharingResult } from '../../shared-types';
import { demoPlantJson } from '../helpers/plants';

async function ok<T>(method: Parameters<typeof dispatch>[0], req: unknown): Promise<T> {
  const r = await dispatch(method, req);
  if (!r.ok) throw new Error(`${method} refused: ${r.error.message}`);
  return r.value as T;
}

describe('checkPlant', () => {
  it('gives the same plant as validatePlant and the same operating point as solveSharing', async () => {
    const raw = demoPlantJson();
    const checked = await ok<CheckedPlant>('checkPlant', { plant: raw });
    const valid = await ok<Plant>('validatePlant', { plant: raw });
    const solved = await ok<SharingResult>('solveSharing', { plant: valid });
    expect(checked.plant).toEqual(valid);
    expect(checked.load).toBeNull();
    expect(checked.sharingError).toBeNull();
    expect(checked.sharing).toEqual(solved);
  });

  it('brings describePlant’s rated figures in the same answer when asked (an edit), and none otherwise', async () => {
    const raw = demoPlantJson();
    const valid = await ok<Plant>('validatePlant', { plant: raw });
    const described = await ok<PlantDescription>('describePlant', { plant: valid });
    const asked = await ok<CheckedPlant>('checkPlant', { plant: raw, describe: true });
    expect(asked.description).toEqual(described);
    expect(asked.descriptionError).toBeNull();
    const plain = await ok<CheckedPlant>('checkPlant', { plant: raw });
    expect(plain.description).toBeNull();
    expect(plain.descriptionError).toBeNull();
    expect(plain.sharing).toEqual(asked.sharing);
  });

  it('solves at the slider position as the sharing store would (solveSharing with atMost)', async () => {
    const raw = demoPlantJson();
    const checked = await ok<CheckedPlant>('checkPlant', { plant: raw, loadPct: 105 });
    const valid = await ok<Plant>('validatePlant', { plant: raw });
    const load = loadAtPct(valid, 105);
    const solved = await ok<SharingResult>('solveSharing', { plant: valid, load, atMost: true });
    expect(checked.load).toEqual(load);
    expect(checked.sharing).toEqual(solved);
  });

  it('refuses an invalid plant with the field path and the rule, like validatePlant', async () => {
    const raw = demoPlantJson() as { sets: { governor: { droopPct: unknown } }[] };
    raw.sets[1]!.governor.droopPct = 'four';
    const r = await dispatch('checkPlant', { plant: raw });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const v = await dispatch('validatePlant', { plant: raw });
    expect(v.ok).toBe(false);
    if (v.ok) return;
    expect(r.error.issues).toEqual(v.error.issues);
    expect(r.error.issues?.map((i) => i.path)).toContain('sets[1].governor.droopPct');
  });

  it('returns a valid plant without an operating point with the reason, not a failure', async () => {
    const raw = demoPlantJson() as { loads: { kW: number }[] };
    raw.loads[0]!.kW = 50_000; // far beyond the three sets' 2040 kW
    const checked = await ok<CheckedPlant>('checkPlant', { plant: raw });
    expect(checked.plant.loads[0]!.kW).toBe(50_000);
    expect(checked.sharing).toBeNull();
    expect(checked.sharingError).toMatch(/\w/);
    const solved = await dispatch('solveSharing', { plant: checked.plant });
    expect(solved.ok).toBe(false);
    if (!solved.ok) expect(checked.sharingError).toBe(solved.error.message);
  });

  it('names a bad slider position', async () => {
    const r = await dispatch('checkPlant', { plant: demoPlantJson(), loadPct: -5 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.issues?.[0]?.path).toBe('loadPct');
  });
});
