'use client';
import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { format } from 'date-fns';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { ActionError, ActionForm, useBoundAction } from '@/components/ui/action-form';
import { Panel } from '@/components/ui/panel';
import { queryKeys } from '@/lib/client/query-client';
import { useFocusListAfterRemoval } from '@/components/ui/focus-after-removal';
import { useTeam, type TeamInvitation, type TeamMember } from '@/lib/client/use-team';
import { MAIL_DELIVERY_WORDS } from '@/lib/words/mail-delivery';
import { ROLES, ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/roles';
import { changeMemberRoleAction, inviteMemberAction, removeMemberAction, revokeInvitationAction } from '@/app/o/[org]/team/actions';

const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

function RoleCell({ org, member }: { org: string; member: TeamMember }) {
  const { state, action, pending } = useBoundAction(changeMemberRoleAction.bind(null, org), { invalidate: [queryKeys.team(org)] });
  return (
    <form action={action} className="flex items-center gap-1.5">
      <input type="hidden" name="membershipId" value={member.id} />
      <select name="role" defaultValue={member.role} aria-label={`Role of ${member.email}`} className="rounded-[3px] border border-rule-strong bg-paper-raised px-1.5 py-0.5 text-sm">
        {roleOptions.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Button type="submit" variant="secondary" disabled={pending} className="px-2 py-0.5 text-xs">
        Save<span className="sr-only"> the role of {member.name}</span>
      </Button>
      <ActionError state={state} />
    </form>
  );
}

function RemoveCell({ org, member }: { org: string; member: TeamMember }) {
  const { state, action, pending } = useBoundAction(removeMemberAction.bind(null, org), { invalidate: [queryKeys.team(org)] });
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
      <Button type="submit" variant="danger" disabled={pending} className="px-2 py-0.5 text-xs">
        Remove<span className="sr-only"> {member.name} from the organisation</span>
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
      <Button type="submit" variant="danger" disabled={pending} className="px-2 py-0.5 text-xs">
        Withdraw<span className="sr-only"> the invitation to {invitation.email}</span>
      </Button>
    </form>
  );
}

export function TeamManager({ org }: { org: string }) {
  const team = useTeam(org);
  const invite = useBoundAction(inviteMemberAction.bind(null, org), { invalidate: [queryKeys.team(org)] });

  const memberColumns = useMemo(() => {
    const col = createColumnHelper<TeamMember>();
    return [
      col.accessor('name', { header: 'Name', cell: (c) => (c.row.original.isYou ? `${c.getValue()} (you)` : c.getValue()) }),
      col.accessor('email', { header: 'E-mail' }),
      col.accessor('role', { header: 'Role', cell: (c) => <RoleCell org={org} member={c.row.original} /> }),
      col.accessor('since', { header: 'Member since', cell: (c) => format(new Date(c.getValue()), 'd MMM yyyy') }),
      col.display({ id: 'remove', header: () => <span className="sr-only">Remove</span>, cell: (c) => <RemoveCell org={org} member={c.row.original} /> }),
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
    <div className="grid gap-5 xl:grid-cols-[1fr_22rem]">
      <div className="flex flex-col gap-5">
        <Panel title="Members">
          {team.isError ? <p role="alert" className="text-sm text-state-overdue">{team.error.message}</p> : null}
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
