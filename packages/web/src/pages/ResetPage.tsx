import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { api } from '../api/client.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { AuthSubmit } from '../auth/AuthSubmit.js';
import { TextField } from '../components/TextField.js';
import { PASSWORD_MIN } from '../auth/passwordRules.js';

export function ResetPage() {
  const { token = '' } = useParams();
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const reset = useMutation({ mutationFn: () => api.auth.reset(token, password) });
  const mismatch = repeat.length > 0 && repeat !== password;
  return (
    <AuthFrame title="Choose a new password">
      {reset.isSuccess ? (
        <p className="text-sm" role="status">
          Password changed.{' '}
          <Link to="/signin" className="text-glow underline">
            Sign in
          </Link>
        </p>
      ) : (
        <form
          className="space-y-4"
          onSubmit={(e) => {
            e.preventDefault();
            if (!mismatch) reset.mutate();
          }}
        >
          <TextField
            id="new-password"
            label={<>New password (at least {PASSWORD_MIN} characters)</>}
            type="password"
            autoComplete="new-password"
            minLength={PASSWORD_MIN}
            required
            value={password}
            onChange={(e) => setPassword(e.target.value)}
          />
          <TextField
            id="repeat-password"
            label="Repeat it"
            type="password"
            autoComplete="new-password"
            required
            value={repeat}
            onChange={(e) => setRepeat(e.target.value)}
            note={mismatch && <p className="mt-1 text-xs text-brick">The two passwords differ.</p>}
          />
          <AuthSubmit mutation={reset} disabled={mismatch}>
            Set password
          </AuthSubmit>
        </form>
      )}
    </AuthFrame>
  );
}
