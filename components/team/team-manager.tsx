'use client';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { format } from 'date-fns';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionError, ActionForm, useBoundAction } from '@/components/ui/action-form';
import { Panel } from '@/components/ui/panel';
import { announce, undoBy } from '@/components/ui/toast';
import type { ActionState } from '@/lib/server/action';
import { queryKeys } from '@/lib/client/query-client';
import { useFocusListAfterRemoval } from '@/components/ui/focus-after-removal';
import { useTeam, type TeamInvitation, type TeamMember } from '@/lib/client/use-team';
import { MAIL_DELIVERY_WORDS, ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/labels';
import { ROLES } from '@/lib/roles';
import { changeMemberRoleAction, inviteMemberAction, removeMemberAction, restoreMemberAction, revokeInvitationAction } from '@/app/o/[org]/team/actions';

const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

function RoleCell({ org, member, onSaved }: { org: string; member: TeamMember; onSaved: (state: ActionState) => void }) {
  const { state, action, pending } = useBoundAction(changeMemberRoleAction.bind(null, org), { invalidate: [queryKeys.team(org)] });
  // Controlled, so the saved role stays chosen while the list is fetched again (a form action resets
  // uncontrolled fields to their first value), and follows the list once it arrives.
  const [role, setRole] = useState(member.role);
  useEffect(() => setRole(member.role), [member.role]);
  useEffect(() => {
    if (state.ok && state.message) onSaved(state);
    // one notice per answer
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state]);
  return (
    <form action={action} className="flex items-center gap-1.5">
      <input type="hidden" name="membershipId" value={member.id} />
      <select name="role" value={role} onChange={(e) => setRole(e.target.value as TeamMember['role'])} aria-label={`Role of ${member.email}`} className="rounded-[3px] border border-rule-strong bg-paper-raised px-1.5 py-0.5 text-sm">
        {roleOptions.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Button type="submit" variant="secondary" disabled={pending || role === member.role} className="text-xs" aria-label={`Save the role of ${member.email}`}>
        Save
      </Button>
      <ActionError state={state} />
    </form>
  );
}

function RemoveCell({ org, member, onRemoved }: { org: string; member: TeamMember; onRemoved: (state: ActionState) => void }) {
  const { state, action, pending } = useBoundAction(removeMemberAction.bind(null, org), { invalidate: [queryKeys.team(org)] });
  useEffect(() => {
    if (state.ok) onRemoved(state);
    // one notice per answer
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state]);
  const rememberList = useFocusListAfterRemoval();
  return (
    <form
      action={action}
      onSubmit={(e) => {
        if (!confirm(`Remove ${member.name} (${member.email}) from the organisation?`)) e.preventDefault();
        else rememberList(e.currentTarget);
      }}
    >
      <input type="hidden" name="membershipId" value={member.id} />
      <Button type="submit" variant="danger" disabled={pending} className="text-xs" aria-label={`Remove ${member.name} (${member.email})`}>
        Remove
      </Button>
      <ActionError state={state} className="ml-1" />
    </form>
  );
}

function RevokeCell({ org, invitation }: { org: string; invitation: TeamInvitation }) {
  const { action, pending } = useBoundAction(revokeInvitationAction.bind(null, org), { invalidate: [queryKeys.team(org)] });
  const rememberList = useFocusListAfterRemoval();
  return (
    <form action={action} onSubmit={(e) => rememberList(e.currentTarget)}>
      <input type="hidden" name="invitationId" value={invitation.id} />
      <Button type="submit" variant="danger" disabled={pending} className="text-xs">
        Withdraw<span className="sr-only"> the invitation to {invitation.email}</span>
      </Button>
    </form>
  );
}

export function TeamManager({ org }: { org: string }) {
  const team = useTeam(org);
  const invite = useBoundAction(inviteMemberAction.bind(null, org), { invalidate: [queryKeys.team(org)] });
  const client = useQueryClient();
  const show = announce;
  // The cells report through refs, so the columns (and the table's rows) are not rebuilt on every notice.
  const report = useRef({ saved: (_: ActionState) => {}, removed: (_: ActionState) => {} });
  report.current.saved = (state) => show({ ok: state.ok, message: state.message ?? '' });
  report.current.removed = (state) => {
    const id = typeof state.data?.undoMembershipId === 'string' ? state.data.undoMembershipId : '';
    const undo = id ? { label: 'Undo the removal', run: undoBy(restoreMemberAction.bind(null, org), { membershipId: id }, () => client.invalidateQueries({ queryKey: queryKeys.team(org) })) } : undefined;
    show({ ok: true, message: state.message ?? 'Removed.', undo });
  };

  const memberColumns = useMemo(() => {
    const col = createColumnHelper<TeamMember>();
    return [
      col.accessor('name', { header: 'Name', cell: (c) => (c.row.original.isYou ? `${c.getValue()} (you)` : c.getValue()) }),
      col.accessor('email', { header: 'E-mail' }),
      col.accessor('role', { header: 'Role', cell: (c) => <RoleCell org={org} member={c.row.original} onSaved={(state) => report.current.saved(state)} /> }),
      col.accessor('since', { header: 'Member since', cell: (c) => format(new Date(c.getValue()), 'd MMM yyyy') }),
      col.display({ id: 'remove', header: () => <span className="sr-only">Remove</span>, cell: (c) => <RemoveCell org={org} member={c.row.original} onRemoved={(state) => report.current.removed(state)} /> }),
    ];
  }, [org]);
  const invitationColumns = useMemo(() => {
    const col = createColumnHelper<TeamInvitation>();
    return [
      col.accessor('email', { header: 'E-mail' }),
      col.accessor('role', { header: 'Role', cell: (c) => ROLE_LABELS[c.getValue()] }),
      col.accessor('mail', { header: 'Invitation e-mail', cell: (c) => { const mail = c.getValue(); return mail ? MAIL_DELIVERY_WORDS[mail] : '—'; } }),
      col.accessor('expiresAt', { header: 'Expires', cell: (c) => format(new Date(c.getValue()), 'd MMM yyyy HH:mm') }),
      col.display({ id: 'revoke', header: () => <span className="sr-only">Revoke</span>, cell: (c) => <RevokeCell org={org} invitation={c.row.original} /> }),
    ];
  }, [org]);

  return (
    <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="flex flex-col gap-5">
        <Panel title="Members">
          {team.isError ? <p role="alert" className="text-sm text-state-action">{team.error.message}</p> : null}
          {team.isLoading ? <p className="text-sm text-ink-faint">Loading…</p> : <DataTable label="Members" data={team.data?.members ?? []} columns={memberColumns} />}
        </Panel>
        <Panel title="Open invitations">
          <DataTable label="Open invitations" data={team.data?.invitations ?? []} columns={invitationColumns} empty="No open invitations." />
        </Panel>
      </div>
      <Panel title="Invite someone">
        <ActionForm form={invite} className="flex flex-col gap-3" noValidate>
          <Field label="E-mail" {...invite.field('email')} type="email" required />
          <SelectField label="Role" {...invite.field('role', 'engineer')} options={roleOptions} />
          <Button type="submit" disabled={invite.pending}>
            {invite.pending ? 'Sending…' : 'Send invitation'}
          </Button>
        </ActionForm>
        <dl className="mt-4 flex flex-col gap-1.5 text-xs text-ink-soft">
          {ROLES.map((r) => (
            <div key={r}>
              <dt className="inline font-semibold text-ink">{ROLE_LABELS[r]}: </dt>
              <dd className="inline">{ROLE_DESCRIPTIONS[r]}</dd>
            </div>
          ))}
        </dl>
      </Panel>
    </div>
  );
}
