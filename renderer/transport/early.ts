/**
 * The demo plant's first check (`checkPlant` at the plant's own loads, not described), asked for by `main.ts` before
 * the app's code has loaded and kept here for the plant store's first demo load: the engine answers while the app
 * loads. A check nobody takes is dropped quietly (its failure, if any, is the taker's to report).
 */
import type { CheckedPlant } from '../../shared-types';

let demoCheck: Promise<CheckedPlant> | null = null;

export function keepDemoCheck(call: Promise<CheckedPlant>): void {
  call.catch(() => undefined);
  demoCheck = call;
}

/** The kept check, once (later loads make their own). */
export function takeDemoCheck(): Promise<CheckedPlant> | null {
  const call = demoCheck;
  demoCheck = null;
  return call;
}
