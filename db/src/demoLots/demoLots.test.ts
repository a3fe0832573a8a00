import { summarizeLot } from '@sigmatail/engine';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../createDb.js';
import { seedDemo } from '../seedDemo.js';
import type { ResistorLotData, TubeLotData } from '../schema.js';
import { TEST_DATABASE_URL } from '../testing/testDatabaseUrl.js';
import { demoLots } from './demoLots.js';

const db = createDb(TEST_DATABASE_URL, { max: 2 });
afterAll(() => db.destroy());

describe('demo lots', () => {
  it('are a few hundred rows each; the sorted reel looks binned, the metal film does not', () => {
    const [rk, rt, tubes] = demoLots();
    expect(rk!.count).toBe(300);
    const rkSummary = summarizeLot((rk!.data as ResistorLotData).values);
    expect(rkSummary.binned!.looksBinned).toBe(false);
    expect(rkSummary.mean).toBeGreaterThan(465);
    expect(rkSummary.mean).toBeLessThan(470);
    expect(summarizeLot((rt!.data as ResistorLotData).values).binned!.looksBinned).toBe(true);
    const t = tubes!.data as TubeLotData;
    expect(t.multipliers).toHaveLength(200);
    expect(t.multipliers.every((m) => m.length === 4 && m.every((v) => v > 0.3 && v < 3))).toBe(true);
  });

  it('are seeded into the demo workspace once, however often the seed runs', async () => {
    await seedDemo(db);
    const { workspaceId } = await seedDemo(db);
    const rows = await db
      .selectFrom('lots')
      .select(['name', 'count'])
      .where('workspace_id', '=', workspaceId)
      .execute();
    for (const lot of demoLots())
      expect(rows.filter((r) => r.name === lot.name)).toEqual([{ name: lot.name, count: lot.count }]);
  });
});
