/**
 * The load slider's arithmetic, shared by the sharing store and the engine's `checkPlant`
 * handler (which solves an edited plant at the slider's position in the same request): a
 * position is a % of the online sets' kW rating, turned into one constant-power load with the
 * kVAR/kW ratio of the plant's own loads.
 */
import type { Plant } from './plant';
import type { LoadOverride } from './sharing';

/** kVAR per kW of the slider's load when the plant has no load to take it from (PF 0.8 lagging). */
export const DEFAULT_Q_PER_P = 0.75;

/** Sum of the online sets' rated kW. */
export function onlineRatedKW(plant: Plant): number {
  return plant.sets.reduce((sum, s) => sum + (s.online ? s.ratedKW : 0), 0);
}

/** The plant's online loads at rated voltage and frequency, kW and kVAR. */
export function connectedLoad(plant: Plant): LoadOverride {
  let kW = 0;
  let kVAR = 0;
  for (const l of plant.loads) {
    if (!l.online) continue;
    kW += l.kW;
    kVAR += l.kVAR;
  }
  return { kW, kVAR };
}

/**
 * The aggregate load at `pct` % of the online kW rating, with the kVAR/kW ratio of the
 * plant's own loads (or PF 0.8 lagging when they draw no kW).
 */
export function loadAtPct(plant: Plant, pct: number): LoadOverride {
  const own = connectedLoad(plant);
  const qPerP = own.kW > 0 ? own.kVAR / own.kW : DEFAULT_Q_PER_P;
  const kW = (pct / 100) * onlineRatedKW(plant);
  return { kW, kVAR: kW * qPerP };
}
