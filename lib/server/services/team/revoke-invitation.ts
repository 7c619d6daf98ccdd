import { InvitationSchema } from '@/entities';
import { invitationIdSchema } from '@/lib/schemas/accounts';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';

export async function revokeInvitation(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const { invitationId } = invitationIdSchema.parse(input);
  const invitation = await ctx.em.findOne(InvitationSchema, { id: invitationId, organisation: ctx.organisation, acceptedAt: null, revokedAt: null });
  if (!invitation) throw notFound('Open invitation');
  invitation.revokedAt = new Date();
  audit(ctx, { action: 'invitation.revoked', targetType: 'invitation', targetId: invitation.id, details: { email: invitation.email } });
}
