import type { Role } from '@/lib/roles';
import { invitationMailKey, mailDelivery } from '@/lib/labels';
import { requirePermission, type OrgContext } from '../../org-context';
import { inSequence, pgArray } from '../../sql';

const iso = (v: unknown) => new Date(v as string).toISOString();

/** Members and open invitations, as plain objects for the team table; plain statements, no entities. */
export async function getTeam(ctx: OrgContext) {
  requirePermission(ctx, 'team:manage');
  const [members, invitations] = await inSequence(
    () =>
      ctx.em.execute<{ id: string; user_id: string; name: string; email: string; role: Role; created_at: string }[]>(
        `select m.id, m.user_id, u.name, u.email, m.role, m.created_at from membership m join app_user u on u.id = m.user_id
          where m.organisation_id = ? order by m.created_at, m.id`,
        [ctx.organisation.id],
      ),
    () =>
      ctx.em.execute<{ id: string; email: string; role: Role; expires_at: string; created_at: string }[]>(
        `select id, email, role, expires_at, created_at from invitation
          where organisation_id = ? and accepted_at is null and revoked_at is null and expires_at > now() order by created_at desc, id`,
        [ctx.organisation.id],
      ),
  );
  // Each invitation's e-mail, so the table says "queued" until the mail server has taken it.
  const mails = invitations.length
    ? await ctx.em.execute<{ dedupe_key: string; status: 'pending' | 'sent' | 'failed'; attempts: number }[]>(
        `select dedupe_key, status, attempts from outbox_message where dedupe_key = any(?::text[])`,
        [pgArray(invitations.map((i) => invitationMailKey(i.id)))],
      )
    : [];
  const mailByKey = new Map(mails.map((m) => [m.dedupe_key, mailDelivery(m.status, Number(m.attempts))]));
  return {
    members: members.map((m) => ({ id: m.id, userId: m.user_id, name: m.name, email: m.email, role: m.role, since: iso(m.created_at), isYou: m.user_id === ctx.user.id })),
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: iso(i.expires_at), createdAt: iso(i.created_at), mail: mailByKey.get(invitationMailKey(i.id)) ?? null })),
  };
}
