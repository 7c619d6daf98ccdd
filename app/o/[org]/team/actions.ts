'use server';
import { orgAction, formObject } from '@/lib/server/action';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { changeMemberRole } from '@/lib/server/services/team/change-member-role';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { revokeInvitation } from '@/lib/server/services/team/revoke-invitation';
import { updateOrganisationSettings } from '@/lib/server/services/accounts/update-organisation-settings';

export const inviteMemberAction = orgAction('team:manage', async (ctx, formData) => {
  const { invitation } = await inviteMember(ctx, formObject(formData));
  return { ok: true, message: `Invitation to ${invitation.email} queued for sending. The link expires in 7 days.` };
});

export const changeMemberRoleAction = orgAction('team:manage', async (ctx, formData) => {
  await changeMemberRole(ctx, formObject(formData));
  return { ok: true, message: 'Role changed.' };
});

export const removeMemberAction = orgAction('team:manage', async (ctx, formData) => {
  await removeMember(ctx, formObject(formData));
  return { ok: true, message: 'Member removed.' };
});

export const revokeInvitationAction = orgAction('team:manage', async (ctx, formData) => {
  await revokeInvitation(ctx, formObject(formData));
  return { ok: true, message: 'Invitation withdrawn.' };
});

export const updateSettingsAction = orgAction('team:manage', async (ctx, formData) => {
  await updateOrganisationSettings(ctx, formObject(formData));
  return { ok: true, message: 'Settings saved.' };
});
