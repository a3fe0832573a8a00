import { randomBytes } from 'node:crypto';
import type { Role } from '@sigmatail/db';
import { exampleDesign } from '../runs/testing/exampleDesign.js';
import { buildTeam, type BuiltUser } from './buildUser.js';
import { readMail } from './readMail.js';
import { signIn } from './signIn.js';
import type { TestApp } from './startTestApp.js';
import type { TestClient } from './testClient.js';

/** A workspace with something of everything, made through the API, and the ids of it all. */
export interface WorkspaceData {
  workspaceId: string;
  team: Record<Role, BuiltUser>;
  clients: Record<Role, TestClient>;
  designId: string;
  runId: string;
  inviteId: string;
  inviteEmail: string;
  mailId: string;
}

/**
 * Builder fixture: one user per role (signed in), a design with a revision, a finished run with
 * stored results, a pending invite and its mail, and the audit events all of that left.
 */
export async function buildWorkspaceData(app: TestApp): Promise<WorkspaceData> {
  const db = app.deps.db;
  const team = await buildTeam(db);
  const clients = {} as Record<Role, TestClient>;
  for (const role of Object.keys(team) as Role[]) clients[role] = await signIn(app, team[role]);
  const created = await clients.engineer.post('/api/designs', {
    document: exampleDesign(),
    message: 'first',
  });
  if (created.status !== 201) throw new Error(`design: ${created.status} ${JSON.stringify(created.body)}`);
  const designId = created.body.design.id as string;
  const launched = await clients.engineer.post('/api/runs', {
    designId,
    samples: 1000,
    plan: 'random',
    seed: 'iso',
  });
  if (launched.status !== 202) throw new Error(`run: ${launched.status} ${JSON.stringify(launched.body)}`);
  const runId = launched.body.id as string;
  // Finished without a worker: a stored result is all the read routes need.
  await db.updateTable('runs').set({ status: 'done', chunks_done: 1 }).where('id', '=', runId).execute();
  await db
    .insertInto('run_results')
    .values({
      run_id: runId,
      results: JSON.stringify({ fixture: true }),
      valid_count: 1000,
      joint_yield: 0.95,
    })
    .execute();
  const inviteEmail = `guest-${randomBytes(5).toString('hex')}@fixture.example`;
  const invited = await clients.admin.post('/api/invites', { email: inviteEmail, role: 'viewer' });
  if (invited.status !== 201) throw new Error(`invite: ${invited.status} ${JSON.stringify(invited.body)}`);
  const mail = await readMail(db, inviteEmail);
  return {
    workspaceId: team.admin.workspaceId,
    team,
    clients,
    designId,
    runId,
    inviteId: invited.body.invite.id as string,
    inviteEmail,
    mailId: mail.id,
  };
}
