import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client.js';
import { adminQueries } from '../api/queries/adminQueries.js';
import { ROLES, type Role, type UserRow } from '../api/types.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, QueryStatus } from '../components/QueryState.js';
import { Button, Panel } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';
import { Table } from '../components/Table.js';

export function UsersPanel() {
  const me = useMe();
  const qc = useQueryClient();
  const users = useQuery(adminQueries.users());
  const invalidate = () => qc.invalidateQueries({ queryKey: adminQueries.all });
  const setRole = useMutation({
    mutationFn: ({ id, role }: { id: string; role: Role }) => api.admin.setRole(id, role),
    onSettled: invalidate,
  });
  const remove = useMutation({ mutationFn: (id: string) => api.admin.removeUser(id), onSettled: invalidate });

  return (
    <Panel title="Users and roles">
      <p className="mb-3 text-xs text-dim">
        admin: everything · engineer: edit designs, launch runs · production: launch runs, export · viewer:
        read only
      </p>
      <QueryStatus query={users} />
      {setRole.isError && <ErrorNote error={setRole.error} />}
      {remove.isError && <ErrorNote error={remove.error} />}
      {users.data && (
        <Table
          className="w-full text-sm"
          head={
            <>
              <th className="py-2 font-medium">Name</th>
              <th className="font-medium">Email</th>
              <th className="font-medium">Role</th>
              <th className="sr-only">Actions</th>
            </>
          }
        >
          {users.data.users.map((u: UserRow) => {
            const self = u.id === me.id;
            return (
              <tr key={u.id} className="border-b border-rule/60">
                <td className="py-2">{u.name}</td>
                <td className="text-dim">{u.email}</td>
                <td>
                  <label className="sr-only" htmlFor={`role-${u.id}`}>
                    Role of {u.email}
                  </label>
                  <select
                    id={`role-${u.id}`}
                    value={u.role}
                    disabled={self || setRole.isPending}
                    title={self ? 'You cannot change your own role' : undefined}
                    onChange={(e) => setRole.mutate({ id: u.id, role: e.target.value as Role })}
                    className="rounded border border-rule bg-white px-2 py-1 disabled:bg-paper"
                  >
                    {ROLES.map((r) => (
                      <option key={r} value={r}>
                        {r}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="text-right">
                  <Button
                    tone="danger"
                    disabled={self || remove.isPending}
                    title={self ? 'You cannot remove yourself' : undefined}
                    onClick={() => {
                      if (window.confirm(`Remove ${u.email} from the workspace?`)) remove.mutate(u.id);
                    }}
                  >
                    Remove
                  </Button>
                </td>
              </tr>
            );
          })}
        </Table>
      )}
      {users.data && users.data.invites.length > 0 && (
        <>
          <h3 className="mt-5 mb-1 text-xs font-semibold text-ink">Pending invites</h3>
          <ul className="text-sm" aria-label="Pending invites">
            {users.data.invites.map((i) => (
              <li key={i.id} className="flex gap-3 border-b border-rule/60 py-1.5">
                <span className="flex-1">{i.email}</span>
                <span className="text-dim">{i.role}</span>
                <span className="text-xs text-dim">expires {formatWhen(i.expiresAt)}</span>
              </li>
            ))}
          </ul>
        </>
      )}
    </Panel>
  );
}
