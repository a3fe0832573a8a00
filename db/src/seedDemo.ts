import bcrypt from 'bcryptjs';
import { sql, type Kysely, type Transaction } from 'kysely';
import { DEMO_DESIGNS } from './demoDesigns.js';
import { demoLots } from './demoLots/demoLots.js';
import { DEMO_PLAN_DESIGN, DEMO_PLAN_TARGET, DEMO_PRICES, demoPlanResult } from './demoProduction.js';
import { engineExampleDesigns } from './engineExampleDesigns.js';
import {
  DEFAULT_WORKSPACE_SETTINGS,
  DEMO_PASSWORD,
  DEMO_USERS,
  DEMO_WORKSPACE_NAME,
} from './demoWorkspace.js';
import type { Database } from './schema.js';

/**
 * Creates the demo workshop, its four users (one per role), its demo designs (our own plus the
 * engine's valid examples), its demo lots, its price table and one saved tolerance plan. Idempotent: rows
 * that exist already (matched by workspace name, email, design name) are left as they are, so it
 * is safe to run on every start and never overwrites a password or design someone changed.
 */
export async function seedDemo(db: Kysely<Database>): Promise<{ workspaceId: string }> {
  return db.transaction().execute(async (tx) => {
    // Serialise concurrent seeders (two processes starting at once).
    await sql`select pg_advisory_xact_lock(7204361)`.execute(tx);
    let ws = await tx
      .selectFrom('workspaces')
      .select('id')
      .where('name', '=', DEMO_WORKSPACE_NAME)
      .executeTakeFirst();
    ws ??= await tx
      .insertInto('workspaces')
      .values({ name: DEMO_WORKSPACE_NAME, settings: JSON.stringify(DEFAULT_WORKSPACE_SETTINGS) })
      .returning('id')
      .executeTakeFirstOrThrow();
    const userIds: string[] = [];
    for (const u of DEMO_USERS) {
      let row = await tx.selectFrom('users').select('id').where('email', '=', u.email).executeTakeFirst();
      row ??= await tx
        .insertInto('users')
        .values({ email: u.email, name: u.name, password_hash: await bcrypt.hash(DEMO_PASSWORD, 10) })
        .returning('id')
        .executeTakeFirstOrThrow();
      await tx
        .insertInto('memberships')
        .values({ user_id: row.id, workspace_id: ws.id, role: u.role })
        .onConflict((oc) => oc.columns(['user_id', 'workspace_id']).doNothing())
        .execute();
      userIds.push(row.id);
    }
    const author = userIds[1] ?? userIds[0];
    for (const doc of [...DEMO_DESIGNS, ...engineExampleDesigns()]) {
      const name = String(doc.name);
      const found = await tx
        .selectFrom('designs')
        .select('id')
        .where('workspace_id', '=', ws.id)
        .where('name', '=', name)
        .executeTakeFirst();
      if (found) continue;
      const design = await tx
        .insertInto('designs')
        .values({ workspace_id: ws.id, name, created_by: author, latest_rev: 1 })
        .returning('id')
        .executeTakeFirstOrThrow();
      await tx
        .insertInto('design_revisions')
        .values({
          design_id: design.id,
          rev: 1,
          document: JSON.stringify(doc),
          message: 'Demo design',
          created_by: author,
        })
        .execute();
    }
    // Demo lots, matched by name like the designs.
    for (const lot of demoLots()) {
      const found = await tx
        .selectFrom('lots')
        .select('id')
        .where('workspace_id', '=', ws.id)
        .where('name', '=', lot.name)
        .executeTakeFirst();
      if (found) continue;
      await tx
        .insertInto('lots')
        .values({
          ...lot,
          workspace_id: ws.id,
          created_by: userIds[2] ?? author,
          data: JSON.stringify(lot.data),
          test_point: lot.test_point ? JSON.stringify(lot.test_point) : null,
        })
        .execute();
    }
    await seedProduction(tx, ws.id, author);
    return { workspaceId: ws.id };
  });
}

/** The demo price table and one saved plan, each only when the workshop has none yet. */
async function seedProduction(tx: Transaction<Database>, workspaceId: string, author: string | undefined) {
  await tx
    .insertInto('price_tables')
    .values({ workspace_id: workspaceId, prices: JSON.stringify(DEMO_PRICES), updated_by: author ?? null })
    .onConflict((oc) => oc.column('workspace_id').doNothing())
    .execute();
  const hasPlan = await tx
    .selectFrom('production_plans')
    .select('id')
    .where('workspace_id', '=', workspaceId)
    .executeTakeFirst();
  if (hasPlan) return;
  const design = await tx
    .selectFrom('designs as d')
    .innerJoin('design_revisions as r', (j) =>
      j.onRef('r.design_id', '=', 'd.id').onRef('r.rev', '=', 'd.latest_rev'),
    )
    .select(['d.id', 'r.rev', 'r.document'])
    .where('d.workspace_id', '=', workspaceId)
    .where('d.name', '=', DEMO_PLAN_DESIGN)
    .executeTakeFirst();
  const result = design && demoPlanResult(design.document);
  if (!design || !result) return;
  await tx
    .insertInto('production_plans')
    .values({
      workspace_id: workspaceId,
      design_id: design.id,
      revision: design.rev,
      created_by: author ?? null,
      target: JSON.stringify(DEMO_PLAN_TARGET),
      result: JSON.stringify(result),
      assignment: result.chosen ? JSON.stringify(result.chosen.assignment) : null,
    })
    .execute();
}
