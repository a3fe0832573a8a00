import type { Database } from '@sigmatail/db';
import { cpkInterval, nominalResults, parseDesign, type RunResults } from '@sigmatail/engine';
import type { Kysely } from 'kysely';
import { findDesign } from '../designs/designsRepo.js';
import { HttpError } from '../http/httpError.js';
import { presentPlan } from '../production/presentPlan.js';
import { latestStudy, listPlans } from '../production/productionRepo.js';
import { reportAgeing, reportLimits, reportPairing, reportPlan } from './reportSections.js';

/** One spec's line in the report: limits, yield with its 95 % Wilson interval, PPM, Cp, Cpk (95 % interval). */
export type ReportSpec = {
  metric: string;
  label: string | null;
  min: number | null;
  max: number | null;
  yield: number;
  wilson: [number, number];
  ppm: number;
  cp: number | null;
  cpk: number | null;
  cpkInterval: [number, number] | null;
};

/** The run a report rests on: the latest finished run of the design's newest revision that has one. */
export type ReportRun = {
  id: string;
  revision: number;
  samples: number;
  seed: string;
  plan: string;
  finishedAt: string | null;
  joint: { yield: number; wilson: [number, number]; clopperPearson: [number, number]; ppm: number };
  specs: ReportSpec[];
};

/** A reject rate in PPM with its 95 % interval. */
export type PpmInterval = { ppm: number; lowPpm: number; highPpm: number };

/** The latest saved tolerance plan of the design: the chosen classes and cost, estimate beside the confirming run. */
export type ReportPlan = {
  id: string;
  createdAt: string;
  targetPpm: number;
  currency: string;
  chosen: { classes: Record<string, number>; tube: string; cost: number; estimate: PpmInterval } | null;
  confirm: { runId: string; status: string; samples: number; result: PpmInterval | null } | null;
};

/** The latest saved pairing comparison: per strategy, reject rate, cost per good unit, tubes thrown away. */
export type ReportPairing = {
  createdAt: string;
  revision: number;
  currency: string | null;
  lotSize: number | null;
  strategies: { label: string; reject: PpmInterval; costPerGoodUnit: number; tubesThrownPerUnit: number }[];
};

/** The latest saved ageing result: reject rate new and aged, and each spec's margin after ageing. */
export type ReportAgeing = {
  createdAt: string;
  revision: number;
  asNew: PpmInterval;
  aged: PpmInterval;
  specs: { label: string; margin: number; marginSd: number | null }[];
};

/** The chosen end-of-line test limits of one metric, with their false-accept and false-reject rates. */
export type ReportLimits = {
  createdAt: string;
  metric: string | null;
  measurementSd: number;
  spec: { low?: number; high?: number };
  test: { low?: number; high?: number };
  falseAcceptPpm: number;
  falseRejectPpm: number;
  guardBand: number | null;
};

/** Everything the production report of one design shows (plain JSON). */
export type ProductionReport = {
  workspace: { name: string };
  design: { id: string; name: string; revision: number; topology: string; tube: string };
  /** Ratings exceeded at nominal (plate dissipation, heater–cathode voltage, …). */
  warnings: { code: string; message: string }[];
  run: ReportRun | null;
  plan: ReportPlan | null;
  pairing: ReportPairing | null;
  ageing: ReportAgeing | null;
  limits: ReportLimits | null;
  generatedAt: string;
};

async function latestDoneRun(db: Kysely<Database>, workspaceId: string, designId: string) {
  return db
    .selectFrom('runs as r')
    .innerJoin('run_results as rr', 'rr.run_id', 'r.id')
    .select(['r.id', 'r.revision', 'r.samples', 'r.seed', 'r.plan', 'r.finished_at', 'rr.results'])
    .where('r.workspace_id', '=', workspaceId)
    .where('r.design_id', '=', designId)
    .where('r.status', '=', 'done')
    .orderBy('r.revision', 'desc')
    .orderBy('r.finished_at', 'desc')
    .limit(1)
    .executeTakeFirst();
}

function reportRun(row: NonNullable<Awaited<ReturnType<typeof latestDoneRun>>>): ReportRun {
  const results = row.results as unknown as RunResults;
  return {
    id: row.id,
    revision: row.revision,
    samples: row.samples,
    seed: row.seed,
    plan: row.plan,
    finishedAt: row.finished_at ? new Date(row.finished_at).toISOString() : null,
    joint: {
      yield: results.joint.yield,
      wilson: results.joint.wilson,
      clopperPearson: results.joint.clopperPearson,
      ppm: results.joint.ppm,
    },
    specs: results.specs.map((s) => ({
      metric: s.metric,
      label: s.label,
      min: s.min,
      max: s.max,
      yield: s.yield,
      wilson: s.wilson,
      ppm: s.ppm,
      cp: s.cp,
      cpk: s.cpk,
      cpkInterval: cpkInterval(s.cpk, s.samples),
    })),
  };
}

/**
 * Gathers the production report of a design in the caller's workspace: the design at its latest
 * revision, ratings exceeded at nominal, and yield, PPM and Cpk with intervals from its latest
 * finished run. 404 when the design is not in the workspace.
 */
export async function buildProductionReport(
  db: Kysely<Database>,
  workspaceId: string,
  designId: string,
): Promise<ProductionReport> {
  const design = await findDesign(db, workspaceId, designId);
  if (!design) throw new HttpError(404, 'design not found', 'designId');
  const [revision, workspace, run, plans, pairing, ageing, limits] = await Promise.all([
    db
      .selectFrom('design_revisions')
      .select('document')
      .where('design_id', '=', design.id)
      .where('rev', '=', design.latest_rev)
      .executeTakeFirstOrThrow(),
    db.selectFrom('workspaces').select('name').where('id', '=', workspaceId).executeTakeFirstOrThrow(),
    latestDoneRun(db, workspaceId, design.id),
    listPlans(db, workspaceId, design.id),
    latestStudy(db, workspaceId, design.id, 'pairing'),
    latestStudy(db, workspaceId, design.id, 'ageing'),
    latestStudy(db, workspaceId, design.id, 'limits'),
  ]);
  const plan = plans[0] ? await presentPlan(db, workspaceId, plans[0]) : null;
  const parsed = parseDesign(revision.document);
  const warnings = parsed.ok
    ? nominalResults(parsed.design).warnings.map((w) => ({ code: w.code, message: w.message }))
    : [];
  return {
    workspace: { name: workspace.name },
    design: {
      id: design.id,
      name: design.name,
      revision: design.latest_rev,
      topology: parsed.ok ? parsed.design.topology : '',
      tube: parsed.ok ? parsed.design.tube.type : '',
    },
    warnings,
    run: run ? reportRun(run) : null,
    plan: plan && reportPlan(plan),
    pairing: pairing ? reportPairing(pairing) : null,
    ageing: ageing ? reportAgeing(ageing) : null,
    limits: limits ? reportLimits(limits) : null,
    generatedAt: new Date().toISOString(),
  };
}
