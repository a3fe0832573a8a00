import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, useParams } from 'react-router';
import { api } from '../api/client.js';
import { authQueries } from '../api/queries/authQueries.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { PASSWORD_MIN } from '../auth/passwordRules.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { Button, inputClass, labelClass } from '../components/ui.js';

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
          <div>
            <label htmlFor="invite-name" className={labelClass}>
              Your name
            </label>
            <input
              id="invite-name"
              required
              autoComplete="name"
              className={inputClass}
              value={name}
              onChange={(e) => setName(e.target.value)}
            />
          </div>
          <div>
            <label htmlFor="invite-password" className={labelClass}>
              Password (at least {PASSWORD_MIN} characters)
            </label>
            <input
              id="invite-password"
              type="password"
              required
              minLength={PASSWORD_MIN}
              autoComplete="new-password"
              className={inputClass}
              value={password}
              onChange={(e) => setPassword(e.target.value)}
            />
          </div>
          {accept.isError && <ErrorNote error={accept.error} />}
          <Button tone="primary" type="submit" disabled={accept.isPending} className="w-full py-2">
            Create my account
          </Button>
        </form>
      )}
    </AuthFrame>
  );
}
