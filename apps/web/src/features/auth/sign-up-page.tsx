import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link } from 'react-router-dom';
import { signUpInput } from '@bumperline/contracts/auth';
import { Field, inputClass } from '../../components/field.tsx';
import { applyServerErrors, fieldMessage } from '../../components/form-errors.ts';
import { post } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';
import { ResendConfirmation } from './resend-confirmation.tsx';

const zones = [
  'America/Chicago',
  'America/New_York',
  'America/Denver',
  'America/Los_Angeles',
  'America/Phoenix',
  'America/Anchorage',
  'Pacific/Honolulu',
  'America/Toronto',
  'Europe/London',
  'Europe/Berlin',
  'Australia/Sydney',
];

export function SignUpPage() {
  const [formError, setFormError] = useState<string | null>(null);
  // The address the link went to: the password signs in only once it is confirmed.
  const [sentTo, setSentTo] = useState<string | null>(null);
  const defaultZone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  const form = useForm<z.input<typeof signUpInput>, unknown, z.output<typeof signUpInput>>({
    resolver: zodResolver(signUpInput),
    defaultValues: {
      companyName: '',
      name: '',
      email: '',
      password: '',
      timeZone: zones.includes(defaultZone) ? defaultZone : 'America/Chicago',
      currency: 'USD',
    },
  });
  const { register, handleSubmit, formState, setError } = form;
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await post('/api/account/sign-up', values);
      setSentTo(values.email);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['companyName', 'name', 'email', 'password', 'timeZone', 'currency']));
    }
  });

  if (sentTo) return <CheckYourEmail email={sentTo} />;

  return (
    <AuthLayout
      title="Start your operator company"
      footer={
        <p>
          Already on Bumperline?{' '}
          <Link className="font-bold text-brass-bright underline" to={paths.signIn}>
            Sign in
          </Link>
        </p>
      }
    >
      {formError && <FormAlert>{formError}</FormAlert>}
      <form onSubmit={onSubmit} noValidate className="grid gap-4">
        <Field label="Company name" error={fieldMessage(errors.companyName?.message)}>
          {(a) => <input {...a} className={inputClass} autoComplete="organization" {...register('companyName')} />}
        </Field>
        <Field label="Your name" error={fieldMessage(errors.name?.message)}>
          {(a) => <input {...a} className={inputClass} autoComplete="name" {...register('name')} />}
        </Field>
        <Field label="E-mail" error={fieldMessage(errors.email?.message)}>
          {(a) => <input {...a} type="email" className={inputClass} autoComplete="email" {...register('email')} />}
        </Field>
        <Field
          label="Password"
          hint="At least 10 characters; a phrase is easiest to remember."
          error={fieldMessage(errors.password?.message)}
        >
          {(a) => <input {...a} type="password" className={inputClass} autoComplete="new-password" {...register('password')} />}
        </Field>
        <div className="grid grid-cols-[2fr_1fr] gap-3">
          <Field label="Time zone" error={fieldMessage(errors.timeZone?.message)}>
            {(a) => (
              <select {...a} className={inputClass} {...register('timeZone')}>
                {zones.map((z) => (
                  <option key={z}>{z}</option>
                ))}
              </select>
            )}
          </Field>
          <Field label="Currency" error={fieldMessage(errors.currency?.message)}>
            {(a) => (
              <select {...a} className={inputClass} {...register('currency')}>
                {['USD', 'CAD', 'GBP', 'EUR', 'AUD'].map((c) => (
                  <option key={c}>{c}</option>
                ))}
              </select>
            )}
          </Field>
        </div>
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Creating…' : 'Create company'}
        </button>
      </form>
    </AuthLayout>
  );
}

function CheckYourEmail({ email }: { email: string }) {
  return (
    <AuthLayout title="Check your e-mail">
      <p className="mb-3">
        We sent a message to <strong>{email}</strong>. Open the link in it to confirm the address, then sign in with the password you chose.
        The link works for 24 hours.
      </p>
      <p className="mb-4 text-ink-soft">Nothing there after a few minutes? Look in the spam folder, or:</p>
      <ResendConfirmation email={email} />
      <p className="text-center">
        <Link className="link" to={paths.signIn}>
          Go to sign in
        </Link>
      </p>
    </AuthLayout>
  );
}
