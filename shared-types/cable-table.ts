/**
 * A small table of copper low-voltage power cables, for turning a feeder's length and
 * size into the per-phase R and X the plant file holds.
 *
 * Resistance: the maximum DC resistance of class 2 stranded copper conductors at 20 °C
 * (IEC 60228, Table 2 — values from memory, not confirmed against the standard), corrected
 * to the conductor temperature with α = 0.00393 /K (annealed copper). AC skin and proximity
 * effects are left out (under ~3 % up to 240 mm² at 50 Hz).
 * Reactance: typical positive-sequence values of multi-core and trefoil single-core LV
 * cables at 50 Hz (common practice, rounded); scaled by f / 50 at other frequencies.
 * Typical values: verify with the cable maker's data.
 * It lives in shared-types (pure data and one law) so the plant editor and any engine caller share one copy.
 */

/** One cable size. */
export interface CableSize {
  /** Conductor cross-section, mm². */
  sizeMM2: number;
  /** DC resistance at 20 °C, Ω/km. */
  r20OhmPerKm: number;
  /** Reactance at 50 Hz, Ω/km. */
  x50OhmPerKm: number;
}

/** Copper LV cable sizes, smallest first. */
export const CABLE_SIZES: readonly CableSize[] = [
  { sizeMM2: 16, r20OhmPerKm: 1.15, x50OhmPerKm: 0.09 },
  { sizeMM2: 25, r20OhmPerKm: 0.727, x50OhmPerKm: 0.088 },
  { sizeMM2: 35, r20OhmPerKm: 0.524, x50OhmPerKm: 0.085 },
  { sizeMM2: 50, r20OhmPerKm: 0.387, x50OhmPerKm: 0.083 },
  { sizeMM2: 70, r20OhmPerKm: 0.268, x50OhmPerKm: 0.082 },
  { sizeMM2: 95, r20OhmPerKm: 0.193, x50OhmPerKm: 0.081 },
  { sizeMM2: 120, r20OhmPerKm: 0.153, x50OhmPerKm: 0.08 },
  { sizeMM2: 150, r20OhmPerKm: 0.124, x50OhmPerKm: 0.08 },
  { sizeMM2: 185, r20OhmPerKm: 0.0991, x50OhmPerKm: 0.08 },
  { sizeMM2: 240, r20OhmPerKm: 0.0754, x50OhmPerKm: 0.079 },
  { sizeMM2: 300, r20OhmPerKm: 0.0601, x50OhmPerKm: 0.079 },
  { sizeMM2: 400, r20OhmPerKm: 0.047, x50OhmPerKm: 0.078 },
  { sizeMM2: 500, r20OhmPerKm: 0.0366, x50OhmPerKm: 0.078 },
  { sizeMM2: 630, r20OhmPerKm: 0.0283, x50OhmPerKm: 0.077 },
];

/** Temperature coefficient of resistance of annealed copper at 20 °C, 1/K. */
export const COPPER_ALPHA_PER_K = 0.00393;

/** A feeder made of `runs` identical cables in parallel. */
export interface CableRun {
  lengthM: number;
  sizeMM2: number;
  /** Cables in parallel per phase (≥ 1). */
  runs: number;
  /** Conductor temperature, °C (70 for PVC, 90 for XLPE at full load). */
  conductorC: number;
  /** System frequency, Hz. */
  frequencyHz: number;
}

/** Per-phase feeder impedance of a cable run, Ω; or a sentence naming the bad field. */
export type CableImpedance = { ok: true; rOhm: number; xOhm: number } | { ok: false; message: string };

/**
 * `R = r20 (1 + α (T − 20)) L / n`, `X = x50 (f / 50) L / n` (L in km, n runs in parallel).
 */
export function cableImpedance(run: CableRun): CableImpedance {
  const size = CABLE_SIZES.find((c) => c.sizeMM2 === run.sizeMM2);
  if (!size) return { ok: false, message: `size: ${run.sizeMM2} mm² is not in the cable table` };
  if (!(run.lengthM >= 0) || !Number.isFinite(run.lengthM)) return { ok: false, message: 'length: must be 0 m or more' };
  if (!Number.isInteger(run.runs) || run.runs < 1) return { ok: false, message: 'runs: must be a whole number, 1 or more' };
  if (!(run.conductorC >= -20 && run.conductorC <= 250)) return { ok: false, message: 'conductor temperature: must be between −20 and 250 °C' };
  const km = run.lengthM / 1000;
  const rOhm = (size.r20OhmPerKm * (1 + COPPER_ALPHA_PER_K * (run.conductorC - 20)) * km) / run.runs;
  const xOhm = (size.x50OhmPerKm * (run.frequencyHz / 50) * km) / run.runs;
  return { ok: true, rOhm, xOhm };
}
