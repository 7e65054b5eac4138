/**
 * The renderer tests' one set-up: fresh Pinia stores with an engine client (the handler table in-process unless a
 * test brings its own), the test as the animation clock, waiting for engine answers to land, and a view mounted with
 * the demo plant.
 */
import { vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import type { VueWrapper } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { Component } from 'vue';
import { usePlantStore } from '../../renderer/stores';
import { setEngineClient } from '../../renderer/transport';
import type { EngineClient } from '../../renderer/transport';
import { directClient } from '../helpers/direct-client';

/** Fresh stores, and every engine call answered by `client` (default: the handler table in-process). */
export function freshStores(client: EngineClient = directClient()): void {
  setActivePinia(createPinia());
  setEngineClient(client);
}

/** The test is the clock: no animation frames of the view's own (undo with `vi.unstubAllGlobals()`). */
export function holdFrames(): void {
  vi.stubGlobal('requestAnimationFrame', () => 1);
  vi.stubGlobal('cancelAnimationFrame', () => undefined);
}

/** Lets the pending engine answers land: flush, wait for the store (default: the plant store) to settle, flush. */
export async function settle(store: { settled(): Promise<unknown> } = usePlantStore()): Promise<void> {
  await flushPromises();
  await store.settled();
  await flushPromises();
}

/** Fresh stores, the demo plant, and `view` mounted in the document (so focus and keys work) once the engine has answered. */
export async function mountView(
  view: Component,
  options: { client?: EngineClient; settleOn?: () => { settled(): Promise<unknown> } } = {},
): Promise<VueWrapper> {
  freshStores(options.client);
  await usePlantStore().loadDemo();
  const w = mount(view, { attachTo: document.body });
  await settle(options.settleOn?.());
  return w as VueWrapper;
}
