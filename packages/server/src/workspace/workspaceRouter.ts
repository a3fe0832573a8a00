import { DEFAULT_WORKSPACE_SETTINGS, type WorkspaceSettings } from '@sigmatail/db';
import { MAX_SAMPLES, MIN_SAMPLES, SAMPLING_PLANS } from '@sigmatail/engine';
import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { sessionCacheFor } from '../auth/sessionCache.js';
import { nameField } from '../http/fields.js';

const settingsPatch = z
  .object({
    defaultSamples: z
      .int('must be a whole number')
      .min(MIN_SAMPLES, `must be at least ${MIN_SAMPLES}`)
      .max(MAX_SAMPLES, `must be at most ${MAX_SAMPLES}`),
    defaultPlan: z.enum(SAMPLING_PLANS, { message: `must be one of ${SAMPLING_PLANS.join(', ')}` }),
    defaultYieldTarget: z
      .number()
      .gt(0, 'must be above 0')
      .lt(1, 'must be below 1 (a fraction, 0.99 = 99 %)'),
  })
  .partial()
  .strict();
export const patchBody = z
  .object({ name: nameField.optional(), settings: settingsPatch.optional() })
  .strict();

/** GET /workspace (any member), PATCH /workspace {name?, settings?} (admin). */
export function createWorkspaceRouter({ db }: AppDeps): Router {
  const router = Router();

  const load = async (id: string) => {
    const w = await db
      .selectFrom('workspaces')
      .select(['id', 'name', 'settings'])
      .where('id', '=', id)
      .executeTakeFirstOrThrow();
    // Settings keys added later fall back to the defaults.
    const settings: WorkspaceSettings = { ...DEFAULT_WORKSPACE_SETTINGS, ...w.settings };
    return { id: w.id, name: w.name, settings };
  };

  router.get('/workspace', requireAuth, async (req, res) => {
    res.json({ workspace: await load(req.user!.workspaceId) });
  });

  router.patch('/workspace', requireRole('admin'), async (req, res) => {
    const body = patchBody.parse(req.body ?? {});
    const user = req.user!;
    await db.transaction().execute(async (tx) => {
      const current = await tx
        .selectFrom('workspaces')
        .select('settings')
        .where('id', '=', user.workspaceId)
        .forUpdate()
        .executeTakeFirstOrThrow();
      const settings = { ...DEFAULT_WORKSPACE_SETTINGS, ...current.settings, ...body.settings };
      await tx
        .updateTable('workspaces')
        .set({ settings: JSON.stringify(settings), ...(body.name ? { name: body.name } : {}) })
        .where('id', '=', user.workspaceId)
        .execute();
      await recordAudit(tx, {
        workspaceId: user.workspaceId,
        userId: user.id,
        action: 'workspace.update',
        detail: body,
      });
    });
    if (body.name) await sessionCacheFor(db).forgetAll(); // the name is part of every member's session
    res.json({ workspace: await load(user.workspaceId) });
  });

  return router;
}
