import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { api } from '../api/client.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { ErrorNote } from '../components/QueryState.js';
import { Button, inputClass, labelClass } from '../components/ui.js';
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
          <div>
            <label htmlFor="new-password" className={labelClass}>
              New password (at least {PASSWORD_MIN} characters)
            </label>
            <input
              id="new-password"
              type="password"
              autoComplete="new-password"
              minLength={PASSWORD_MIN}
              required
              className={inputClass}
              value={password}
              onChange={(e) => setPassword(e.target.value)}
            />
          </div>
          <div>
            <label htmlFor="repeat-password" className={labelClass}>
              Repeat it
            </label>
            <input
              id="repeat-password"
              type="password"
              autoComplete="new-password"
              required
              className={inputClass}
              value={repeat}
              onChange={(e) => setRepeat(e.target.value)}
            />
            {mismatch && <p className="mt-1 text-xs text-brick">The two passwords differ.</p>}
          </div>
          {reset.isError && <ErrorNote error={reset.error} />}
          <Button tone="primary" type="submit" disabled={reset.isPending || mismatch} className="w-full py-2">
            Set password
          </Button>
        </form>
      )}
    </AuthFrame>
  );
}
