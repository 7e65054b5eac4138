/**
 * Frame-time meter for the live scopes: the time from the start of an animation-frame
 * callback until Vue has patched the DOM for it, and the interval between frames. Kept
 * in a small ring; exposed on `window.__drooplineFrames` only when the page address
 * carries `?measure-frames` (the e2e measurement reads it), so normal use pays nothing
 * beyond two clock reads a frame.
 */
import { nextTick } from 'vue';

/** Last frames' work times and intervals, ms. */
export interface FrameRecord {
  workMs: number[];
  intervalMs: number[];
}

const KEEP = 1200;

declare global {
  interface Window {
    __drooplineFrames?: Record<string, FrameRecord>;
  }
}

function enabled(): boolean {
  return typeof location !== 'undefined' && /[?&]measure-frames\b/.test(location.search);
}

/** A meter for one named loop; call `begin()` at the start of the frame callback. */
export function frameMeter(name: string): { begin(nowMs: number): void } {
  if (!enabled()) return { begin: () => undefined };
  const all = (window.__drooplineFrames ??= {});
  const rec: FrameRecord = (all[name] = { workMs: [], intervalMs: [] });
  let last: number | null = null;
  return {
    begin(nowMs: number) {
      const start = performance.now();
      if (last !== null) rec.intervalMs.push(nowMs - last);
      last = nowMs;
      void nextTick(() => {
        rec.workMs.push(performance.now() - start);
        if (rec.workMs.length > KEEP) rec.workMs.shift();
        if (rec.intervalMs.length > KEEP) rec.intervalMs.shift();
      });
    },
  };
}
