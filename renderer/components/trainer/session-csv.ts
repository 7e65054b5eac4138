/**
 * A session's log as CSV: the caution as a leading `#` line (pandas `comment='#'`, R
 * `comment.char='#'`), a `#` line naming the set and the session's pass count and mean
 * score, then one row per attempt with its score and whether it passed. Pure.
 */
import { CSV_CAUTION_LINE, formatNumber } from '../../../shared-types';
import type { TrainerAttempt } from '../../../shared-types';
import { toCsv } from '../report/download';

export const SESSION_CSV_COLUMNS = [
  'session',
  'set',
  'exercise',
  'trainee',
  'closed at',
  'level',
  'seed',
  'faults',
  'angle at contact (deg)',
  'slip at contact (Hz)',
  'voltage difference (%)',
  'surge current (pu)',
  'torque step (pu)',
  'score (0-100)',
  'passed',
  'verdict',
] as const;

/** The CSV text of `attempts` (oldest first) of one session of the set `setName`. */
export function sessionCsv(setName: string, attempts: readonly TrainerAttempt[]): string {
  const rows = attempts.map((a) => [
    a.session ?? '',
    setName,
    a.exerciseName ?? a.exerciseId ?? '',
    a.trainee ?? '',
    a.at,
    a.level,
    a.seed,
    a.faults ?? '',
    a.angleAtContactDeg,
    a.slipAtContactHz,
    a.voltageDifferencePct,
    a.surgeCurrentPU,
    a.torqueStepPU,
    a.score,
    a.passed === undefined ? '' : a.passed ? 'yes' : 'no',
    a.verdict,
  ]);
  const passed = attempts.filter((a) => a.passed).length;
  const mean = attempts.length ? attempts.reduce((s, a) => s + a.score, 0) / attempts.length : 0;
  const summary = `# Set "${setName.replace(/[\r\n]/g, ' ')}": ${attempts.length} attempt${attempts.length === 1 ? '' : 's'}, ${passed} passed, mean score ${formatNumber(mean, 1)}`;
  return `${CSV_CAUTION_LINE}\r\n${summary}\r\n${toCsv(SESSION_CSV_COLUMNS, rows)}`;
}
