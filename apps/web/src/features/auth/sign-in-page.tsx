import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { email } from '@bumperline/contracts/auth';
import { Field, inputClass } from '../../components/field.tsx';
import { fieldMessage } from '../../components/form-errors.ts';
import { signInWithPassword, type PasswordSignInResult } from '../../lib/auth-client.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';
import { ResendConfirmation } from './resend-confirmation.tsx';

const signInForm = z.object({ email, password: z.string().min(1, { error: 'is required' }) });

export function SignInPage() {
  const navigate = useNavigate();
  const [sp] = useSearchParams();
  const qc = useQueryClient();
  const [refused, setRefused] = useState<{ why: Exclude<PasswordSignInResult, 'ok'>; email: string } | null>(null);
  const form = useForm<z.input<typeof signInForm>, unknown, z.output<typeof signInForm>>({
    resolver: zodResolver(signInForm),
    defaultValues: { email: '', password: '' },
  });
  const { register, handleSubmit, formState } = form;

  const onSubmit = handleSubmit(async ({ email: e, password }) => {
    setRefused(null);
    const result = await signInWithPassword(e, password);
    if (result !== 'ok') return setRefused({ why: result, email: e });
    await qc.resetQueries();
    navigate(sp.get('next') ?? paths.home, { replace: true });
  });

  return (
    <AuthLayout
      title="Sign in"
      footer={
        <p>
          New operator?{' '}
          <Link className="font-bold text-brass-bright underline" to={paths.signUp}>
            Start a free trial
          </Link>
        </p>
      }
    >
      {refused && <Refusal why={refused.why} email={refused.email} />}
      <form onSubmit={onSubmit} noValidate className="grid gap-4">
        <Field label="E-mail" error={fieldMessage(formState.errors.email?.message)}>
          {(a) => <input {...a} type="email" autoComplete="username" className={inputClass} {...register('email')} />}
        </Field>
        <Field label="Password" error={fieldMessage(formState.errors.password?.message)}>
          {(a) => <input {...a} type="password" autoComplete="current-password" className={inputClass} {...register('password')} />}
        </Field>
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
        </button>
      </form>
      <div className="mt-4 flex flex-wrap justify-between gap-2 text-sm">
        <Link className="link" to={paths.forgotPassword}>
          Forgot your password?
        </Link>
        <Link className="link" to={paths.signInLink}>
          Venue contact? Get a sign-in link
        </Link>
      </div>
    </AuthLayout>
  );
}

/** Why the sign-in did not go through, and the way forward; it says no more than the API did. */
function Refusal({ why, email }: { why: Exclude<PasswordSignInResult, 'ok'>; email: string }) {
  const linkInstead = (
    <Link className="underline" to={paths.signInLink}>
      get a sign-in link by e-mail
    </Link>
  );
  switch (why) {
    case 'wrong':
      return <FormAlert>That e-mail and password do not match. Check them and try again.</FormAlert>;
    case 'unverified':
      return (
        <>
          <FormAlert>Confirm your e-mail address first: open the link we sent when you signed up.</FormAlert>
          <ResendConfirmation email={email} />
        </>
      );
    case 'account-paused':
      return (
        <FormAlert>
          Password sign-in for this address is paused after too many failed attempts. To continue, {linkInstead}; it works even while the
          password is paused.
        </FormAlert>
      );
    case 'too-many-attempts':
      return <FormAlert>Too many sign-in attempts from your network. Wait a few minutes and try again, or {linkInstead}.</FormAlert>;
  }
}
