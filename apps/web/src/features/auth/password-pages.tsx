// Forgot password (ask for a link) and reset password (choose a new one from the link).
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link, useSearchParams } from 'react-router-dom';
import { password, passwordResetRequest } from '@bumperline/contracts/auth';
import { Field, inputClass } from '../../components/field.tsx';
import { applyServerErrors, fieldMessage } from '../../components/form-errors.ts';
import { post } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';

/** Also used for venue contacts' sign-in links: the same form, another endpoint and wording. */
export function RequestLinkPage({ kind }: { kind: 'password-reset' | 'sign-in-link' }) {
  const [sent, setSent] = useState(false);
  const form = useForm<z.input<typeof passwordResetRequest>, unknown, z.output<typeof passwordResetRequest>>({
    resolver: zodResolver(passwordResetRequest),
    defaultValues: { email: '' },
  });
  const { register, handleSubmit, formState } = form;
  const onSubmit = handleSubmit(async (values) => {
    await post(kind === 'password-reset' ? '/api/account/password-reset' : '/api/account/sign-in-link', values);
    setSent(true);
  });
  return (
    <AuthLayout title={kind === 'password-reset' ? 'Reset your password' : 'Sign in with an e-mailed link'}>
      {sent ? (
        <FormAlert tone="ok">If that address has a Bumperline account, a link is on its way. Check your e-mail.</FormAlert>
      ) : (
        <form onSubmit={onSubmit} noValidate className="grid gap-4">
          <p className="text-ink-soft">
            {kind === 'password-reset'
              ? 'Enter your e-mail and we will send a link to choose a new password.'
              : 'We e-mail you a link that signs you in once, no password needed. Venue contacts always sign in this way.'}
          </p>
          <Field label="E-mail" error={fieldMessage(formState.errors.email?.message)}>
            {(a) => <input {...a} type="email" autoComplete="email" className={inputClass} {...register('email')} />}
          </Field>
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            Send the link
          </button>
        </form>
      )}
      <p className="mt-4 text-sm">
        <Link className="link" to={paths.signIn}>
          Back to sign in
        </Link>
      </p>
    </AuthLayout>
  );
}

const resetForm = z
  .object({ password })
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], error: 'does not match the password' });

export function ResetPasswordPage() {
  const [sp] = useSearchParams();
  const token = sp.get('token') ?? '';
  const [done, setDone] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<z.input<typeof resetForm>, unknown, z.output<typeof resetForm>>({
    resolver: zodResolver(resetForm),
    defaultValues: { password: '', confirm: '' },
  });
  const { register, handleSubmit, formState, setError } = form;
  const onSubmit = handleSubmit(async ({ password: pw }) => {
    setFormError(null);
    try {
      await post('/api/account/password-reset/confirm', { token, password: pw });
      setDone(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['password']));
    }
  });
  return (
    <AuthLayout title="Choose a new password">
      {done ? (
        <FormAlert tone="ok">
          Your password is changed and other devices are signed out.{' '}
          <Link className="underline" to={paths.signIn}>
            Sign in
          </Link>
        </FormAlert>
      ) : (
        <form onSubmit={onSubmit} noValidate className="grid gap-4">
          {formError && <FormAlert>{formError.replace(/^token /, 'This link ')}</FormAlert>}
          <Field label="New password" hint="At least 10 characters." error={fieldMessage(formState.errors.password?.message)}>
            {(a) => <input {...a} type="password" autoComplete="new-password" className={inputClass} {...register('password')} />}
          </Field>
          <Field label="Repeat it" error={fieldMessage(formState.errors.confirm?.message)}>
            {(a) => <input {...a} type="password" autoComplete="new-password" className={inputClass} {...register('confirm')} />}
          </Field>
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            Set password
          </button>
        </form>
      )}
    </AuthLayout>
  );
}
