/**
 * Geometry of the phasor scope. The bus phase-A phasor points straight up; angles grow
 * counter-clockwise (phasors rotate counter-clockwise, so a leading incoming set is drawn
 * ahead of the bus, to its left). Screen y runs down.
 */

/** A point on the scope, in SVG user units. */
export interface Point {
  x: number;
  y: number;
}

/** End of a phasor of length `r` at `angleDeg` from straight up (counter-clockwise positive). */
export function phasorTip(cx: number, cy: number, r: number, angleDeg: number): Point {
  const a = (angleDeg * Math.PI) / 180;
  return { x: cx - r * Math.sin(a), y: cy - r * Math.cos(a) };
}

/** The angle (degrees, counter-clockwise from straight up, in (−180, 180]) of a segment from the centre to `p`. */
export function angleOfTip(cx: number, cy: number, p: Point): number {
  const a = (Math.atan2(-(p.x - cx), -(p.y - cy)) * 180) / Math.PI;
  return a <= -180 ? a + 360 : a;
}

/** The three phases A, B, C of a set at `angleDeg` (phase A), 120° apart in the A-B-C sequence. */
export function threePhaseTips(cx: number, cy: number, r: number, angleDeg: number): [Point, Point, Point] {
  return [phasorTip(cx, cy, r, angleDeg), phasorTip(cx, cy, r, angleDeg - 120), phasorTip(cx, cy, r, angleDeg + 120)];
}

/** SVG path of a circular sector from −halfDeg to +halfDeg about straight up (the sync-check window). */
export function sectorPath(cx: number, cy: number, r: number, halfDeg: number): string {
  const h = Math.min(Math.max(halfDeg, 0), 179.9);
  const a = phasorTip(cx, cy, r, h);
  const b = phasorTip(cx, cy, r, -h);
  const large = 2 * h > 180 ? 1 : 0;
  // From the left edge (+h, counter-clockwise side) round clockwise on screen to the right edge (−h).
  return `M ${cx} ${cy} L ${a.x.toFixed(2)} ${a.y.toFixed(2)} A ${r} ${r} 0 ${large} 1 ${b.x.toFixed(2)} ${b.y.toFixed(2)} Z`;
}

/** Radius of the scope's rim as a fraction of its size (room outside it for the degree labels). */
export const RIM_FRACTION = 0.37;
