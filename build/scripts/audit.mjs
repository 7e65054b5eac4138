#!/usr/bin/env node
// CI's audit of the production dependencies: `npm audit --omit=dev`, failing on a high or critical
// advisory. When the registry's audit service cannot be reached (some mirrors answer 405 to its POST),
// there is nothing to judge: say so in one line and do not fail the build on it.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** Severities that fail the build. */
export const FAILING = ['high', 'critical'];

/**
 * Judges the JSON that `npm audit --json` printed. Returns `{ ok, message }`: not ok only for a high or
 * critical advisory; an audit that could not run is ok with a message saying why.
 */
export function judgeAudit(jsonText) {
  let report;
  try {
    report = JSON.parse(jsonText);
  } catch {
    return { ok: true, ran: false, message: 'npm audit could not run here: it printed no report.' };
  }
  const counts = report?.metadata?.vulnerabilities;
  if (!counts || typeof counts !== 'object') {
    const why = report?.error?.summary || report?.message || 'the audit service gave no report';
    return { ok: true, ran: false, message: `npm audit could not run here: ${String(why).split('\n')[0]}` };
  }
  const failing = FAILING.map((s) => [s, Number(counts[s] ?? 0)]).filter(([, n]) => n > 0);
  if (failing.length > 0)
    return {
      ok: false,
      ran: true,
      message: `npm audit: ${failing.map(([s, n]) => `${n} ${s}`).join(', ')} severity advisories in production dependencies; run npm audit --omit=dev for details.`,
    };
  const total = Object.values(counts).reduce((a, n) => a + Number(n || 0), 0);
  return { ok: true, ran: true, message: `npm audit: no high or critical advisory in production dependencies (${total} of lower severity).` };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const r = spawnSync('npm', ['audit', '--omit=dev', '--json'], { encoding: 'utf8' });
  const verdict = judgeAudit(r.stdout ?? '');
  process.stdout.write(`${verdict.message}\n`);
  process.exit(verdict.ok ? 0 : 1);
}
