import { randomBytes } from 'node:crypto';
import { DEFAULT_WORKSPACE_SETTINGS, type Database, type Role } from '@sigmatail/db';
import bcrypt from 'bcryptjs';
import type { Kysely } from 'kysely';

export const FIXTURE_PASSWORD = 'fixture-password';
// Cost 4 keeps fixtures fast; the app itself hashes at cost 10.
const FIXTURE_HASH = bcrypt.hashSync(FIXTURE_PASSWORD, 4);

export interface BuiltUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  workspaceId: string;
  password: string;
}

/** A unique workspace (name tagged so parallel test files never collide). */
export async function buildWorkspace(db: Kysely<Database>, name = 'Fixture works'): Promise<string> {
  const ws = await db
    .insertInto('workspaces')
    .values({
      name: `${name} ${randomBytes(4).toString('hex')}`,
      settings: JSON.stringify(DEFAULT_WORKSPACE_SETTINGS),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return ws.id;
}

/** Builder fixture: a user with a unique email, a member of `workspaceId` (a new workspace by default). */
export async function buildUser(
  db: Kysely<Database>,
  overrides: Partial<{ role: Role; workspaceId: string; name: string }> = {},
): Promise<BuiltUser> {
  const role = overrides.role ?? 'engineer';
  const workspaceId = overrides.workspaceId ?? (await buildWorkspace(db));
  const email = `${role}-${randomBytes(6).toString('hex')}@fixture.example`;
  const name = overrides.name ?? `Fixture ${role}`;
  const user = await db
    .insertInto('users')
    .values({ email, name, password_hash: FIXTURE_HASH })
    .returning('id')
    .executeTakeFirstOrThrow();
  await db.insertInto('memberships').values({ user_id: user.id, workspace_id: workspaceId, role }).execute();
  return { id: user.id, email, name, role, workspaceId, password: FIXTURE_PASSWORD };
}

/** One user per role in one new workspace. */
export async function buildTeam(db: Kysely<Database>): Promise<Record<Role, BuiltUser>> {
  const workspaceId = await buildWorkspace(db);
  return {
    admin: await buildUser(db, { role: 'admin', workspaceId }),
    engineer: await buildUser(db, { role: 'engineer', workspaceId }),
    production: await buildUser(db, { role: 'production', workspaceId }),
    viewer: await buildUser(db, { role: 'viewer', workspaceId }),
  };
}
