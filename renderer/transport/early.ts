/**
 * Calls the page makes before the app's code has loaded (the demo plant's first check, see `main.ts`), kept here for
 * the store that would otherwise make them: the engine answers while the app loads. A call nobody takes is dropped
 * quietly (its failure, if any, is the taker's to report).
 */
const kept = new Map<string, Promise<unknown>>();

/** The key of the demo plant's first check (`checkPlant` at the plant's own loads, not described). */
export const DEMO_CHECK = 'demo-check';

export function keepEarly<T>(key: string, call: Promise<T>): void {
  call.catch(() => undefined);
  kept.set(key, call);
}

/** The call kept under `key`, once (later takers make their own). */
export function takeEarly<T>(key: string): Promise<T> | undefined {
  const call = kept.get(key) as Promise<T> | undefined;
  kept.delete(key);
  return call;
}
