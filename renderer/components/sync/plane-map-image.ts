/**
 * The closing map as an image for the window plane: one pixel per map cell (slip rows from
 * the top down, angle columns left to right) on the map's colour scale, scaled by the
 * plane. Made once per map and layer; the plane places it under the window.
 */
import type { ClosingMap } from '../../../shared-types';
import { heatColour } from './heat-scale';
import type { MapLayer } from './map-layer';

/** The magnitudes of one layer of the map (torque layers are signed; the shading shows their size). */
export function layerValues(map: ClosingMap, layer: MapLayer): number[] {
  if (layer === 'surge') return map.surgeCurrentPU;
  return (layer === 'torque' ? map.torqueStepPU : map.peakTorquePU).map((v) => Math.abs(v));
}

/** Largest finite value of a layer (1 when there is none, so the scale stays defined). */
export function layerMax(values: readonly number[]): number {
  return values.reduce((a, v) => (Number.isFinite(v) && v > a ? v : a), 0) || 1;
}

/** A PNG data URL of the layer and its largest value, or null where no canvas is available. */
export function mapImage(map: ClosingMap, layer: MapLayer): { url: string; max: number } | null {
  if (typeof document === 'undefined') return null;
  const nA = map.anglesDeg.length;
  const nS = map.slipsHz.length;
  const canvas = document.createElement('canvas');
  canvas.width = nA;
  canvas.height = nS;
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  const values = layerValues(map, layer);
  const max = layerMax(values);
  const img = ctx.createImageData(nA, nS);
  for (let j = 0; j < nS; j++) {
    // Row j of the map is slip j (lowest first); the image's top row is the highest slip.
    const row = nS - 1 - j;
    for (let i = 0; i < nA; i++) {
      const [r, g, b] = heatColour(values[j * nA + i]! / max);
      const k = 4 * (row * nA + i);
      img.data[k] = r;
      img.data[k + 1] = g;
      img.data[k + 2] = b;
      img.data[k + 3] = 255;
    }
  }
  ctx.putImageData(img, 0, 0);
  try {
    return { url: canvas.toDataURL('image/png'), max };
  } catch {
    return null;
  }
}
