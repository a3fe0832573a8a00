import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { useState } from 'react';
import { ApiError } from '../api/client.js';
import { TextField } from '../components/TextField.js';
import { Button } from '../components/ui.js';

const signInSchema = z.object({
  email: z.email('Enter your email address'),
  password: z.string().min(1, 'Enter your password'),
});
export type SignInValues = z.infer<typeof signInSchema>;

/** Email + password form. `onSignIn` does the request; its ApiError message is shown under the form. */
export function SignInForm({ onSignIn }: { onSignIn: (values: SignInValues) => Promise<void> }) {
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<SignInValues>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await onSignIn(values);
    } catch (e) {
      setFailure(
        e instanceof ApiError && e.status === 401
          ? 'That email and password do not match an account.'
          : e instanceof Error
            ? e.message
            : 'Sign-in failed.',
      );
    }
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Sign in">
      <TextField
        id="email"
        label="Email"
        type="email"
        autoComplete="username"
        {...register('email')}
        aria-invalid={!!errors.email}
        note={errors.email && <p className="mt-1 text-xs text-brick">{errors.email.message}</p>}
      />
      <TextField
        id="password"
        label="Password"
        type="password"
        autoComplete="current-password"
        {...register('password')}
        aria-invalid={!!errors.password}
        note={errors.password && <p className="mt-1 text-xs text-brick">{errors.password.message}</p>}
      />
      {failure && (
        <p role="alert" className="rounded-md bg-brick-soft px-3 py-2 text-sm text-brick">
          {failure}
        </p>
      )}
      <Button tone="primary" type="submit" disabled={isSubmitting} className="w-full py-2">
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
