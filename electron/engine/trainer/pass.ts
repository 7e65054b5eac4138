/**
 * An instructor's pass criteria applied to a verdict, and a set's faults in words (for the
 * session log). Pure.
 */
import type { TrainerPassCriteria, TrainerPassResult, TrainerVerdict } from '../../../shared-types';

/** Whether a verdict meets the criteria, with a sentence for every one it misses. */
export function judgePass(
  v: Pick<TrainerVerdict, 'score' | 'insideWindow' | 'withinMachineLimits' | 'deadBusClose'>,
  pass: TrainerPassCriteria,
): TrainerPassResult {
  const reasons: string[] = [];
  if (v.score < pass.minScore) reasons.push(`Score ${v.score} is below the pass mark of ${pass.minScore}.`);
  if (pass.insideWindow && !v.insideWindow)
    reasons.push(v.deadBusClose ? 'The dead bus was energised off rated voltage or frequency.' : 'The contact was outside the graded window.');
  if (pass.withinMachineLimits && !v.withinMachineLimits) reasons.push("The close exceeded the machine's limits.");
  return { passed: reasons.length === 0, reasons };
}

/** The faults in words: one home in the shared vocabulary. */
export { faultWords } from '../../../shared-types';
