/**
 * The loads on the common bus as functions of bus voltage and frequency.
 * Constant power: P, Q fixed. Constant impedance: P, Q ∝ (V / V_rated)².
 * Frequency sensitivity s (% kW per % Hz): P · max(0, 1 + s (f − f_rated) / f_rated);
 * the clamp keeps a load from turning into a source far below rated frequency.
 * Reactive power is taken as independent of frequency.
 */
import type { LoadTerm } from './sharing-model';

function voltageFactor(l: LoadTerm, voltageV: number, ratedVoltageV: number): number {
  if (!l.impedance) return 1;
  const u = voltageV / ratedVoltageV;
  return u * u;
}

function frequencyFactor(l: LoadTerm, frequencyHz: number, ratedFrequencyHz: number): number {
  if (l.frequencySensitivity === 0) return 1;
  return Math.max(0, 1 + (l.frequencySensitivity * (frequencyHz - ratedFrequencyHz)) / ratedFrequencyHz);
}

/** Total load kW at bus voltage `voltageV` (V line-to-line) and frequency `frequencyHz`. */
export function busLoadKW(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  let p = 0;
  for (const l of loads) p += l.kW * voltageFactor(l, voltageV, ratedVoltageV) * frequencyFactor(l, frequencyHz, ratedFrequencyHz);
  return p;
}

/**
 * The load kW as `a + b (f − f_rated)` around `frequencyHz` (exact while no load's
 * frequency factor crosses zero): used to land the frequency solve on the exact root.
 */
export function busLoadKWLinear(
  loads: readonly LoadTerm[],
  voltageV: number,
  frequencyHz: number,
  ratedVoltageV: number,
  ratedFrequencyHz: number,
): { a: number; b: number } {
  let a = 0;
  let b = 0;
  for (const l of loads) {
    const pv = l.kW * voltageFactor(l, voltageV, ratedVoltageV);
    if (frequencyFactor(l, frequencyHz, ratedFrequencyHz) <= 0) continue;
    a += pv;
    b += (pv * l.frequencySensitivity) / ratedFrequencyHz;
  }
  return { a, b };
}

/** Total load kVAR at bus voltage `voltageV`. */
export function busLoadKVAR(loads: readonly LoadTerm[], voltageV: number, ratedVoltageV: number): number {
  let q = 0;
  for (const l of loads) q += l.kVAR * voltageFactor(l, voltageV, ratedVoltageV);
  return q;
}

/** Split of the load kVAR into a constant part and the coefficient c of V² (kVAR per V²). */
export function busLoadKVARQuadratic(loads: readonly LoadTerm[], ratedVoltageV: number): { constant: number; perV2: number } {
  let constant = 0;
  let perV2 = 0;
  for (const l of loads) {
    if (l.impedance) perV2 += l.kVAR / (ratedVoltageV * ratedVoltageV);
    else constant += l.kVAR;
  }
  return { constant, perV2 };
}

/** ∂(load kW)/∂V at (V, f), kW per V. */
export function busLoadKWdV(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  let d = 0;
  for (const l of loads) {
    if (!l.impedance) continue;
    d += ((2 * l.kW * voltageV) / (ratedVoltageV * ratedVoltageV)) * frequencyFactor(l, frequencyHz, ratedFrequencyHz);
  }
  return d;
}

/** ∂(load kVAR)/∂V at V, kVAR per V. */
export function busLoadKVARdV(loads: readonly LoadTerm[], voltageV: number, ratedVoltageV: number): number {
  let d = 0;
  for (const l of loads) if (l.impedance) d += (2 * l.kVAR * voltageV) / (ratedVoltageV * ratedVoltageV);
  return d;
}
