'use client';

import { useState } from 'react';
import Link from 'next/link';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { inviteSchema } from '@/lib/validation/auth';
import { ROLES, ROLE_LABELS, type Role } from '@/lib/auth/roles';
import type { InvitationView, MemberView } from '@/lib/view-types/members';
import { ApiError, callApi, failureMessage } from '@/components/forms/api';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Card, Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TableHead } from '@/components/ui/table';
import { formatDate } from '@/lib/format';

type InviteValues = z.input<typeof inviteSchema>;

const failureText = (e: unknown) => failureMessage(e, 'The server could not be reached. Try again.');

const ROLE_OPTIONS = ROLES.map((r) => (
  <option key={r} value={r}>
    {ROLE_LABELS[r]}
  </option>
));

/** A refusal that points somewhere to fix it (all paid seats taken → billing). */
type Problem = { message: string; link?: string };
function problemOf(e: unknown): Problem {
  const details = e instanceof ApiError ? (e.failure.details as { link?: unknown } | undefined) : undefined;
  return { message: failureText(e), link: typeof details?.link === 'string' ? details.link : undefined };
}

export function MembersPanel({ selfUserId }: { selfUserId: number }) {
  const queryClient = useQueryClient();
  const [problem, setProblem] = useState<Problem | null>(null);
  const members = useQuery({
    queryKey: ['members'],
    queryFn: () => callApi<{ members: MemberView[] }>('/api/members'),
  });
  const invitations = useQuery({
    queryKey: ['invitations'],
    queryFn: () => callApi<{ invitations: InvitationView[] }>('/api/invitations'),
  });
  const refresh = () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: ['members'] }),
      queryClient.invalidateQueries({ queryKey: ['invitations'] }),
    ]);
  const onError = (e: unknown) => setProblem(problemOf(e));

  const changeRole = useMutation({
    mutationFn: ({ id, role }: { id: number; role: Role }) =>
      callApi(`/api/members/${id}`, { method: 'PATCH', body: { role } }),
    onSuccess: () => (setProblem(null), refresh()),
    onError: (e) => (onError(e), refresh()),
  });
  const remove = useMutation({
    mutationFn: (id: number) => callApi(`/api/members/${id}`, { method: 'DELETE' }),
    onSuccess: () => (setProblem(null), refresh()),
    onError,
  });
  const revoke = useMutation({
    mutationFn: (id: number) => callApi(`/api/invitations/${id}`, { method: 'DELETE' }),
    onSuccess: refresh,
    onError,
  });

  const form = useForm<InviteValues>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { role: 'estimator' },
  });
  const [lastLink, setLastLink] = useState<string | null>(null);
  async function onInvite(values: InviteValues) {
    setProblem(null);
    try {
      const { invitation } = await callApi<{ invitation: InvitationView }>('/api/invitations', {
        body: values,
      });
      setLastLink(invitation.link);
      form.reset({ email: '', role: values.role });
      await refresh();
    } catch (e) {
      if (e instanceof ApiError)
        for (const i of e.failure.issues) form.setError(i.path as keyof InviteValues, { message: i.message });
      setProblem(problemOf(e));
    }
  }

  return (
    <div className="space-y-5">
      {problem ? (
        <Notice tone="invalid">
          {problem.message}
          {problem.link ? (
            <>
              {' '}
              <Link href={problem.link} className="font-medium underline" data-testid="seats-billing-link">
                Buy more seats
              </Link>
            </>
          ) : null}
        </Notice>
      ) : null}
      <Card title="Members">
        {members.isPending ? (
          <Skeleton />
        ) : members.isError ? (
          <Notice tone="invalid">{failureText(members.error)}</Notice>
        ) : (
          <table className="w-full text-sm" aria-label="Members">
            <TableHead look="plain" cells={['Name', 'E-mail', 'Role', '']} />
            <tbody>
              {members.data.members.map((m) => (
                <tr key={m.id} className="border-t border-rule" data-testid={`member-${m.email}`}>
                  <td className="py-1.5">{m.name}</td>
                  <td className="py-1.5">{m.email}</td>
                  <td className="py-1.5">
                    <Select
                      aria-label={`Role of ${m.email}`}
                      value={m.role}
                      className="w-36 py-1"
                      onChange={(ev) => changeRole.mutate({ id: m.id, role: ev.target.value as Role })}
                    >
                      {ROLE_OPTIONS}
                    </Select>
                  </td>
                  <td className="py-1.5 text-right">
                    {m.userId !== selfUserId ? (
                      <Button
                        variant="ghost"
                        onClick={() =>
                          confirm(`Remove ${m.email} from the organisation?`) && remove.mutate(m.id)
                        }
                      >
                        Remove
                      </Button>
                    ) : (
                      <span className="text-xs text-ink-faint">you</span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>

      <Card title="Invite someone">
        <form onSubmit={form.handleSubmit(onInvite)} className="flex items-end gap-3" noValidate>
          <div className="flex-1">
            <Field id="invite-email" label="E-mail" error={form.formState.errors.email?.message}>
              <TextInput
                id="invite-email"
                type="email"
                invalid={!!form.formState.errors.email}
                {...form.register('email')}
              />
            </Field>
          </div>
          <Field id="invite-role" label="Role" error={form.formState.errors.role?.message}>
            <Select id="invite-role" className="w-40" {...form.register('role')}>
              {ROLE_OPTIONS}
            </Select>
          </Field>
          <Button type="submit" disabled={form.formState.isSubmitting}>
            Invite
          </Button>
        </form>
        {lastLink ? (
          <p className="mt-3 text-sm">
            Invitation link (valid 7 days):{' '}
            <code className="select-all break-all text-cost" data-testid="invitation-link">
              {lastLink}
            </code>
          </p>
        ) : null}
      </Card>

      <Card title="Pending invitations">
        {invitations.isPending ? (
          <Skeleton rows={2} />
        ) : invitations.data?.invitations.length ? (
          <ul className="divide-y divide-rule text-sm">
            {invitations.data.invitations.map((i) => (
              <li key={i.id} className="flex items-center gap-3 py-1.5">
                <span className="w-64">{i.email}</span>
                <span className="w-24 text-ink-soft">{ROLE_LABELS[i.role]}</span>
                <span className="text-xs text-ink-faint">expires {formatDate(i.expiresAt)}</span>
                <code className="ml-auto max-w-xs truncate text-xs text-ink-faint">{i.link}</code>
                <Button variant="ghost" onClick={() => revoke.mutate(i.id)}>
                  Revoke
                </Button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-soft">No pending invitations.</p>
        )}
      </Card>
    </div>
  );
}
