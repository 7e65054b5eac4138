/**
 * The report store: the report's options, building it through the engine (`buildReport`, with
 * progress and cancel) from the current plant, the Transients scenarios and the Synchronizing
 * settings, and the last report for preview, print and export.
 */
import { defineStore, getActivePinia } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import type { BuildReportRequest, ReportResult } from '../../shared-types';
import { host } from '../host';
import { EngineCallError, engine, messageOf } from '../transport';
import { above, numberFields } from './number-fields';
import { usePlantStore } from './plant';
import { useSyncStore } from './sync';
import { useTransientsStore } from './transients';

/** Sharing-table loads offered first, % of the online sets' rated kW. */
export const DEFAULT_REPORT_LOADS = [25, 50, 75, 100] as const;

/** Reads "25, 50, 75, 100" as numbers, or says which entry is wrong. */
export function parseLoads(text: string): { loads: number[]; problem: string | null } {
  const parts = text.split(/[,;\s]+/).filter(Boolean);
  if (parts.length === 0) return { loads: [], problem: 'loads: list at least one load, e.g. 25, 50, 75, 100' };
  if (parts.length > 12) return { loads: [], problem: 'loads: at most 12 loads' };
  const loads: number[] = [];
  for (const [i, p] of parts.entries()) {
    const n = Number(p.replace(/%$/, ''));
    if (!Number.isFinite(n)) return { loads: [], problem: `loads[${i}]: "${p}" is not a number` };
    if (n <= 0 || n > 200) return { loads: [], problem: `loads[${i}]: must be greater than 0 and at most 200 %` };
    loads.push(n);
  }
  return { loads, problem: null };
}

/**
 * The open project's name, read from the project store's state when that store exists (no
 * import, so the report does not depend on the project-file machinery); null otherwise.
 */
function openProjectName(): string | null {
  const state = getActivePinia()?.state.value as Record<string, { name?: unknown } | undefined> | undefined;
  const name = state?.['project']?.name;
  return typeof name === 'string' && name.trim() && name !== 'Untitled project' ? name.trim() : null;
}

/** Today's date as YYYY-MM-DD in local time. */
function today(): string {
  const d = new Date();
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}`;
}

export const useReportStore = defineStore('report', () => {
  const plantStore = usePlantStore();
  /** Name printed as the title; blank uses the open project's name, else the plant's. */
  const projectName = ref('');
  const date = ref(today());
  const loadsText = ref(DEFAULT_REPORT_LOADS.join(', '));
  const loadPF = ref(0.8);
  /** Include the Transients view's scenarios (otherwise the report runs its own block-load step). */
  const useScenarios = ref(true);
  const building = ref(false);
  const progress = ref(0);
  const progressLabel = ref('');
  const error = ref<string | null>(null);
  const result = shallowRef<ReportResult | null>(null);
  let controller: AbortController | null = null;

  /** The load power factor as typed: a refused entry keeps the last good value and names the rule (the engine's own). */
  const fields = numberFields<'loadPF'>(() => ({
    name: 'load power factor',
    rule: above(0, '', 1),
    get: () => loadPF.value,
    set: (v) => (loadPF.value = v),
  }));

  const loads = computed(() => parseLoads(loadsText.value));
  const pfProblem = computed(() =>
    Number.isFinite(loadPF.value) && loadPF.value > 0 && loadPF.value <= 1 ? null : 'loadPF: must be greater than 0 and at most 1',
  );
  const problems = computed(() =>
    [
      ...fields.sentences().map((r) => `Correct the marked field first: ${r}.`),
      loads.value.problem,
      pfProblem.value,
      date.value ? null : 'date: must not be empty',
    ].filter((p): p is string => !!p),
  );
  const canBuild = computed(() => !building.value && !!plantStore.plant && problems.value.length === 0);

  /** The request as it would be sent now (null without a plant). */
  function request(): BuildReportRequest | null {
    const plant = plantStore.plant;
    if (!plant) return null;
    const scenarios = useTransientsStore().snapshot();
    return {
      project: {
        name: projectName.value.trim() || openProjectName() || plant.name,
        plant,
        scenarios: useScenarios.value && scenarios.length ? scenarios : undefined,
        sync: useSyncStore().snapshot(),
      },
      date: date.value,
      loadsPct: loads.value.loads,
      loadPF: loadPF.value,
    };
  }

  /** Builds the report; resolves false when refused, failed or cancelled (the last report stays). */
  async function build(): Promise<boolean> {
    const req = request();
    if (!req || !canBuild.value) return false;
    building.value = true;
    progress.value = 0;
    progressLabel.value = 'starting';
    error.value = null;
    controller = new AbortController();
    try {
      result.value = await engine().call('buildReport', req, {
        signal: controller.signal,
        onProgress: (f, label) => {
          progress.value = f;
          progressLabel.value = label ?? '';
        },
      });
      return true;
    } catch (e) {
      error.value = e instanceof EngineCallError && e.code === 'CANCELLED' ? 'Report cancelled.' : messageOf(e);
      return false;
    } finally {
      building.value = false;
      controller = null;
    }
  }

  function cancel(): void {
    controller?.abort();
  }

  /** Where the last PDF went, or why it could not be made. */
  const pdfNote = ref<string | null>(null);
  /** Electron prints to PDF itself; the browser preview goes through its print dialog. */
  const canSavePdf = computed(() => host().kind === 'electron');

  /** Prints the last report to PDF (Electron) and saves it where the user chooses. */
  async function savePdf(): Promise<boolean> {
    const r = result.value;
    if (!r) return false;
    pdfNote.value = null;
    try {
      const saved = await host().call('reportSavePdf', { html: r.html, suggestedName: r.fileStem });
      if (saved) pdfNote.value = `Saved ${saved.fileName}.`;
      return saved !== null;
    } catch (e) {
      pdfNote.value = e instanceof Error ? e.message : String(e);
      return false;
    }
  }

  return {
    projectName,
    date,
    loadsText,
    loadPF,
    useScenarios,
    building,
    progress,
    progressLabel,
    error,
    result,
    loads,
    problems,
    canBuild,
    fieldIssues: fields.issues,
    take: fields.take,
    request,
    build,
    cancel,
    pdfNote,
    canSavePdf,
    savePdf,
  };
});
