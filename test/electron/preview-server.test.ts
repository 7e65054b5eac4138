/** The browser preview server: its port argument and its security headers. */
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { parsePort, PREVIEW_HEADERS } from '../../build/scripts/security-headers.mjs';

describe('preview server', () => {
  it('reads --port as a whole number from 0 to 65535', () => {
    expect(parsePort([])).toEqual({ port: 4178 });
    expect(parsePort(['--port', '5000'])).toEqual({ port: 5000 });
    expect(parsePort(['--port', 'abc'])).toEqual({ error: '--port must be a whole number from 0 to 65535 (got "abc").' });
    expect(parsePort(['--port'])).toEqual({ error: '--port must be a whole number from 0 to 65535 (got nothing).' });
    expect('error' in parsePort(['--port', '70000'])).toBe(true);
    expect('error' in parsePort(['--port', '-1'])).toBe(true);
  });

  it('--port abc gives one line and exit 2, no stack trace (before any build)', () => {
    const r = spawnSync(process.execPath, ['build/scripts/preview.mjs', '--port', 'abc', '--no-build'], { encoding: 'utf8', timeout: 20_000 });
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('droopline preview: --port must be a whole number from 0 to 65535 (got "abc").\n');
    expect(r.stdout).toBe('');
  });

  it('sends nosniff and refuses framing', () => {
    expect(PREVIEW_HEADERS['X-Content-Type-Options']).toBe('nosniff');
    expect(PREVIEW_HEADERS['X-Frame-Options']).toBe('DENY');
    expect(PREVIEW_HEADERS['Content-Security-Policy']).toContain("frame-ancestors 'none'");
  });
});
