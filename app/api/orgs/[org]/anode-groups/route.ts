import { withOrg } from '@/lib/server/with-org';
import { listQuerySchema } from '@/lib/schemas/register';
import { listAnodeGroups } from '@/lib/server/services/register/list-anode-groups';

// GET /api/orgs/[org]/anode-groups?page&pageSize&sort&dir&q&archived&assetId: the anode register, one page.
export const GET = withOrg(async ({ ctx, query }) => listAnodeGroups(ctx, query), { permission: 'org:read', readOnly: true, query: listQuerySchema });
