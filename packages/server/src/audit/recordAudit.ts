import type { Database } from '@sigmatail/db';
import type { Kysely, Transaction } from 'kysely';

export interface AuditInput {
  workspaceId: string | null;
  userId: string | null;
  /** Dotted verb, e.g. 'auth.login', 'design.revise'. */
  action: string;
  target?: string | null;
  detail?: Record<string, unknown>;
}

/** Appends one audit event. Pass the transaction when the audited change is in one, so both commit together. */
export async function recordAudit(
  db: Kysely<Database> | Transaction<Database>,
  e: AuditInput,
): Promise<void> {
  await db
    .insertInto('audit_events')
    .values({
      workspace_id: e.workspaceId,
      user_id: e.userId,
      action: e.action,
      target: e.target ?? null,
      detail: JSON.stringify(e.detail ?? {}),
    })
    .execute();
}
