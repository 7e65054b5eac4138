// Security headers of the browser preview: the same content security policy as the desktop window
// (`CONTENT_SECURITY_POLICY` in electron/window.ts; a unit test keeps the two equal), no MIME sniffing,
// and no framing by another page.
export const PREVIEW_CSP =
  "default-src 'self'; script-src 'self'; worker-src 'self' blob:; style-src 'self'; img-src 'self' data: blob:; font-src 'self'; connect-src 'self'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

/** Headers sent with every response of the preview server. */
export const PREVIEW_HEADERS = {
  'Content-Security-Policy': PREVIEW_CSP,
  'X-Content-Type-Options': 'nosniff',
  'X-Frame-Options': 'DENY',
  'Referrer-Policy': 'no-referrer',
};

/**
 * Reads `--port N` from the arguments: a whole number from 0 to 65535, or 4178 when absent.
 * @returns {{ port: number } | { error: string }}
 */
export function parsePort(args, fallback = 4178) {
  const i = args.indexOf('--port');
  if (i < 0) return { port: fallback };
  const text = args[i + 1];
  if (text === undefined || !/^\d{1,5}$/.test(text) || Number(text) > 65535) {
    return { error: `--port must be a whole number from 0 to 65535 (got ${text === undefined ? 'nothing' : JSON.stringify(text)}).` };
  }
  return { port: Number(text) };
}
