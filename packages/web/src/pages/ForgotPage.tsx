import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import { api } from '../api/client.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { ErrorNote } from '../components/QueryState.js';
import { Button, inputClass, labelClass } from '../components/ui.js';

export function ForgotPage() {
  const [email, setEmail] = useState('');
  const forgot = useMutation({ mutationFn: (address: string) => api.auth.forgot(address) });
  return (
    <AuthFrame title="Reset your password">
      {forgot.isSuccess ? (
        <p className="text-sm" role="status">
          If <strong>{email}</strong> belongs to an account, a reset link is on its way. It expires after one
          hour.
        </p>
      ) : (
        <form
          className="space-y-4"
          onSubmit={(e) => {
            e.preventDefault();
            forgot.mutate(email);
          }}
        >
          <div>
            <label htmlFor="forgot-email" className={labelClass}>
              Email
            </label>
            <input
              id="forgot-email"
              type="email"
              required
              className={inputClass}
              value={email}
              onChange={(e) => setEmail(e.target.value)}
            />
          </div>
          {forgot.isError && <ErrorNote error={forgot.error} />}
          <Button tone="primary" type="submit" disabled={forgot.isPending} className="w-full py-2">
            Send reset link
          </Button>
        </form>
      )}
      <p className="mt-4 text-sm">
        <Link to="/signin" className="text-glow underline">
          Back to sign in
        </Link>
      </p>
    </AuthFrame>
  );
}
