import { withOrg } from '@/lib/server/with-org';
import { exportAnodeRegisterCsv } from '@/lib/server/services/register/list-anode-groups';

// GET /api/orgs/[org]/anode-groups/export: every fitted anode group as CSV (works in read-only mode too).
export const GET = withOrg(
  async ({ ctx }) =>
    new Response(await exportAnodeRegisterCsv(ctx), {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="anode-register-${ctx.organisation.slug}-${new Date().toISOString().slice(0, 10)}.csv"` },
    }),
  { permission: 'org:read' },
);
