import { withOrg } from '@/lib/server/with-org';
import { getTeam } from '@/lib/server/services/team/get-team';

// GET /api/orgs/[org]/team: members and open invitations (owners only).
export const GET = withOrg(async ({ ctx }) => getTeam(ctx), { permission: 'team:manage', readOnly: true });
