'use server';
import { orgAction, formObject } from '@/lib/server/action';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { changeMemberRole } from '@/lib/server/services/team/change-member-role';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { restoreMember } from '@/lib/server/services/team/restore-member';
import { ROLE_LABELS } from '@/lib/labels';
import { revokeInvitation } from '@/lib/server/services/team/revoke-invitation';
import { updateOrganisationSettings } from '@/lib/server/services/accounts/update-organisation-settings';

export const inviteMemberAction = orgAction('team:manage', async (ctx, formData) => {
  const { invitation } = await inviteMember(ctx, formObject(formData));
  return { ok: true, message: `Invitation to ${invitation.email} queued for sending. The link expires in 7 days.` };
});

export const changeMemberRoleAction = orgAction('team:manage', async (ctx, formData) => {
  const membership = await changeMemberRole(ctx, formObject(formData));
  return { ok: true, message: `Saved: ${membership.user.name} is now ${ROLE_LABELS[membership.role].toLowerCase()}.` };
});

export const removeMemberAction = orgAction('team:manage', async (ctx, formData) => {
  const removed = await removeMember(ctx, formObject(formData));
  return { ok: true, message: `Removed ${removed.name} (${removed.email}).`, data: { undoMembershipId: removed.id } };
});

/** Undo of a removal a moment ago: the same membership back (see restoreMember). */
export const restoreMemberAction = orgAction('team:manage', async (ctx, formData) => {
  const { membership } = await restoreMember(ctx, formObject(formData));
  return { ok: true, message: `Restored: ${membership.user.name} is a member again, as ${ROLE_LABELS[membership.role].toLowerCase()}.` };
});

export const revokeInvitationAction = orgAction('team:manage', async (ctx, formData) => {
  await revokeInvitation(ctx, formObject(formData));
  return { ok: true, message: 'Invitation withdrawn.' };
});

export const updateSettingsAction = orgAction('team:manage', async (ctx, formData) => {
  await updateOrganisationSettings(ctx, formObject(formData));
  return { ok: true, message: 'Settings saved.' };
});
