/**
 * The one home of the generating-set laws, shared by the engine and the renderer (pure functions of numbers, no
 * state), beside the phase-angle laws of `angle.ts`. The steady-state solvers, the simulator, the planner, the
 * report's charts and the renderer's droop charts all compute these figures here and nowhere else.
 *
 * - rated speed `n = 120 f / poles`, rpm;
 * - rated line current `I = S / (√3 V)`, A;
 * - reactive base `Qbase = S √(1 − pf²)`, kVAR (the kVAR at rated current and rated power factor);
 * - speed droop `f = f_nl − (droop/100) · f_rated · P / P_rated`, i.e. a slope of `P_rated / ((droop/100) f_rated)` kW/Hz;
 * - reactive droop `V = V_nl − (droop/100) · V_rated · Q / Qbase`, i.e. a slope of `Qbase / ((droop/100) V_rated)` kVAR/V;
 * - power-factor control `Q = P tan φ`, `tan φ = √(1 − pf²) / pf`;
 * - advance angle `360 |s| t`: the angle the slip carries the incoming phasor through in the breaker's closing time.
 */

/** Rated speed `n = 120 f / poles`, rpm. */
export function ratedSpeedRpm(frequencyHz: number, poles: number): number {
  return (120 * frequencyHz) / poles;
}

/** Rated line current of a three-phase set `I = S / (√3 V)`, A (kVA, V line-to-line). */
export function ratedCurrentA(ratedKVA: number, voltageV: number): number {
  return (ratedKVA * 1000) / (Math.sqrt(3) * voltageV);
}

/** Reactive base `Qbase = S √(1 − pf²)`, kVAR: the kVAR at rated current and rated PF (per unit when `ratedKVA` is 1). */
export function kVARBase(ratedKVA: number, ratedPF: number): number {
  return ratedKVA * Math.sqrt(1 - ratedPF * ratedPF);
}

/** `tan φ = √(1 − pf²) / pf`: kVAR per kW at power factor `pf` (lagging positive). */
export function tanPhi(pf: number): number {
  return Math.sqrt(1 - pf * pf) / pf;
}

/** Speed-droop slope `P_rated / ((droop/100) f_rated)`, kW per Hz below the no-load frequency. */
export function speedDroopKWPerHz(ratedKW: number, droopPct: number, ratedHz: number): number {
  return ratedKW / ((droopPct / 100) * ratedHz);
}

/** Frequency of a speed-droop set at output `kW`: `f = f_nl − (droop/100) · f_rated · P / P_rated`, Hz. */
export function speedDroopHz(noLoadHz: number, droopPct: number, ratedHz: number, ratedKW: number, kW: number): number {
  return noLoadHz - (droopPct / 100) * ratedHz * (kW / ratedKW);
}

/** Reactive-droop slope `Qbase / ((droop/100) V_rated)`, kVAR per V below the no-load voltage. */
export function reactiveDroopKVARPerV(qBaseKVAR: number, droopPct: number, ratedV: number): number {
  return qBaseKVAR / ((droopPct / 100) * ratedV);
}

/** Terminal voltage of a reactive-droop set at `kVAR`: `V = V_nl − (droop/100) · V_rated · Q / Qbase`, V. */
export function reactiveDroopV(noLoadV: number, droopPct: number, ratedV: number, qBaseKVAR: number, kVAR: number): number {
  return noLoadV - (droopPct / 100) * ratedV * (kVAR / qBaseKVAR);
}

/** Advance angle `360 |s| t`: the angle gained during the breaker closing time, degrees. */
export function advanceAngleDeg(slipHz: number, breakerClosingMs: number): number {
  return 360 * Math.abs(slipHz) * (breakerClosingMs / 1000);
}
