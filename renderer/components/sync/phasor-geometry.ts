/**
 * Geometry of the phasor diagram. The bus phase-A phasor lies along the reference axis
 * (pointing right, as on a textbook phasor diagram); the incoming set's phase angle is drawn
 * by the synchronizing trade's convention: a positive angle (incoming ahead) is clockwise
 * from the bus, so a fast incoming set turns the diagram clockwise and a slow one
 * counter-clockwise, as on the panel instrument an operator reads. Screen y runs down.
 */

/** A point on the diagram, in SVG user units. */
export interface Point {
  x: number;
  y: number;
}

/** End of a phasor of length `r` at `angleDeg` from the reference axis, clockwise positive on screen. */
export function phasorTip(cx: number, cy: number, r: number, angleDeg: number): Point {
  const a = (angleDeg * Math.PI) / 180;
  return { x: cx + r * Math.cos(a), y: cy + r * Math.sin(a) };
}

/** The angle (degrees, clockwise from the reference axis, in (−180, 180]) of a segment from the centre to `p`. */
export function angleOfTip(cx: number, cy: number, p: Point): number {
  const a = (Math.atan2(p.y - cy, p.x - cx) * 180) / Math.PI;
  return a <= -180 ? a + 360 : a;
}

/** The three phases A, B, C of a set at `angleDeg` (phase A), 120° apart in the A-B-C sequence (B lags A). */
export function threePhaseTips(cx: number, cy: number, r: number, angleDeg: number): [Point, Point, Point] {
  return [phasorTip(cx, cy, r, angleDeg), phasorTip(cx, cy, r, angleDeg - 120), phasorTip(cx, cy, r, angleDeg + 120)];
}

/** SVG path of the sync-check window as an outline: two rays at ±halfDeg about the bus and the arc between them. */
export function windowOutlinePath(cx: number, cy: number, r: number, halfDeg: number): string {
  const h = Math.min(Math.max(halfDeg, 0), 179.9);
  const a = phasorTip(cx, cy, r, -h);
  const b = phasorTip(cx, cy, r, h);
  const large = 2 * h > 180 ? 1 : 0;
  // From the counter-clockwise edge (−h) clockwise on screen (sweep 1) to the clockwise edge (+h); not closed, not filled.
  return `M ${cx} ${cy} L ${a.x.toFixed(2)} ${a.y.toFixed(2)} A ${r} ${r} 0 ${large} 1 ${b.x.toFixed(2)} ${b.y.toFixed(2)} L ${cx} ${cy}`;
}

/** Length of a 1.1 pu phasor as a fraction of the diagram's size (room outside it for the words). */
export const REACH_FRACTION = 0.37;

/** The incoming set's speed against the bus, in words: the way the diagram turns. */
export function turningWords(slipHz: number): string {
  if (!Number.isFinite(slipHz) || Math.abs(slipHz) < 5e-4) return 'incoming in step with the bus: the diagram stands still';
  return slipHz > 0 ? 'incoming fast: the diagram turns clockwise' : 'incoming slow: the diagram turns counter-clockwise';
}
