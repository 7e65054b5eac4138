/** Which view is shown; mirrored in the URL hash so a reload stays put. */
import { defineStore } from 'pinia';
import { ref, watch } from 'vue';

/** The app's views, in navigation order. */
export const VIEWS = [
  { id: 'plant', label: 'Plant' },
  { id: 'sharing', label: 'Sharing' },
  { id: 'planner', label: 'Planner' },
  { id: 'synchronizing', label: 'Synchronizing' },
  { id: 'transients', label: 'Transients' },
  { id: 'trainer', label: 'Trainer' },
  { id: 'commissioning', label: 'Commissioning' },
  { id: 'report', label: 'Report' },
] as const;

export type ViewId = (typeof VIEWS)[number]['id'];

function fromHash(): ViewId {
  const h = typeof location === 'undefined' ? '' : location.hash.replace(/^#\/?/, '');
  return (VIEWS.find((v) => v.id === h)?.id ?? 'plant');
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
