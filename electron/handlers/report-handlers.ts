/**
 * Handler for the plant report: it assembles the report by calling the engine directly — the sharing at each load,
 * the sync-check verdict and closing map, each scenario's run — with the sub-requests checked by the same schemas
 * the `evaluateSync`, `closingMap` and `simulate` methods use (so each section gets the same validation, work bounds
 * and numbers as the app's views and the CLI), and hands the data to the renderer in `electron/report/`.
 */
import { z } from 'zod';
import type { BuildReportRequest, ReportResult } from '../../shared-types';
import { Cancelled, evaluateSync, listSyncPresets, solveSharing, solveSharingAtMost } from '../engine';
import {
  DEFAULT_LOAD_PF,
  cappedNote,
  edgeCase,
  problemOf,
  reportData,
  reportLoads,
  reportMapGrid,
  reportRun,
  sharingPoint,
  syncPartFor,
  transientPartsFor,
} from '../engine/report';
import type { SharingPoint, SyncPart, TransientPart } from '../engine/report';
import { renderReport } from '../report';
import { breathe } from './handler';
import type { HandlerContext, HandlerGroup } from './handler';
import { runClosingMap, runScenario } from './long-jobs';
import { plantSchema } from '../schemas/plant-schema';
import { projectScenarioSchema, projectSyncSettingsSchema } from '../schemas/project-schema';
import { id, num, positive, text } from '../schemas/schema-kit';
import { scenarioSchema } from '../schemas/simulation-schema';
import { closingMapRequestSchema, syncCaseSchema } from '../schemas/sync-schema';
import { parseOrThrow } from '../schemas/validate';

const requestSchema: z.ZodType<BuildReportRequest> = z.object({
  project: z.object({
    name: text().optional(),
    plant: plantSchema,
    scenarios: z.array(projectScenarioSchema).optional(),
    sync: projectSyncSettingsSchema.nullable().optional(),
  }),
  date: id(),
  loadsPct: z
    .array(positive('%').max(200, { message: 'must be at most 200' }))
    .min(1, { message: 'must list at least one load' })
    .max(12, { message: 'must list at most 12 loads' })
    .optional(),
  loadPF: positive('').max(1, { message: 'must be at most 1' }).optional(),
  closingMap: z
    .object({
      angleSteps: num('steps').int().min(3).max(361).optional(),
      slipSteps: num('steps').int().min(3).max(201).optional(),
      slipRangeHz: positive('Hz').max(5, { message: 'must be at most 5' }).optional(),
    })
    .optional(),
});

/** Throws `Cancelled` once the caller has cancelled. */
function checkCancel(ctx: HandlerContext): void {
  if (ctx.signal.aborted) throw new Cancelled('The report was cancelled.');
}

/** A context for one long sub-job: its own progress, the report's cancel signal, no pool (the closed-form map and a run are quick). */
const sub = (ctx: HandlerContext, progress: (f: number) => void): HandlerContext => ({ progress, signal: ctx.signal });

/** The sharing table: each load point solved by the engine (a load beyond the sets at the most they carry). */
async function sharingPoints(req: BuildReportRequest, loadPF: number, ctx: HandlerContext): Promise<SharingPoint[]> {
  const plant = req.project.plant;
  const wanted = reportLoads(req, loadPF);
  const points: SharingPoint[] = [];
  for (const [i, w] of wanted.entries()) {
    checkCancel(ctx);
    ctx.progress((0.3 * i) / wanted.length, `sharing at ${w.label}`);
    const point = sharingPoint(w);
    await breathe();
    try {
      // A % point the sets cannot carry (feeder losses on top of the overload limit, a set that
      // saturates early) is answered at the most they can carry, and the row says so.
      point.result = w.override ? solveSharingAtMost(plant, { kW: w.kW, kVAR: w.kVAR }) : solveSharing(plant);
      if (point.result.capped) point.note = cappedNote(plant, point.result.capped);
    } catch (err) {
      point.problem = problemOf(err);
    }
    points.push(point);
  }
  return points;
}

/** The sync-check part: the verdict at the window's edge and the closing map, by the sync-check's own request rules. */
async function syncPart(req: BuildReportRequest, ctx: HandlerContext): Promise<SyncPart | { problem: string }> {
  checkCancel(ctx);
  ctx.progress(0.3, 'sync-check');
  const part = syncPartFor(req, listSyncPresets());
  if (!('settings' in part)) return part;
  try {
    await breathe();
    const edge = edgeCase(req.project.plant, part.settings, part.incomingSetId);
    part.edge = evaluateSync(parseOrThrow(syncCaseSchema, edge));
    checkCancel(ctx);
    await breathe();
    const mapRequest = parseOrThrow(closingMapRequestSchema, { case: edge, ...reportMapGrid(req) });
    part.map = await runClosingMap(
      mapRequest,
      sub(ctx, (f) => ctx.progress(0.3 + 0.2 * f, 'closing map')),
    );
  } catch (err) {
    part.problem = problemOf(err);
  }
  return part;
}

/** Each scenario's run (the simulator's own request rules and work bounds apply). */
async function transientParts(req: BuildReportRequest, ctx: HandlerContext): Promise<TransientPart[]> {
  const parts = transientPartsFor(req);
  for (const [i, part] of parts.entries()) {
    checkCancel(ctx);
    const base = 0.5 + (0.5 * i) / parts.length;
    const label = `simulating "${part.scenario.name}"`;
    ctx.progress(base, label);
    try {
      await breathe();
      const scenario = parseOrThrow(scenarioSchema, reportRun(req.project.plant, part.scenario));
      part.result = await runScenario(
        scenario,
        sub(ctx, (f) => ctx.progress(base + (0.5 * f) / parts.length, label)),
      );
    } catch (err) {
      part.problem = problemOf(err);
    }
  }
  return parts;
}

/**
 * Builds the report: each section's results straight from the engine (a section that fails prints its sentence in
 * its place; cancelling stops the whole report), then the page from `electron/report/`.
 */
async function buildReport(request: BuildReportRequest, ctx: HandlerContext): Promise<ReportResult> {
  const loadPF = request.loadPF ?? DEFAULT_LOAD_PF;
  const sharing = await sharingPoints(request, loadPF, ctx);
  const sync = await syncPart(request, ctx);
  const transients = await transientParts(request, ctx);
  ctx.progress(1, 'writing the report');
  return renderReport(request, reportData(request, { sharing, sync, transients }));
}

export const reportHandlers: HandlerGroup<'buildReport'> = {
  buildReport: {
    schema: requestSchema,
    run: (request, ctx) => buildReport(request, ctx),
  },
};
