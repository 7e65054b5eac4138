/**
 * Colour scale of the closing map: a sequential ramp from pale to deep blue-violet through
 * teal and yellow-green stops chosen to stay ordered in lightness, so the map reads in grey
 * and for colour-blind readers (lightness alone carries the value).
 */
const STOPS: [number, number, number][] = [
  [250, 248, 226],
  [196, 226, 160],
  [104, 190, 160],
  [46, 140, 160],
  [44, 88, 140],
  [42, 38, 96],
];

/** RGB of `t` in [0, 1] on the scale. */
export function heatColour(t: number): [number, number, number] {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)) * (STOPS.length - 1);
  const i = Math.min(STOPS.length - 2, Math.floor(x));
  const f = x - i;
  const a = STOPS[i]!;
  const b = STOPS[i + 1]!;
  return [Math.round(a[0] + f * (b[0] - a[0])), Math.round(a[1] + f * (b[1] - a[1])), Math.round(a[2] + f * (b[2] - a[2]))];
}

/** Index of the grid cell nearest `value` on an evenly spaced axis. */
export function nearestIndex(axis: readonly number[], value: number): number {
  if (axis.length < 2) return 0;
  const first = axis[0]!;
  const step = (axis[axis.length - 1]! - first) / (axis.length - 1);
  return Math.min(axis.length - 1, Math.max(0, Math.round((value - first) / step)));
}
