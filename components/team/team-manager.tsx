'use client';
import { useActionState, useMemo } from 'react';
import { useInvalidateOnSuccess } from '@/lib/client/use-invalidate-on-success';
import { createColumnHelper } from '@tanstack/react-table';
import { format } from 'date-fns';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { Field, FormMessage, SelectField } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';
import { queryKeys } from '@/lib/client/query-client';
import { useTeam, type TeamInvitation, type TeamMember } from '@/lib/client/use-team';
import { ROLES, ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/roles';
import type { ActionState } from '@/lib/server/action';
import { changeMemberRoleAction, inviteMemberAction, removeMemberAction, revokeInvitationAction } from '@/app/o/[org]/team/actions';

type BoundAction = (state: ActionState, formData: FormData) => Promise<ActionState>;
const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

/** Runs a bound server action and refreshes the team query when it succeeds. */
function useTeamAction(org: string, action: (slug: string, state: ActionState, formData: FormData) => Promise<ActionState>) {
  const [state, run, pending] = useActionState(action.bind(null, org) as BoundAction, { ok: false });
  useInvalidateOnSuccess(state, queryKeys.team(org));
  return [state, run, pending] as const;
}

function RoleCell({ org, member }: { org: string; member: TeamMember }) {
  const [state, run, pending] = useTeamAction(org, changeMemberRoleAction);
  return (
    <form action={run} className="flex items-center gap-1.5">
      <input type="hidden" name="membershipId" value={member.id} />
      <select name="role" defaultValue={member.role} aria-label={`Role of ${member.email}`} className="rounded-[3px] border border-rule-strong bg-paper-raised px-1.5 py-0.5 text-sm">
        {roleOptions.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Button type="submit" variant="secondary" disabled={pending} className="px-2 py-0.5 text-xs">
        Save
      </Button>
      {state.message && !state.ok ? <span role="alert" className="text-xs text-state-overdue">{state.message}</span> : null}
    </form>
  );
}

function RemoveCell({ org, member }: { org: string; member: TeamMember }) {
  const [state, run, pending] = useTeamAction(org, removeMemberAction);
  return (
    <form
      action={run}
      onSubmit={(e) => {
        if (!confirm(`Remove ${member.name} (${member.email}) from the organisation?`)) e.preventDefault();
      }}
    >
      <input type="hidden" name="membershipId" value={member.id} />
      <Button type="submit" variant="danger" disabled={pending} className="px-2 py-0.5 text-xs">
        Remove
      </Button>
      {state.message && !state.ok ? <span role="alert" className="ml-1 text-xs text-state-overdue">{state.message}</span> : null}
    </form>
  );
}

function RevokeCell({ org, invitation }: { org: string; invitation: TeamInvitation }) {
  const [, run, pending] = useTeamAction(org, revokeInvitationAction);
  return (
    <form action={run}>
      <input type="hidden" name="invitationId" value={invitation.id} />
      <Button type="submit" variant="danger" disabled={pending} className="px-2 py-0.5 text-xs">
        Withdraw
      </Button>
    </form>
  );
}

export function TeamManager({ org }: { org: string }) {
  const team = useTeam(org);
  const [inviteState, invite, inviting] = useTeamAction(org, inviteMemberAction);

  const memberColumns = useMemo(() => {
    const col = createColumnHelper<TeamMember>();
    return [
      col.accessor('name', { header: 'Name', cell: (c) => (c.row.original.isYou ? `${c.getValue()} (you)` : c.getValue()) }),
      col.accessor('email', { header: 'E-mail' }),
      col.accessor('role', { header: 'Role', cell: (c) => <RoleCell org={org} member={c.row.original} /> }),
      col.accessor('since', { header: 'Member since', cell: (c) => format(new Date(c.getValue()), 'd MMM yyyy') }),
      col.display({ id: 'remove', header: '', cell: (c) => <RemoveCell org={org} member={c.row.original} /> }),
    ];
  }, [org]);
  const invitationColumns = useMemo(() => {
    const col = createColumnHelper<TeamInvitation>();
    return [
      col.accessor('email', { header: 'E-mail' }),
      col.accessor('role', { header: 'Role', cell: (c) => ROLE_LABELS[c.getValue()] }),
      col.accessor('expiresAt', { header: 'Expires', cell: (c) => format(new Date(c.getValue()), 'd MMM yyyy HH:mm') }),
      col.display({ id: 'revoke', header: '', cell: (c) => <RevokeCell org={org} invitation={c.row.original} /> }),
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
        <form action={invite} className="flex flex-col gap-3" noValidate>
          <FormMessage state={inviteState} />
          <Field label="E-mail" name="email" type="email" required defaultValue={inviteState.ok ? '' : inviteState.values?.email} errors={inviteState.fieldErrors?.email} />
          <SelectField label="Role" name="role" options={roleOptions} defaultValue={inviteState.values?.role ?? 'engineer'} errors={inviteState.fieldErrors?.role} />
          <Button type="submit" disabled={inviting}>
            {inviting ? 'Sending…' : 'Send invitation'}
          </Button>
        </form>
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
