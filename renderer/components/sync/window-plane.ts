/**
 * Geometry of the window plane, our own synchronizing display: phase angle across
 * (−180° … 180°, incoming ahead to the right), slip up (Hz, incoming fast above the axis).
 * At a steady slip the operating point runs along a horizontal line, to the right when the
 * incoming set is fast, and wraps from +180° to −180°. Pure functions: the component draws,
 * the tests invert (`angleAtX`, `slipAtY`) to check that a drawn point is the engine's.
 */
import { niceStep } from '../charts/nice-scale';

/** The plotting frame: SVG user units and the slip range shown (symmetric about 0). */
export interface PlaneFrame {
  width: number;
  height: number;
  pad: { l: number; r: number; t: number; b: number };
  slipLoHz: number;
  slipHiHz: number;
}

/** One sample of the operating point. */
export interface PlaneSample {
  /** Time of the sample, s (any origin). */
  tS: number;
  angleDeg: number;
  slipHz: number;
}

export const PLANE_WIDTH = 640;
export const PLANE_HEIGHT = 330;
const PAD = { l: 58, r: 14, t: 14, b: 40 };

/**
 * Half-height of the slip axis, Hz: room for 2.5 × the slip limit, the slip now with a margin and the closing
 * map's own range, on a round value (at least 0.2 Hz).
 */
export function planeSlipSpanHz(slipLimitHz: number | null, slipNowHz: number | null, mapRangeHz: number | null = null): number {
  const parts = [0.2];
  if (slipLimitHz !== null && Number.isFinite(slipLimitHz) && slipLimitHz > 0) parts.push(2.5 * slipLimitHz);
  if (slipNowHz !== null && Number.isFinite(slipNowHz)) parts.push(1.25 * Math.abs(slipNowHz));
  if (mapRangeHz !== null && Number.isFinite(mapRangeHz) && mapRangeHz > 0) parts.push(mapRangeHz);
  const want = Math.min(Math.max(...parts), 10);
  const step = niceStep(want, 2);
  return Math.ceil(want / step - 1e-9) * step;
}

/** A frame showing ±`spanHz` of slip. */
export function planeFrame(spanHz: number, width = PLANE_WIDTH, height = PLANE_HEIGHT): PlaneFrame {
  return { width, height, pad: PAD, slipLoHz: -spanHz, slipHiHz: spanHz };
}

const plotW = (f: PlaneFrame): number => f.width - f.pad.l - f.pad.r;
const plotH = (f: PlaneFrame): number => f.height - f.pad.t - f.pad.b;

/** x of a phase angle (−180° at the left edge, +180° at the right). */
export function planeX(f: PlaneFrame, angleDeg: number): number {
  return f.pad.l + ((angleDeg + 180) / 360) * plotW(f);
}

/** y of a slip (screen y runs down: positive slip above the middle). */
export function planeY(f: PlaneFrame, slipHz: number): number {
  return f.pad.t + ((f.slipHiHz - slipHz) / (f.slipHiHz - f.slipLoHz)) * plotH(f);
}

/** The phase angle drawn at `x` (inverse of `planeX`). */
export function angleAtX(f: PlaneFrame, x: number): number {
  return ((x - f.pad.l) / plotW(f)) * 360 - 180;
}

/** The slip drawn at `y` (inverse of `planeY`). */
export function slipAtY(f: PlaneFrame, y: number): number {
  return f.slipHiHz - ((y - f.pad.t) / plotH(f)) * (f.slipHiHz - f.slipLoHz);
}

/** A slip clamped into the frame, and whether it had to be (the point is then drawn on the edge and said in words). */
export function clampSlip(f: PlaneFrame, slipHz: number): { slipHz: number; clamped: boolean } {
  if (slipHz > f.slipHiHz) return { slipHz: f.slipHiHz, clamped: true };
  if (slipHz < f.slipLoHz) return { slipHz: f.slipLoHz, clamped: true };
  return { slipHz, clamped: false };
}

/** The sync-check window as a rectangle: ±angle across, from its lowest to its highest slip up. */
export function windowRect(f: PlaneFrame, w: { angleDeg: number; slipMinHz: number; slipMaxHz: number }): { x: number; y: number; w: number; h: number } {
  const a = Math.min(Math.max(w.angleDeg, 0), 180);
  const hi = clampSlip(f, w.slipMaxHz).slipHz;
  const lo = clampSlip(f, w.slipMinHz).slipHz;
  const x0 = planeX(f, -a);
  const y0 = planeY(f, hi);
  return { x: x0, y: y0, w: planeX(f, a) - x0, h: Math.max(0, planeY(f, lo) - y0) };
}

/** The window's slip edges: 0 … limit when the incoming set must run faster, else ± limit. */
export function windowSlipEdges(limits: { slipHz: number; incomingFaster?: boolean }): { slipMinHz: number; slipMaxHz: number } {
  return { slipMinHz: limits.incomingFaster ? 0 : -limits.slipHz, slipMaxHz: limits.slipHz };
}

/** Wraps to (−180°, 180°]. */
function wrap(a: number): number {
  let x = a % 360;
  if (x > 180) x -= 360;
  else if (x <= -180) x += 360;
  return x;
}

/**
 * SVG path of a trace of samples. Between two samples the angle moved by the slip times the time (the expected
 * turn) plus a small correction; unwrapping by the expected turn keeps a fast slip's long stretches going the
 * right way, and the path breaks where it crosses ±180° (it leaves one edge and comes back at the other).
 */
