import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { UserPlus } from 'lucide-react';
import { invitationInput } from '@bumperline/contracts/team';
import { roleLabels, roles, type Role } from '@bumperline/contracts/roles';
import { PageHeader } from '../../components/page-header.tsx';
import { Field, inputClass } from '../../components/field.tsx';
import { applyServerErrors, fieldMessage } from '../../components/form-errors.ts';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings, useMe } from '../../api/me.ts';
import { useChangeRole, useInvite, useRemoveMember, useRevokeInvitation, useTeam } from '../../api/team.ts';
import { ApiError } from '../../lib/api-client.ts';
import { formatDate } from '../../lib/format.ts';

export function TeamPage() {
  const team = useTeam();
  const me = useMe();
  const canManage = useCan('team:manage');
  const changeRole = useChangeRole();
  const remove = useRemoveMember();
  const revoke = useRevokeInvitation();
  const locale = useLocaleSettings();
  const [actionError, setActionError] = useState<string | null>(null);
  const onError = (err: unknown) => setActionError(err instanceof ApiError ? err.message : 'That did not work.');

  return (
    <>
      <PageHeader title="Team" subtitle="Who works in this company, and in which role." />
      {actionError && (
        <div role="alert" className="mb-4 rounded-md border border-down bg-down-tint p-3 font-semibold text-down">
          {actionError}
        </div>
      )}
      <div className="grid gap-4 lg:grid-cols-3">
        <section className="card p-0 lg:col-span-2" aria-labelledby="members">
          <h2 id="members" className="p-4 pb-2 text-lg font-bold">
            Members
          </h2>
          {team.isLoading ? (
            <Loading />
          ) : team.error ? (
            <ErrorState error={team.error} onRetry={() => team.refetch()} />
          ) : (
            <table className="w-full text-left">
              <thead className="bg-paper-dim text-sm text-ink-soft">
                <tr>
                  <th scope="col" className="px-4 py-2">
                    Name
                  </th>
                  <th scope="col" className="hidden px-4 py-2 md:table-cell">
                    E-mail
                  </th>
                  <th scope="col" className="px-4 py-2">
                    Role
                  </th>
                  {canManage && (
                    <th scope="col" className="px-4 py-2">
                      <span className="sr-only">Actions</span>
                    </th>
                  )}
                </tr>
              </thead>
              <tbody>
                {team.data?.members.map((m) => (
                  <tr key={m.userId} className="border-t border-paper-line">
                    <td className="px-4 py-2 font-semibold">{m.name}</td>
                    <td className="hidden px-4 py-2 md:table-cell">{m.email}</td>
                    <td className="px-4 py-2">
                      {canManage && m.userId !== me.data?.user.id ? (
                        <select
                          aria-label={`Role of ${m.name}`}
                          className={`${inputClass} w-auto`}
                          value={m.role}
                          onChange={(e) => changeRole.mutate({ userId: m.userId, role: e.target.value as Role }, { onError })}
                        >
                          {roles.map((r) => (
                            <option key={r} value={r}>
                              {roleLabels[r]}
                            </option>
                          ))}
                        </select>
                      ) : (
                        roleLabels[m.role]
                      )}
                    </td>
                    {canManage && (
                      <td className="px-4 py-2 text-right">
                        {m.userId !== me.data?.user.id && (
                          <button
                            type="button"
                            className="btn-danger"
                            onClick={() => {
                              if (window.confirm(`Remove ${m.name} from this company? They lose access at once.`))
                                remove.mutate(m.userId, { onError });
                            }}
                          >
                            Remove
                          </button>
                        )}
                      </td>
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        {canManage && (
          <div className="grid content-start gap-4">
            <InviteForm />
            <section className="card" aria-labelledby="pending">
              <h2 id="pending" className="mb-2 text-lg font-bold">
                Waiting to accept
              </h2>
              {!team.data?.invitations.length ? (
                <Empty title="No open invitations." />
              ) : (
                <ul className="divide-y divide-paper-line">
                  {team.data.invitations.map((i) => (
                    <li key={i.id} className="flex items-center justify-between gap-2 py-2">
                      <span>
                        <span className="font-semibold">{i.email}</span>
                        <br />
                        <span className="text-sm text-ink-muted">
                          {roleLabels[i.role]} · until {formatDate(i.expiresAt, locale)}
                        </span>
                      </span>
                      <button type="button" className="btn-secondary" onClick={() => revoke.mutate(i.id, { onError })}>
                        Withdraw
                      </button>
                    </li>
                  ))}
                </ul>
              )}
            </section>
          </div>
        )}
      </div>
    </>
  );
}

function InviteForm() {
  const invite = useInvite();
  const [sent, setSent] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<z.input<typeof invitationInput>, unknown, z.output<typeof invitationInput>>({
    resolver: zodResolver(invitationInput),
    defaultValues: { email: '', role: 'technician' },
  });
  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await invite.mutateAsync(values);
      setSent(values.email);
      form.reset({ email: '', role: values.role });
    } catch (err) {
      setFormError(applyServerErrors(err, form.setError, ['email', 'role']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="card grid gap-3" aria-labelledby="invite-title">
      <h2 id="invite-title" className="text-lg font-bold">
        Invite someone
      </h2>
      {sent && (
        <p role="status" className="font-semibold text-running">
          Invitation e-mailed to {sent}.
        </p>
      )}
      {formError && (
        <p role="alert" className="font-semibold text-down">
          {formError}
        </p>
      )}
      <Field label="E-mail" error={fieldMessage(form.formState.errors.email?.message)}>
        {(a) => <input {...a} type="email" className={inputClass} {...form.register('email')} />}
      </Field>
      <Field label="Role" error={fieldMessage(form.formState.errors.role?.message)}>
        {(a) => (
          <select {...a} className={inputClass} {...form.register('role')}>
            {roles.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </select>
        )}
      </Field>
      <button type="submit" className="btn-primary" disabled={form.formState.isSubmitting}>
        <UserPlus aria-hidden className="size-4" /> Send invitation
      </button>
    </form>
  );
}
