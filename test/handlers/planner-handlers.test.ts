import { describe, expect, it } from 'vitest';
import { dispatch } from '../../electron/handlers';
import type { PlanResult, ToleranceResult } from '../../shared-types';
import { demoPlantJson } from '../helpers/plants';

async function messageOf(method: 'planDroop' | 'toleranceAnalysis' | 'sharingSensitivity', payload: unknown): Promise<string> {
  const r = await dispatch(method, payload);
  expect(r.ok).toBe(false);
  return r.ok ? '' : `${r.error.code}: ${r.error.message}`;
}

const bands = { frequencyBandHz: { min: 49.5, max: 50.5 }, voltageBandV: { min: 380, max: 420 } };

describe('planner handlers', () => {
  it('planDroop returns a proposal whose plant is a valid plant file', async () => {
    const r = await dispatch('planDroop', { plant: demoPlantJson(), ...bands, loadRangePct: { min: 0, max: 95 } });
    expect(r.ok).toBe(true);
    const v = (r as { value: PlanResult }).value;
    expect(v.feasible).toBe(true);
    const again = await dispatch('validatePlant', { plant: JSON.parse(JSON.stringify(v.plant)) as unknown });
    expect(again.ok).toBe(true);
  });

  it('planDroop names the field and the rule for bad input', async () => {
    expect(await messageOf('planDroop', { plant: demoPlantJson(), ...bands, frequencyBandHz: { min: 51, max: 49 } })).toContain(
      'frequencyBandHz.max: min must be below max',
    );
    expect(await messageOf('planDroop', { plant: demoPlantJson(), ...bands, pf: 1.2 })).toContain('pf: must be 1 or less');
    expect(await messageOf('planDroop', { plant: demoPlantJson(), ...bands, fixed: [{ setId: 'G1', fields: ['speed'] }] })).toContain(
      'fixed[0].fields[0]: must be droopPct, noLoadHz, reactiveDroopPct or noLoadV',
    );
    expect(await messageOf('planDroop', { plant: demoPlantJson(), ...bands, fixed: [{ setId: 'G9', fields: ['droopPct'] }] })).toContain(
      'INVALID_INPUT: fixed: there is no set "G9"',
    );
  });

  it('sharingSensitivity answers at the plant loads', async () => {
    const r = await dispatch('sharingSensitivity', { plant: demoPlantJson() });
    expect(r.ok).toBe(true);
  });

  it('toleranceAnalysis reports progress in chunks up to 1 and refuses bad tolerances by name', async () => {
    const fractions: number[] = [];
    const r = await dispatch(
      'toleranceAnalysis',
      { plant: demoPlantJson(), samples: 1200, seed: 4, speedTolHz: 0.1 },
      { progress: (f) => fractions.push(f), signal: new AbortController().signal },
    );
    expect(r.ok).toBe(true);
    expect((r as { value: ToleranceResult }).value.samples).toBe(1200);
    // Chunks of SAMPLES_PER_CHUNK = 500.
    expect(fractions).toEqual([0, 500 / 1200, 1000 / 1200, 1]);
    expect(await messageOf('toleranceAnalysis', { plant: demoPlantJson(), droopTolPct: 60 })).toContain('droopTolPct: must be 0 % or more and below 50 %');
    expect(await messageOf('toleranceAnalysis', { plant: demoPlantJson(), samples: 2.5 })).toContain('samples: must be a whole number');
    expect(await messageOf('toleranceAnalysis', { plant: demoPlantJson(), load: { kW: 1, kVAR: 0 }, loadRangePct: { min: 0, max: 50 } })).toContain(
      'loadRangePct: give either load or loadRangePct, not both',
    );
  });

  it('toleranceAnalysis stops with CANCELLED when the caller aborts between chunks', async () => {
    const ac = new AbortController();
    const r = await dispatch(
      'toleranceAnalysis',
      { plant: demoPlantJson(), samples: 5000 },
      {
        progress: (f) => {
          if (f > 0) ac.abort();
        },
        signal: ac.signal,
      },
    );
    expect(r).toEqual({ ok: false, error: { name: 'EngineError', code: 'CANCELLED', message: 'The tolerance analysis was cancelled.' } });
  });
});
