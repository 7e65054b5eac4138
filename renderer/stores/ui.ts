/** Which view is shown; mirrored in the URL hash so a reload stays put. */
import { defineStore } from 'pinia';
import { ref, watch } from 'vue';

/**
 * The app's views, in navigation order. Labels are short so eight fit on one line of the top bar
 * at 1360 px ("Sync" is the Synchronizing view; `title` gives the full name).
 */
export const VIEWS = [
  { id: 'plant', label: 'Plant' },
  { id: 'sharing', label: 'Sharing' },
  { id: 'planner', label: 'Planner' },
  { id: 'synchronizing', label: 'Sync', title: 'Synchronizing' },
  { id: 'transients', label: 'Transients' },
  { id: 'trainer', label: 'Trainer' },
  { id: 'commissioning', label: 'Commissioning' },
  { id: 'report', label: 'Report' },
] as const;

export type ViewId = (typeof VIEWS)[number]['id'];

function fromHash(): ViewId {
  const h = typeof location === 'undefined' ? '' : location.hash.replace(/^#\/?/, '');
  return VIEWS.find((v) => v.id === h)?.id ?? 'plant';
}

export const useUiStore = defineStore('ui', () => {
  const view = ref<ViewId>(fromHash());
  watch(view, (v) => {
    if (typeof history !== 'undefined') history.replaceState(null, '', `#/${v}`);
  });
  function show(v: ViewId): void {
    view.value = v;
  }
  return { view, show };
});
