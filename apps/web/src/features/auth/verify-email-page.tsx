// Opening the link that confirms a new sign-up's address: one button, so mail scanners that prefetch
// links do not use it up, then on to sign in.
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { ApiError, post } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';

export function VerifyEmailPage() {
  const [sp] = useSearchParams();
  const token = sp.get('token') ?? '';
  const [state, setState] = useState<'idle' | 'busy' | 'done' | 'failed' | 'unreachable'>('idle');

  if (state === 'done')
    return (
      <AuthLayout title="Address confirmed">
        <FormAlert tone="ok">Your e-mail address is confirmed. You can sign in now.</FormAlert>
        <Link className="btn-primary w-full" to={paths.signIn}>
          Sign in
        </Link>
      </AuthLayout>
    );

  return (
    <AuthLayout title="Confirm your e-mail address">
      {state === 'failed' && (
        <FormAlert>
          This link has expired or was already used. Try to{' '}
          <Link className="underline" to={paths.signIn}>
            sign in
          </Link>
          : if your address still needs confirming, you can ask for a new link there.
        </FormAlert>
      )}
      {state === 'unreachable' && <FormAlert>Could not reach Bumperline. Check the connection and try again.</FormAlert>}
      <p className="mb-4">Confirm that this address is yours to finish setting up your Bumperline account.</p>
      <button
        type="button"
        className="btn-primary w-full"
        disabled={state === 'busy' || !token}
        onClick={async () => {
          setState('busy');
          try {
            await post('/api/account/verify-email', { token });
            setState('done');
          } catch (err) {
            setState(err instanceof ApiError && err.status === 400 ? 'failed' : 'unreachable');
          }
        }}
      >
        {state === 'busy' ? 'Confirming…' : 'Confirm my address'}
      </button>
    </AuthLayout>
  );
}
