import bcrypt from 'bcryptjs';
import { createStageKernel, METRICS, parseDesign } from '@sigmatail/engine';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from './createDb.js';
import { DEMO_DESIGNS } from './demoDesigns.js';
import { engineExampleDesigns } from './engineExampleDesigns.js';
import { DEMO_PASSWORD, DEMO_USERS, DEMO_WORKSPACE_NAME } from './demoWorkspace.js';
import { seedDemo } from './seedDemo.js';
import { TEST_DATABASE_URL } from './testing/testDatabaseUrl.js';

const db = createDb(TEST_DATABASE_URL, { max: 2 });
afterAll(() => db.destroy());

describe('demo designs', () => {
  it.each(DEMO_DESIGNS.map((d) => [String(d.name), d] as const))(
    '%s passes the engine’s parseDesign and has a bias point',
    (_name, doc) => {
      const parsed = parseDesign(doc);
      expect(parsed.ok ? [] : parsed.errors).toEqual([]);
      if (!parsed.ok) return;
      const kernel = createStageKernel(parsed.design);
      const nominal = kernel.nominalInputs();
      const out = kernel.metrics.map(() => new Float64Array(1));
      kernel.evaluate(
        Array.from(nominal, (v) => Float64Array.of(v)),
        1,
        out,
      );
      const valid = out[kernel.metrics.indexOf('valid')]![0];
      expect(valid).toBe(1);
      // Midband columns first; frequency columns after (every demo design has capacitors).
      expect(kernel.metrics.slice(0, METRICS.length)).toEqual(METRICS.map((m) => m.id));
      expect(kernel.metrics).toContain('acBalanceDb@20000');
    },
  );
});

describe('seedDemo', () => {
  it('creates the workshop, one user per role and the designs, and is idempotent', async () => {
    // Run twice concurrently and once more: every start may seed, and two processes may race.
    await Promise.all([seedDemo(db), seedDemo(db)]);
    const { workspaceId } = await seedDemo(db);
    const workspaces = await db
      .selectFrom('workspaces')
      .select('id')
      .where('name', '=', DEMO_WORKSPACE_NAME)
      .execute();
    expect(workspaces).toEqual([{ id: workspaceId }]);

    const members = await db
      .selectFrom('memberships as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select(['u.email', 'm.role', 'u.password_hash'])
      .where('m.workspace_id', '=', workspaceId)
      .execute();
    for (const demo of DEMO_USERS) {
      const m = members.find((x) => x.email === demo.email);
      expect(m?.role).toBe(demo.role);
      expect(await bcrypt.compare(DEMO_PASSWORD, m!.password_hash)).toBe(true);
      expect(m!.password_hash).toMatch(/^\$2[aby]\$10\$/); // cost 10
    }
    const designs = await db
      .selectFrom('designs')
      .select(['name', 'latest_rev'])
      .where('workspace_id', '=', workspaceId)
      .execute();
    const examples = engineExampleDesigns();
    expect(examples.length).toBeGreaterThan(0);
    for (const d of [...DEMO_DESIGNS, ...examples]) {
      expect(designs.filter((x) => x.name === d.name)).toEqual([{ name: d.name, latest_rev: 1 }]);
    }
  });

  it('gives the workshop a price table and one saved tolerance plan, once', async () => {
    const { workspaceId } = await seedDemo(db);
    await seedDemo(db);
    const prices = await db
      .selectFrom('price_tables')
      .select('prices')
      .where('workspace_id', '=', workspaceId)
      .execute();
    expect(prices).toHaveLength(1);
    const plans = await db
      .selectFrom('production_plans')
      .select(['result', 'assignment'])
      .where('workspace_id', '=', workspaceId)
      .execute();
    expect(plans).toHaveLength(1);
    const result = plans[0]!.result as { chosen: { highPpm: number } | null; frontier: unknown[] };
    expect(result.chosen!.highPpm).toBeLessThanOrEqual(500);
    expect(result.frontier.length).toBeGreaterThan(1);
  });
});
