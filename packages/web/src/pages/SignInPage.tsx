import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { api } from '../api/client.js';
import { authQueries } from '../api/queries/authQueries.js';
import { AuthFrame } from '../auth/AuthFrame.js';
import { SignInForm } from '../auth/SignInForm.js';

export function SignInPage() {
  const qc = useQueryClient();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next');
  return (
    <AuthFrame title="Sign in to your workspace">
      <SignInForm
        onSignIn={async ({ email, password }) => {
          const me = await api.auth.login(email, password);
          qc.setQueryData(authQueries.me().queryKey, me.user);
          // Only follow same-site paths.
          navigate(next && next.startsWith('/') && !next.startsWith('//') ? next : '/designs', {
            replace: true,
          });
        }}
      />
      <p className="mt-4 text-sm text-dim">
        <Link to="/forgot" className="text-glow underline">
          Forgot your password?
        </Link>
      </p>
    </AuthFrame>
  );
}
