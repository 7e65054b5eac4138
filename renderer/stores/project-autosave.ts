/**
 * Autosave of the recovery copy: a moment after each edit the host replaces the copy; once
 * the project is clean again (saved, or the edits undone) the copy goes. Used by the
 * project store, which decides what the copy holds.
 */
import { onScopeDispose, ref, watch } from 'vue';
import type { Ref } from 'vue';
import type { RecoveryCopy } from '../../shared-types';
import { host } from '../host';
import { messageOf } from '../transport';

/** Wait after the last edit before the recovery copy is written, ms. */
export const AUTOSAVE_DELAY_MS = 1500;

/** What autosave watches and writes. */
export interface AutosaveSource {
  /** The project's content (changes on every edit). */
  content: Readonly<Ref<string | null>>;
  dirty: Readonly<Ref<boolean>>;
  /** Turns true when autosave may replace the copy (the restore question is answered). */
  enabled: Readonly<Ref<boolean>>;
  /** False while a project is being put in place part by part. */
  settled(): boolean;
  /** The copy to keep now, or null when there is nothing to keep. */
  copy(): Omit<RecoveryCopy, 'savedAt'> | null;
  onError(message: string): void;
}

/** Starts autosave for `src`; returns the time of the last copy and a way to write a pending one at once. */
export function useAutosave(src: AutosaveSource): { lastAutosaveAt: Ref<string | null>; flushAutosave(): Promise<void> } {
  const lastAutosaveAt = ref<string | null>(null);
  let timer: ReturnType<typeof setTimeout> | null = null;

  async function writeNow(): Promise<void> {
    timer = null;
    const copy = src.copy();
    if (!src.dirty.value || copy === null) return;
    try {
      lastAutosaveAt.value = (await host().call('recoveryWrite', copy)).savedAt;
    } catch (e) {
      src.onError(`The recovery copy could not be kept: ${messageOf(e)}`);
    }
  }

  watch([src.content, src.enabled], ([, enabled], [before]) => {
    if (!enabled) return;
    if (timer) clearTimeout(timer);
    timer = null;
    if (src.dirty.value) timer = setTimeout(() => void writeNow(), AUTOSAVE_DELAY_MS);
    else if (before !== undefined && src.settled())
      void host()
        .call('recoveryDiscard', {})
        .catch(() => null);
  });

  onScopeDispose(() => {
    if (timer) clearTimeout(timer);
  });

  /** Writes the pending recovery copy at once (tests; before the page goes away). */
  async function flushAutosave(): Promise<void> {
    if (timer) {
      clearTimeout(timer);
      await writeNow();
    }
  }

  return { lastAutosaveAt, flushAutosave };
}
