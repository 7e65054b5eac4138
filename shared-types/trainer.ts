/** Operator trainer: exercises and the log of attempts (kept with the project). */

/** One synchronizing attempt, as kept in the project's trainer log. */
export interface TrainerAttempt {
  /** ISO 8601 time of the close. */
  at: string;
  /** Exercise seed (repeatable start). */
  seed: number;
  level: string;
  angleAtContactDeg: number;
  slipAtContactHz: number;
  voltageDifferencePct: number;
  surgeCurrentPU: number;
  torqueStepPU: number;
  /** 0..100 */
  score: number;
  verdict: string;
}
