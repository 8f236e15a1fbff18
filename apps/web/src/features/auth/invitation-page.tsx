import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { password } from '@bumperline/contracts/auth';
import { roleLabels } from '@bumperline/contracts/roles';
import type { InvitationInfo } from '@bumperline/contracts/team';
import { Field, inputClass } from '../../components/field.tsx';
import { applyServerErrors, fieldMessage } from '../../components/form-errors.ts';
import { ErrorState, Loading } from '../../components/states.tsx';
import { get, post } from '../../lib/api-client.ts';
import { signInWithPassword } from '../../lib/auth-client.ts';
import { useMe } from '../../api/me.ts';
import { paths } from '../../lib/paths.ts';
import { AuthLayout, FormAlert } from './auth-layout.tsx';

const newAccount = z.object({ name: z.string().trim().min(1, { error: 'is required' }).max(120), password });

export function InvitationPage() {
  const [sp] = useSearchParams();
  const token = sp.get('token') ?? '';
  const navigate = useNavigate();
  const qc = useQueryClient();
  const me = useMe();
  const info = useQuery({ queryKey: ['invitation', token], queryFn: () => get<InvitationInfo>(`/api/invitations/${token}`), retry: false });
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<z.input<typeof newAccount>, unknown, z.output<typeof newAccount>>({
    resolver: zodResolver(newAccount),
    defaultValues: { name: '', password: '' },
  });

  async function accept(body: object, signInAfter?: { email: string; password: string }) {
    setFormError(null);
    try {
      await post(`/api/invitations/${token}/accept`, body);
      if (signInAfter) await signInWithPassword(signInAfter.email, signInAfter.password);
      await qc.resetQueries();
      navigate(paths.home, { replace: true });
    } catch (err) {
      setFormError(applyServerErrors(err, form.setError, ['name', 'password']));
    }
  }

  if (info.isLoading || me.isLoading)
    return (
      <AuthLayout title="Invitation">
        <Loading />
      </AuthLayout>
    );
  if (info.error || !info.data)
    return (
      <AuthLayout title="Invitation">
        <ErrorState error={info.error} />
      </AuthLayout>
    );
  const inv = info.data;
  const signedInAsInvitee = me.data?.user.email.toLowerCase() === inv.email.toLowerCase();

  return (
    <AuthLayout title={`Join ${inv.companyName}`}>
      <p className="mb-4">
        You are invited as <strong>{roleLabels[inv.role].toLowerCase()}</strong> with the address <strong>{inv.email}</strong>.
      </p>
      {formError && <FormAlert>{formError}</FormAlert>}
      {inv.hasAccount ? (
        signedInAsInvitee ? (
          <button type="button" className="btn-primary w-full" onClick={() => accept({})}>
            Accept and join
          </button>
        ) : (
          <p>
            You already have a Bumperline account.{' '}
            <Link className="link" to={`${paths.signIn}?next=${encodeURIComponent(`${paths.invitation}?token=${token}`)}`}>
              Sign in as {inv.email}
            </Link>{' '}
            to accept.
          </p>
        )
      ) : (
        <form noValidate className="grid gap-4" onSubmit={form.handleSubmit((v) => accept(v, { email: inv.email, password: v.password }))}>
          <Field label="Your name" error={fieldMessage(form.formState.errors.name?.message)}>
            {(a) => <input {...a} className={inputClass} autoComplete="name" {...form.register('name')} />}
          </Field>
          <Field label="Choose a password" hint="At least 10 characters." error={fieldMessage(form.formState.errors.password?.message)}>
            {(a) => <input {...a} type="password" className={inputClass} autoComplete="new-password" {...form.register('password')} />}
          </Field>
          <button type="submit" className="btn-primary" disabled={form.formState.isSubmitting}>
            Create account and join
          </button>
        </form>
      )}
    </AuthLayout>
  );
}
