/**
 * The report's data assembly, pure: which loads the sharing table solves, the sync-check settings and the case at
 * the window's edge, the scenarios to run, and the report's data once every result is in. The report handler
 * (`electron/handlers/report-handlers.ts`) calls the engine for each result with these and hands the data to the
 * renderer (`electron/report/`). Each section may fail on its own (its problem is printed in its place);
 * cancellation stops the whole report.
 */
import type { BuildReportRequest, CappedLoad, Plant, ProjectScenario, ProjectSyncSettings, Scenario, SyncCase, SyncPreset } from '../../../shared-types';
import { describePlant } from '../describe-plant';
import { EngineError, InvalidInput } from '../errors';
import type { ReportData, SharingPoint, SyncPart, TransientPart } from './report-data';
import { formatNumber } from '../../../shared-types';

/** Sharing-table loads when the request names none, % of the online sets' rated kW. */
export const DEFAULT_LOADS_PCT: readonly number[] = [25, 50, 75, 100];
/** Load power factor at those points when the request names none (lagging). */
export const DEFAULT_LOAD_PF = 0.8;
/**
 * Sync-check limits used when the project has none and the engine lists no preset: typical
 * settings between generating sets (common practice), not a standard.
 */
export const FALLBACK_SYNC_LIMITS = { slipHz: 0.2, angleDeg: 10, voltagePct: 5, incomingFaster: true, incomingHigher: false } as const;
/** Breaker closing time used when the project has none, ms (LV air breakers 30–80 ms, common practice). */
export const DEFAULT_BREAKER_MS = 60;

/** The sentence of anything a section throws; cancellation is re-thrown so the report stops. */
export function problemOf(err: unknown): string {
  if (err instanceof EngineError && err.code === 'CANCELLED') throw err;
  if (err instanceof Error) return err.message;
  return String(err);
}

/**
 * The report's own scenario for a plant without any: a block load of 25 % of the online sets'
 * rated kW at power factor 0.8 landing at 1 s, run for 15 s (long enough for the ISO 8528-5
 * recovery times of classes G1–G3, at most 10 s).
 */
export function defaultScenario(plant: Plant): ProjectScenario {
  const onlineKW = plant.sets.filter((s) => s.online).reduce((a, s) => a + s.ratedKW, 0);
  const kW = Math.round(onlineKW * 0.25);
  const kVAR = Math.round(kW * Math.tan(Math.acos(DEFAULT_LOAD_PF)));
  return {
    id: 'report-default',
    name: `Block load ${kW} kW, ${kVAR} kVAR at 1 s`,
    durationS: 15,
    stepMs: 1,
    events: [{ atS: 1, type: 'load-step', kW, kVAR }],
  };
}

/** The set to synchronize when the project names none: the first offline set, else the last set. */
export function pickIncoming(plant: Plant): string {
  return (plant.sets.find((s) => !s.online) ?? plant.sets[plant.sets.length - 1])?.id ?? '';
}

/** How close to each limit the "window edge" case sits (just inside, so rounding never blocks it). */
export const EDGE_FRACTION = 0.999;

/**
 * The sync-check case of a close at the edge of the window: slip, phase angle and voltage
 * difference at their limits (times `EDGE_FRACTION`). Its surge is the largest a permissive close can give before
 * breaker travel; the advance angle is for the largest slip the window allows.
 */
export function edgeCase(plant: Plant, s: ProjectSyncSettings, incomingSetId: string): SyncCase {
  const set = plant.sets.find((g) => g.id === incomingSetId);
  if (!set) throw new InvalidInput(`sync.incomingSetId: "${incomingSetId}" is not a set of the plant.`);
  // The incoming set is not on the bus yet: the running bus is the other online sets.
  const busPlant: Plant = { ...plant, sets: plant.sets.map((g) => (g.id === incomingSetId ? { ...g, online: false } : g)) };
  const f = plant.ratedFrequencyHz;
  const v = plant.ratedVoltageV;
  return {
    bus: { frequencyHz: f, voltageV: v, angleDeg: 0 },
    incoming: {
      frequencyHz: f + EDGE_FRACTION * s.limits.slipHz,
      voltageV: v * (1 + (EDGE_FRACTION * s.limits.voltagePct) / 100),
      angleDeg: EDGE_FRACTION * s.limits.angleDeg,
      ratedKVA: set.ratedKVA,
      xddpPU: set.machine.xddpPU,
      inertiaS: set.machine.inertiaS,
      poles: set.poles,
    },
    plant: busPlant,
    incomingSetId,
    breakerClosingMs: s.breakerClosingMs,
    limits: s.limits,
    dead: s.dead,
  };
}

const formatPct = (v: number) => (Math.abs(v - Math.round(v)) < 0.05 ? String(Math.round(v)) : formatNumber(v, 1));

/** A load point the sharing table solves: the plant's own loads, or a constant-power override. */
export interface WantedLoad {
  label: string;
  loadPct: number | null;
  kW: number;
  kVAR: number;
  /** True: solve `{ kW, kVAR }` at most the sets can carry; false: the plant's own loads. */
  override: boolean;
}

/** The online sets' rated kW. */
function onlineRatedKW(plant: Plant): number {
  return plant.sets.filter((s) => s.online).reduce((a, s) => a + s.ratedKW, 0);
}

/**
 * The sharing table's loads: the connected load, each requested % of the online rated kW at `loadPF`, and the
 * overload point (every online set at its overload limit) when not already listed.
 */
