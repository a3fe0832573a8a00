import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import { api } from '../api/client.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { AuthSubmit } from '../auth/AuthSubmit.js';
import { TextField } from '../components/TextField.js';

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
          <TextField
            id="forgot-email"
            label="Email"
            type="email"
            required
            value={email}
            onChange={(e) => setEmail(e.target.value)}
          />
          <AuthSubmit mutation={forgot}>Send reset link</AuthSubmit>
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
