import type { Database } from '@sigmatail/db';
import { sql, type Kysely } from 'kysely';

/**
 * Everything a workspace holds (settings, members and roles, designs and revisions, runs and
 * results, invites, users' credentials and session epochs) as one comparable text, so a test can
 * say "nothing changed". Sessions, rate-limit counters, audit events and caught mail are logs of
 * requests, not the workspace's data, and are left out.
 */
export async function workspaceSnapshot(
  db: Kysely<Database>,
  workspaceIds: readonly string[],
): Promise<string> {
  const ids = sql.join(workspaceIds.map((id) => sql`${id}::uuid`));
  const { rows } = await sql<{ snapshot: string }>`
    select json_build_object(
      'workspaces', (select json_agg(w order by w.id) from workspaces w where w.id in (${ids})),
      'memberships', (select json_agg(m order by m.user_id, m.workspace_id) from memberships m where m.workspace_id in (${ids})),
      'users', (select json_agg(json_build_object('id', u.id, 'email', u.email, 'name', u.name, 'hash', u.password_hash, 'epoch', u.session_epoch) order by u.id)
                from users u where u.id in (select user_id from memberships where workspace_id in (${ids}))),
      'designs', (select json_agg(d order by d.id) from designs d where d.workspace_id in (${ids})),
      'revisions', (select json_agg(json_build_object('design', r.design_id, 'rev', r.rev, 'doc', r.document) order by r.design_id, r.rev)
                    from design_revisions r where r.design_id in (select id from designs where workspace_id in (${ids}))),
      'runs', (select json_agg(json_build_object('id', r.id, 'status', r.status, 'done', r.chunks_done, 'error', r.error) order by r.id)
               from runs r where r.workspace_id in (${ids})),
      'results', (select json_agg(x.run_id order by x.run_id) from run_results x where x.run_id in (select id from runs where workspace_id in (${ids}))),
      'invites', (select json_agg(json_build_object('id', i.id, 'email', i.email, 'role', i.role, 'accepted', i.accepted_at) order by i.id)
                  from invites i where i.workspace_id in (${ids})),
      'resets', (select count(*) from password_resets p where p.user_id in (select user_id from memberships where workspace_id in (${ids})))
    )::text as snapshot`.execute(db);
  return rows[0]!.snapshot;
}
