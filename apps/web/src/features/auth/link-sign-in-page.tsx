// Opening an e-mailed sign-in link: one button, so mail scanners that prefetch links do not use it up.
import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { signInWithLink } from '../../lib/auth-client.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';

export function LinkSignInPage() {
  const [sp] = useSearchParams();
  const navigate = useNavigate();
  const qc = useQueryClient();
  const [state, setState] = useState<'idle' | 'busy' | 'failed'>('idle');
  const token = sp.get('token') ?? '';
  return (
    <AuthLayout title="Sign in to Bumperline">
      {state === 'failed' && (
        <FormAlert>
          This link has expired or was already used.{' '}
          <Link className="underline" to={paths.signInLink}>
            Ask for a new one
          </Link>
          .
        </FormAlert>
      )}
      <button
        type="button"
        className="btn-primary w-full"
        disabled={state === 'busy' || !token}
        onClick={async () => {
          setState('busy');
          if (await signInWithLink(token)) {
            await qc.resetQueries();
            navigate(paths.home, { replace: true });
          } else setState('failed');
        }}
      >
        {state === 'busy' ? 'Signing in…' : 'Continue'}
      </button>
    </AuthLayout>
  );
}