export function reportLoads(req: BuildReportRequest, loadPF: number): WantedLoad[] {
  const plant = req.project.plant;
  const onlineKW = onlineRatedKW(plant);
  const connected = plant.loads.filter((l) => l.online);
  const tanPhi = Math.tan(Math.acos(loadPF));
  // The overload point: every online set at its overload (fuel) limit, as % of the online rating.
  const overloadKW = plant.sets.filter((s) => s.online).reduce((a, s) => a + (s.ratedKW * s.overloadPct) / 100, 0);
  const overloadPct = onlineKW > 0 ? (100 * overloadKW) / onlineKW : 0;
  const pcts = (req.loadsPct ?? DEFAULT_LOADS_PCT).map((pct) => ({ pct, label: `${pct} %` }));
  if (onlineKW > 0 && !pcts.some((x) => Math.abs(x.pct - overloadPct) < 1e-9))
    pcts.push({ pct: overloadPct, label: `overload limit (${formatPct(overloadPct)} %)` });
  return [
    {
      label: 'connected load',
      loadPct: null,
      kW: connected.reduce((a, l) => a + l.kW, 0),
      kVAR: connected.reduce((a, l) => a + l.kVAR, 0),
      override: false,
    },
    ...pcts.map(({ pct, label }) => ({
      label,
      loadPct: pct,
      kW: (onlineKW * pct) / 100,
      kVAR: ((onlineKW * pct) / 100) * tanPhi,
      override: true,
    })),
  ];
}

/** An empty sharing point for `w` (its result or problem is filled in once solved). */
export function sharingPoint(w: WantedLoad): SharingPoint {
  return { label: w.label, loadPct: w.loadPct, loadKW: w.kW, loadKVAR: w.kVAR, result: null, problem: null, note: null };
}

/** The row's note when a load beyond the sets was answered at the most they carry. */
export function cappedNote(plant: Plant, cap: CappedLoad): string {
  const onlineKW = onlineRatedKW(plant);
  return `${Math.round(cap.requestedKW)} kW cannot be carried (${Math.round(cap.shortKW)} kW short); shown: the most the sets carry, ${Math.round(cap.carriedKW)} kW${onlineKW > 0 ? ` (${formatPct((100 * cap.carriedKW) / onlineKW)} % of rating)` : ''}.`;
}

/**
 * The sync-check part before its results: the project's settings, or (none given) the common-practice preset
 * between generating sets with the default breaker time; the incoming set; or a problem when there is none.
 */
export function syncPartFor(req: BuildReportRequest, presets: SyncPreset[]): SyncPart | { problem: string } {
  const plant = req.project.plant;
  const given = req.project.sync ?? null;
  // Between generating sets the common-practice preset fits better than a utility-tie table.
  const first = presets.find((p) => p.id === 'practice-generating-sets') ?? presets.find((p) => p.id.includes('practice')) ?? presets[0] ?? null;
  const settings: ProjectSyncSettings = given ?? {
    presetId: first?.id ?? null,
    limits: first?.limits ?? { ...FALLBACK_SYNC_LIMITS },
    breakerClosingMs: DEFAULT_BREAKER_MS,
    dead: { deadBus: false, deadLine: false, livePct: 80, deadPct: 20 },
    incomingSetId: null,
  };
  const incomingSetId = settings.incomingSetId ?? pickIncoming(plant);
  if (!incomingSetId) return { problem: 'The plant has no set to synchronize.' };
  return {
    settings,
    preset: presets.find((p) => p.id === settings.presetId) ?? null,
    defaulted: given === null,
    incomingSetId,
    edge: null,
    map: null,
    problem: null,
  };
}

/** The closing map's grid for the report (the request's, else 37 angles × 21 slips over ±0.5 Hz). */
export function reportMapGrid(req: BuildReportRequest): { angleSteps: number; slipSteps: number; slipRangeHz: number } {
  const grid = req.closingMap ?? {};
  return { angleSteps: grid.angleSteps ?? 37, slipSteps: grid.slipSteps ?? 21, slipRangeHz: grid.slipRangeHz ?? 0.5 };
}

/** The transient parts before their runs: the project's scenarios, or the report's own default. */
export function transientPartsFor(req: BuildReportRequest): TransientPart[] {
  const given = req.project.scenarios;
  const list = given ? given.map((scenario) => ({ scenario, defaulted: false })) : [{ scenario: defaultScenario(req.project.plant), defaulted: true }];
  return list.map(({ scenario, defaulted }) => ({ scenario, defaulted, result: null, problem: null }));
}

/** The simulation request of a scenario part (800 output points, enough for the report's charts). */
export function reportRun(plant: Plant, scenario: ProjectScenario): Scenario {
  return { name: scenario.name, plant, durationS: scenario.durationS, stepMs: scenario.stepMs, outputPoints: 800, events: scenario.events };
}

/** The report's data once every section is in. */
export function reportData(
  req: BuildReportRequest,
  parts: { sharing: SharingPoint[]; sync: SyncPart | { problem: string }; transients: TransientPart[] },
): ReportData {
  const plant = req.project.plant;
  return {
    title: req.project.name?.trim() || plant.name,
    date: req.date,
    plant,
    description: describePlant(plant),
    loadPF: req.loadPF ?? DEFAULT_LOAD_PF,
    ...parts,
  };
}
