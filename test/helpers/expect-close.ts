import { expect } from 'vitest';

/**
 * Asserts |actual − expected| ≤ max(abs, rel·|expected|). The one float helper of the
 * test suite; `what` names the quantity in the failure message.
 */
export function expectClose(actual: number, expected: number, tol: { abs?: number; rel?: number } = {}, what = 'value'): void {
  const abs = tol.abs ?? 0;
  const rel = tol.rel ?? (tol.abs === undefined ? 1e-9 : 0);
  const allowed = Math.max(abs, rel * Math.abs(expected));
  const diff = Math.abs(actual - expected);
  expect(Number.isFinite(actual), `${what} is not finite: ${actual}`).toBe(true);
  expect(diff, `${what}: got ${actual}, expected ${expected} ± ${allowed}`).toBeLessThanOrEqual(allowed);
}
