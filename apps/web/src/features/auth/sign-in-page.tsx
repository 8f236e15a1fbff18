import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { email } from '@bumperline/contracts/auth';
import { Field, inputClass } from '../../components/field.tsx';
import { fieldMessage } from '../../components/form-errors.ts';
import { signInWithPassword } from '../../lib/auth-client.ts';
import { paths } from '../../app/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';

const signInForm = z.object({ email, password: z.string().min(1, { error: 'is required' }) });

export function SignInPage() {
  const navigate = useNavigate();
  const [sp] = useSearchParams();
  const qc = useQueryClient();
  const [failed, setFailed] = useState(false);
  const form = useForm<z.input<typeof signInForm>, unknown, z.output<typeof signInForm>>({
    resolver: zodResolver(signInForm),
    defaultValues: { email: '', password: '' },
  });
  const { register, handleSubmit, formState } = form;

  const onSubmit = handleSubmit(async ({ email: e, password }) => {
    setFailed(false);
    const ok = await signInWithPassword(e, password);
    if (!ok) return setFailed(true);
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
      {failed && (
        <FormAlert>That e-mail and password do not match, or there were too many attempts. Wait a few minutes and try again.</FormAlert>
      )}
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
