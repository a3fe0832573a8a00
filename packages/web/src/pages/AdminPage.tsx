import { useSearchParams } from 'react-router';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { PageTitle } from '../components/ui.js';
import { UsersPanel } from '../admin/UsersPanel.js';
import { InvitePanel } from '../admin/InvitePanel.js';
import { WorkspacePanel } from '../admin/WorkspacePanel.js';
import { InboxPanel } from '../admin/InboxPanel.js';
import { AuditPanel } from '../admin/AuditPanel.js';

const TABS = [
  { id: 'users', label: 'Users and roles' },
  { id: 'invites', label: 'Invite' },
  { id: 'workspace', label: 'Workspace' },
  { id: 'inbox', label: 'Dev inbox' },
  { id: 'audit', label: 'Audit' },
] as const;

export function AdminPage() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const tab = TABS.find((t) => t.id === params.get('tab'))?.id ?? 'users';
  if (!can(me.role, 'admin')) {
    return <p className="text-sm text-dim">Administration is open to workspace admins only.</p>;
  }
  return (
    <div>
      <PageTitle sub={me.workspace.name}>Administration</PageTitle>
      <div
        role="tablist"
        aria-label="Administration sections"
        className="mb-4 flex flex-wrap gap-1 border-b border-rule"
      >
        {TABS.map((t) => (
          <button
            key={t.id}
            role="tab"
            type="button"
            aria-selected={tab === t.id}
            tabIndex={tab === t.id ? 0 : -1}
            onClick={() => setParams({ tab: t.id })}
            className={`-mb-px rounded-t-md border px-3 py-1.5 text-sm ${
              tab === t.id
                ? 'border-rule border-b-sheet bg-sheet font-medium text-ink'
                : 'border-transparent text-dim hover:text-ink'
            }`}
          >
            {t.label}
          </button>
        ))}
      </div>
      <div role="tabpanel">
        {tab === 'users' && <UsersPanel />}
        {tab === 'invites' && <InvitePanel />}
        {tab === 'workspace' && <WorkspacePanel />}
        {tab === 'inbox' && <InboxPanel />}
        {tab === 'audit' && <AuditPanel />}
      </div>
    </div>
  );
}
