/** Number formatting for tables and exports: fixed decimals, a dash for anything not finite. */

/** `v` with `digits` decimals, or "—" when it is null, NaN or infinite (never "NaN" on screen). */
export function fmt(v: number | null | undefined, digits = 0): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const s = v.toFixed(digits);
  // "-0" and "-0.0" read as a sign error: show zero.
  return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
}

/** A signed figure ("+1.2", "−0.4", "0.0") for errors and deviations. */
export function fmtSigned(v: number | null | undefined, digits = 1): string {
  const s = fmt(v, digits);
  if (s === '—' || Number(s) === 0) return s;
  return s.startsWith('-') ? `−${s.slice(1)}` : `+${s}`;
}

/** A power factor with its sense: "0.85 lag", "0.97 lead", "1.00". */
export function fmtPF(pf: number | null | undefined, lagging: boolean): string {
  const s = fmt(pf, 2);
  if (s === '—' || s === '1.00') return s;
  return `${s} ${lagging ? 'lag' : 'lead'}`;
}
