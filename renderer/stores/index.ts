/**
 * The public face of the Pinia stores: views and components import from here only (ESLint's `no-restricted-imports`
 * keeps it so), never from a store's own file. What is not listed here is the stores' business: the draft's paths and
 * cloning, the autosave, the project parts, the transients' rules.
 */
export { useCommissioningStore } from './commissioning';
export type { CommissioningField } from './commissioning';
export { hzBandIssues, PLANNER_FIELDS, usePlannerStore } from './planner';
export type { PlannerField } from './planner';
export { usePlantStore } from './plant';
export { useProjectStore } from './project';
export { useReportStore } from './report';
export { LOAD_PCT_MAX, useSharingStore } from './sharing';
export { useSyncStore } from './sync';
export type { SyncField } from './sync';
export { CLOSE_KEY, TRAINER_KEYS, useTrainerStore } from './trainer';
export { useTransientsStore } from './transients';
export type { TransientRun } from './transients';
export { EVENT_TYPES } from './transients-rules';
export { useUiStore, VIEWS } from './ui';
export type { ViewId } from './ui';

/** Recipes the plant editor hands to `usePlantStore().change(recipe)`: each takes the draft and returns the next one. */
export { addItem, changeRatedFrequency, duplicateItem, getIn, moveItem, removeItem, samePlain, setIn, TYPICAL_MACHINE, TYPICAL_RANGES } from './plant-draft';
export type { LoadDraft, PlantDraft } from './plant-draft';
