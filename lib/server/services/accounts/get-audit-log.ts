import { requirePermission, type OrgContext } from '../../org-context';
import { inSequence } from '../../sql';

// The organisation's own events, plus its members' account events (sign-ins, lock-outs, password changes),
// which belong to no organisation. Plain SQL, two statements: the log is read page by page and often.
const WHERE = `(e.organisation_id = ?
   or (e.organisation_id is null and e.actor_user_id in (select mb.user_id from membership mb where mb.organisation_id = ?))
   or (e.organisation_id is null and e.action = 'user.sign-in-locked'
       and e.actor_email in (select u.email from membership mb join app_user u on u.id = mb.user_id where mb.organisation_id = ?)))`;

export async function getAuditLog(ctx: OrgContext, { page = 1, pageSize = 50 }: { page?: number; pageSize?: number } = {}) {
  requirePermission(ctx, 'audit:read');
  const org = ctx.organisation.id;
  const [counted, rows] = await inSequence(
    () => ctx.em.execute<{ total: string }[]>(`select count(*) as total from audit_event e where ${WHERE}`, [org, org, org]),
    () =>
      ctx.em.execute<{ id: string; created_at: Date; actor_email: string | null; action: string; target_type: string | null; details: unknown }[]>(
        `select e.id, e.created_at, e.actor_email, e.action, e.target_type, e.details from audit_event e where ${WHERE}
          order by e.created_at desc, e.id desc limit ? offset ?`,
        [org, org, org, pageSize, (page - 1) * pageSize],
      ),
  );
  return {
    total: Number(counted[0]?.total ?? 0),
    rows: rows.map((r) => ({ id: r.id, at: new Date(r.created_at).toISOString(), actor: r.actor_email ?? null, action: r.action, targetType: r.target_type ?? null, details: r.details ?? null })),
  };
}
