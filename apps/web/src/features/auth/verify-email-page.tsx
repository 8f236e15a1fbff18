// Opening the link that confirms a new sign-up's address. The person enters the password they chose at
// sign-up: the owner of an address who never signed up cannot confirm a stranger's account onto it by
// clicking. A form (not a bare link) also keeps mail scanners that prefetch links from using it up.
import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Field, inputClass } from '../../components/field.tsx';
import { ApiError, post } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';

type State = 'idle' | 'busy' | 'done' | 'failed' | 'unreachable';

export function VerifyEmailPage() {
  const [sp] = useSearchParams();
  const token = sp.get('token') ?? '';
  const [state, setState] = useState<State>('idle');
  const [password, setPassword] = useState('');
  const [passwordError, setPasswordError] = useState<string>();

  async function onSubmit(e: FormEvent) {
    e.preventDefault();
    if (!password) return setPasswordError('Enter the password you chose when you signed up.');
    setState('busy');
    setPasswordError(undefined);
    try {
      await post('/api/account/verify-email', { token, password });
      setState('done');
    } catch (err) {
      if (err instanceof ApiError && err.fieldErrors().password) {
        setPasswordError('That is not the password chosen at sign-up.');
        setState('idle');
      } else setState(err instanceof ApiError && err.status === 400 ? 'failed' : 'unreachable');
    }
  }

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
      <form onSubmit={onSubmit} noValidate className="grid gap-4">
        <p>Enter the password you chose when you signed up, to confirm that this address is yours.</p>
        <Field label="Password" error={passwordError}>
          {(a) => (
            <input
              {...a}
              type="password"
              autoComplete="current-password"
              className={inputClass}
              value={password}
              onChange={(e) => setPassword(e.target.value)}
            />
          )}
        </Field>
        <button type="submit" className="btn-primary w-full" disabled={state === 'busy' || !token}>
          {state === 'busy' ? 'Confirming…' : 'Confirm my address'}
        </button>
        <p className="text-sm text-ink-muted">
          Did not sign up? You can ignore the e-mail, or{' '}
          <Link className="underline" to={paths.forgotPassword}>
            set a password of your own
          </Link>{' '}
          for this address.
        </p>
      </form>
    </AuthLayout>
  );
}
