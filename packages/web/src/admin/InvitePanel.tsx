import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '../api/client.js';
import { adminQueries } from '../api/queries/adminQueries.js';
import { ROLES, type Role } from '../api/types.js';
import { ErrorNote } from '../components/QueryState.js';
import { ChoiceField } from '../components/ChoiceField.js';
import { TextField } from '../components/TextField.js';
import { Button, Panel } from '../components/ui.js';

export function InvitePanel() {
  const qc = useQueryClient();
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('engineer');
  const invite = useMutation({
    mutationFn: () => api.admin.invite(email, role),
    onSuccess: () => qc.invalidateQueries({ queryKey: adminQueries.all }),
  });
  return (
    <Panel title="Invite someone">
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          invite.mutate();
        }}
      >
        <TextField
          id="invite-email"
          label="Email"
          className="min-w-64 flex-1"
          type="email"
          required
          value={email}
          onChange={(e) => setEmail(e.target.value)}
        />
        <ChoiceField id="invite-role" label="Role" value={role} choices={ROLES} onChange={setRole} />
        <Button tone="primary" type="submit" disabled={invite.isPending}>
          Send invite
        </Button>
      </form>
      {invite.isError && (
        <div className="mt-3">
          <ErrorNote error={invite.error} />
        </div>
      )}
      {invite.isSuccess && (
        <p role="status" className="mt-3 text-sm text-moss">
          Invitation sent to {email}. In development it lands in the Dev inbox tab.
        </p>
      )}
    </Panel>
  );
}