export function tracePath(f: PlaneFrame, samples: readonly PlaneSample[]): string {
  const parts: string[] = [];
  let prev: PlaneSample | null = null;
  let prevUnwrapped = 0;
  const pt = (a: number, s: number): string => `${planeX(f, a).toFixed(1)} ${planeY(f, clampSlip(f, s).slipHz).toFixed(1)}`;
  for (const p of samples) {
    if (!Number.isFinite(p.angleDeg) || !Number.isFinite(p.slipHz)) {
      prev = null;
      continue;
    }
    if (!prev) {
      parts.push(`M ${pt(p.angleDeg, p.slipHz)}`);
      prev = p;
      prevUnwrapped = p.angleDeg;
      continue;
    }
    const expected = 180 * (prev.slipHz + p.slipHz) * (p.tS - prev.tS);
    const unwrapped = prevUnwrapped + expected + wrap(p.angleDeg - prev.angleDeg - expected);
    // Walk from prevUnwrapped to unwrapped, splitting at every odd multiple of 180°.
    let a0 = prevUnwrapped;
    const s0 = prev.slipHz;
    const dir = Math.sign(unwrapped - a0);
    let guard = 0;
    while (dir !== 0 && guard++ < 50) {
      const edge = dir > 0 ? Math.floor((a0 + 180) / 360) * 360 + 180 : Math.ceil((a0 - 180) / 360) * 360 - 180;
      const reaches = dir > 0 ? edge < unwrapped : edge > unwrapped;
      if (!reaches || edge === a0) break;
      const frac = (edge - prevUnwrapped) / (unwrapped - prevUnwrapped);
      const sEdge = s0 + frac * (p.slipHz - s0);
      parts.push(`L ${pt(dir > 0 ? 180 : -180, sEdge)}`);
      parts.push(`M ${pt(dir > 0 ? -180 : 180, sEdge)}`);
      a0 = edge + dir * 1e-9;
    }
    parts.push(`L ${pt(p.angleDeg, p.slipHz)}`);
    prev = p;
    prevUnwrapped = unwrapped;
  }
  return parts.join(' ');
}

/** Keeps the samples of the last `seconds` before `nowS` (and at most `max` of them). */
export function keepRecent(samples: readonly PlaneSample[], nowS: number, seconds: number, max = 2000): PlaneSample[] {
  const from = nowS - seconds;
  const kept = samples.filter((s) => s.tS >= from && s.tS <= nowS + 1e-9);
  return kept.length > max ? kept.slice(kept.length - max) : kept;
}

/** Round angle ticks every 45° and slip ticks on round steps. */
export function planeTicks(f: PlaneFrame): { angles: number[]; slips: number[]; slipDecimals: number } {
  const step = niceStep(f.slipHiHz - f.slipLoHz, 4);
  const slips: number[] = [];
  for (let k = Math.ceil(f.slipLoHz / step - 1e-9); k * step <= f.slipHiHz + 1e-9; k++) slips.push(Number((k * step).toFixed(6)) || 0);
  const d = step >= 1 ? 0 : step >= 0.1 ? (Math.abs(step * 10 - Math.round(step * 10)) < 1e-9 ? 1 : 2) : step >= 0.01 ? 2 : 3;
  return { angles: [-180, -135, -90, -45, 0, 45, 90, 135, 180], slips, slipDecimals: d };
}

/** Radii of the operating point and the contact marker, SVG units. */
export const POINT_R = 6;
export const CONTACT_R = 7;
/** Clear space kept between the two markers' edges, SVG units. */
const MARKER_GAP = 4;
/** How far a leader crosses the slip line below (or above) the contact point, so the exact angle is marked. */
const TICK = 5;

/** Where the contact marker is drawn: on its own place, or lifted clear of the operating point with a leader down to it. */
export interface ContactMarker {
  /** Centre of the marker: x is always the contact's angle; y is its slip line unless lifted. */
  x: number;
  y: number;
  lifted: boolean;
  /** The leader from the lifted marker's edge across the slip line at the contact's angle (null when not lifted). */
  leader: { x: number; y1: number; y2: number } | null;
}

/**
 * Places the contact marker so it and the operating point both stay readable. With a small advance (a fast breaker,
 * a low slip) the contact a command given now would land at is only a few units from the point itself, and the two
 * circles would cover each other: the marker is then lifted off the slip line (above it, or below near the top edge)
 * by the two radii and a gap, keeping its x — its angle — and a leader runs from it across the slip line at that
 * angle, so where contact lands is still drawn exactly.
 */
export function contactMarker(f: PlaneFrame, point: { x: number; y: number } | null, contact: { x: number; y: number }): ContactMarker {
  const clear = POINT_R + CONTACT_R + MARKER_GAP;
  if (!point || Math.hypot(contact.x - point.x, contact.y - point.y) >= clear) return { x: contact.x, y: contact.y, lifted: false, leader: null };
  const up = contact.y - clear - CONTACT_R >= f.pad.t;
  const dir = up ? -1 : 1;
  const y = contact.y + dir * clear;
  return { x: contact.x, y, lifted: true, leader: { x: contact.x, y1: y - dir * CONTACT_R, y2: contact.y - dir * TICK } };
}
