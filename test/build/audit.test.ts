// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { judgeAudit } from '../../build/scripts/audit.mjs';

// The verdict on `npm audit --omit=dev --json` output (npm 11's report shape: metadata.vulnerabilities).
const report = (counts: Record<string, number>) =>
  JSON.stringify({
    auditReportVersion: 2,
    vulnerabilities: {},
    metadata: { vulnerabilities: { info: 0, low: 0, moderate: 0, high: 0, critical: 0, total: 0, ...counts } },
  });

describe('CI audit verdict', () => {
  it('fails on a high or a critical advisory and names the counts', () => {
    const high = judgeAudit(report({ high: 2 }));
    expect(high.ok).toBe(false);
    expect(high.message).toContain('2 high');
    expect(judgeAudit(report({ critical: 1 })).ok).toBe(false);
  });

  it('passes with only low and moderate advisories, and says how many', () => {
    const r = judgeAudit(report({ low: 1, moderate: 2 }));
    expect(r).toMatchObject({ ok: true, ran: true });
    expect(r.message).toContain('3 of lower severity');
  });

  it('does not fail when the audit service cannot be reached, and says why', () => {
    const r = judgeAudit(JSON.stringify({ message: '405 Method Not Allowed - POST https://registry.npmjs.org/-/npm/v1/security/advisories/bulk' }));
    expect(r).toMatchObject({ ok: true, ran: false });
    expect(r.message).toContain('405 Method Not Allowed');
    expect(judgeAudit('').ran).toBe(false);
  });
});
