/**
 * An instructor's pass criteria applied to a verdict, and a set's faults in words (for the
 * session log). Pure.
 */
import type { TrainerFaults, TrainerPassCriteria, TrainerPassResult, TrainerVerdict } from '../../../shared-types';

/** Whether a verdict meets the criteria, with a sentence for every one it misses. */
export function judgePass(v: Pick<TrainerVerdict, 'score' | 'insideWindow' | 'withinMachineLimits' | 'deadBusClose'>, pass: TrainerPassCriteria): TrainerPassResult {
  const reasons: string[] = [];
  if (v.score < pass.minScore) reasons.push(`Score ${v.score} is below the pass mark of ${pass.minScore}.`);
  if (pass.insideWindow && !v.insideWindow) reasons.push(v.deadBusClose ? 'The dead bus was energised off rated voltage or frequency.' : 'The contact was outside the graded window.');
  if (pass.withinMachineLimits && !v.withinMachineLimits) reasons.push("The close exceeded the machine's limits.");
  return { passed: reasons.length === 0, reasons };
}

/** The faults in words, joined by "; " ("" when none). */
export function faultWords(f: TrainerFaults | undefined): string {
  if (!f) return '';
  const out: string[] = [];
  if (f.breakerSlowMs) out.push(`breaker ${f.breakerSlowMs} ms slower than its setting`);
  if (f.wrongWindow) out.push(`window shown wrong (±${f.wrongWindow.angleDeg}°, ${f.wrongWindow.slipHz} Hz, ${f.wrongWindow.voltagePct} %)`);
  if (f.busDriftHz !== undefined) out.push(`droop bus drifting ±${f.busDriftHz} Hz`);
  if (f.deadBus) out.push('dead bus to energise');
  if (f.voltageMismatchPct !== undefined) out.push(`incoming voltage ${f.voltageMismatchPct > 0 ? '+' : ''}${f.voltageMismatchPct} % off the bus`);
  return out.join('; ');
}
