/**
 * The loads on the common bus as functions of bus voltage and frequency: the ZIP (polynomial)
 * model of Kundur, *Power System Stability and Control* (1994), §7.1 (section value from memory).
 * With u = V / V_rated each load draws
 *
 *   P = kW   (pZ u² + pI u + pP) · max(0, 1 + s_P (f − f_rated) / f_rated)
 *   Q = kVAR (qZ u² + qI u + qP) · max(0, 1 + s_Q (f − f_rated) / f_rated)
 *
 * (constant impedance, constant current and constant power shares; s_P, s_Q in % per %).
 * A constant-power load is (0, 0, 1), a constant-impedance load (1, 0, 0). The clamp keeps a
 * load from turning into a source far from rated frequency.
 */
import type { LoadTerm } from './sharing-model';

/** kW voltage factor pZ u² + pI u + pP. */
function pVoltageFactor(l: LoadTerm, u: number): number {
  return l.pZ * u * u + l.pI * u + l.pP;
}

/** kVAR voltage factor qZ u² + qI u + qP. */
function qVoltageFactor(l: LoadTerm, u: number): number {
  return l.qZ * u * u + l.qI * u + l.qP;
}

function factor(sensitivity: number, frequencyHz: number, ratedFrequencyHz: number): number {
  if (sensitivity === 0) return 1;
  return Math.max(0, 1 + (sensitivity * (frequencyHz - ratedFrequencyHz)) / ratedFrequencyHz);
}

/** Total load kW at bus voltage `voltageV` (V line-to-line) and frequency `frequencyHz`. */
export function busLoadKW(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  const u = voltageV / ratedVoltageV;
  let p = 0;
  for (const l of loads) p += l.kW * pVoltageFactor(l, u) * factor(l.frequencySensitivity, frequencyHz, ratedFrequencyHz);
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
  const u = voltageV / ratedVoltageV;
  let a = 0;
  let b = 0;
  for (const l of loads) {
    const pv = l.kW * pVoltageFactor(l, u);
    if (factor(l.frequencySensitivity, frequencyHz, ratedFrequencyHz) <= 0) continue;
    a += pv;
    b += (pv * l.frequencySensitivity) / ratedFrequencyHz;
  }
  return { a, b };
}

/** Total load kVAR at bus voltage `voltageV` and frequency `frequencyHz`. */
export function busLoadKVAR(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  const u = voltageV / ratedVoltageV;
  let q = 0;
  for (const l of loads) q += l.kVAR * qVoltageFactor(l, u) * factor(l.kVARFrequencySensitivity, frequencyHz, ratedFrequencyHz);
  return q;
}

/**
 * The load kVAR at frequency `frequencyHz` as `constant + perV · V + perV2 · V²` (kVAR, kVAR
 * per V, kVAR per V²): the constant-power, constant-current and constant-impedance parts.
 */
export function busLoadKVARQuadratic(
  loads: readonly LoadTerm[],
  frequencyHz: number,
  ratedVoltageV: number,
  ratedFrequencyHz: number,
): { constant: number; perV: number; perV2: number } {
  let constant = 0;
  let perV = 0;
  let perV2 = 0;
  for (const l of loads) {
    const q = l.kVAR * factor(l.kVARFrequencySensitivity, frequencyHz, ratedFrequencyHz);
    constant += q * l.qP;
    perV += (q * l.qI) / ratedVoltageV;
    perV2 += (q * l.qZ) / (ratedVoltageV * ratedVoltageV);
  }
  return { constant, perV, perV2 };
}

/** ∂(load kW)/∂V at (V, f), kW per V. */
export function busLoadKWdV(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  const u = voltageV / ratedVoltageV;
  let d = 0;
  for (const l of loads) {
    if (l.pZ === 0 && l.pI === 0) continue;
    d += ((l.kW * (2 * l.pZ * u + l.pI)) / ratedVoltageV) * factor(l.frequencySensitivity, frequencyHz, ratedFrequencyHz);
  }
  return d;
}

/** ∂(load kVAR)/∂V at (V, f), kVAR per V. */
export function busLoadKVARdV(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  const u = voltageV / ratedVoltageV;
  let d = 0;
  for (const l of loads) {
    if (l.qZ === 0 && l.qI === 0) continue;
    d += ((l.kVAR * (2 * l.qZ * u + l.qI)) / ratedVoltageV) * factor(l.kVARFrequencySensitivity, frequencyHz, ratedFrequencyHz);
  }
  return d;
}

/** ∂(load kVAR)/∂f at (V, f), kVAR per Hz (0 where a load's frequency factor is clamped at zero). */
export function busLoadKVARdF(loads: readonly LoadTerm[], voltageV: number, frequencyHz: number, ratedVoltageV: number, ratedFrequencyHz: number): number {
  const u = voltageV / ratedVoltageV;
  let d = 0;
  for (const l of loads) {
    if (l.kVARFrequencySensitivity === 0 || factor(l.kVARFrequencySensitivity, frequencyHz, ratedFrequencyHz) <= 0) continue;
    d += (l.kVAR * qVoltageFactor(l, u) * l.kVARFrequencySensitivity) / ratedFrequencyHz;
  }
  return d;
}
