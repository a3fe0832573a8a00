import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, useParams } from 'react-router';
import { api } from '../api/client.js';
import { authQueries } from '../api/queries/authQueries.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { PASSWORD_MIN } from '../auth/passwordRules.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { AuthSubmit } from '../auth/AuthSubmit.js';
import { TextField } from '../components/TextField.js';

export function InviteAcceptPage() {
  const { token = '' } = useParams();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const invite = useQuery(authQueries.invite(token));
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const accept = useMutation({
    mutationFn: () => api.auth.acceptInvite(token, name, password),
    onSuccess: async (me) => {
      if (me?.user) qc.setQueryData(authQueries.me().queryKey, me.user);
      else await qc.invalidateQueries({ queryKey: authQueries.all });
      navigate('/designs', { replace: true });
    },
  });
  return (
    <AuthFrame title="Join the workspace">
      {invite.isPending && <Loading label="Checking the invitation…" />}
      {invite.isError && <ErrorNote error={invite.error} />}
      {invite.data && (
        <form
          className="space-y-4"
          onSubmit={(e) => {
            e.preventDefault();
            accept.mutate();
          }}
        >
          <p className="text-sm">
            {invite.data.invitedBy.name} invited <strong>{invite.data.email}</strong> to{' '}
            <strong>{invite.data.workspace.name}</strong> as <strong>{invite.data.role}</strong>.
          </p>
          <TextField
            id="invite-name"
            label="Your name"
            required
            autoComplete="name"
            value={name}
            onChange={(e) => setName(e.target.value)}
          />
          <TextField
            id="invite-password"
            label={<>Password (at least {PASSWORD_MIN} characters)</>}
            type="password"
            required
            minLength={PASSWORD_MIN}
            autoComplete="new-password"
            value={password}
            onChange={(e) => setPassword(e.target.value)}
          />
          <AuthSubmit mutation={accept}>Create my account</AuthSubmit>
        </form>
      )}
    </AuthFrame>
  );
}
