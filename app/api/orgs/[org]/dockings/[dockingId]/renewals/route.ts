import { withOrg } from '@/lib/server/with-org';
import { listDockingRenewalRows } from '@/lib/server/services/planner/docking-renewals';

// GET /api/orgs/[org]/dockings/[dockingId]/renewals: the renewals booked at a docking.
export const GET = withOrg(async ({ ctx, params }) => ({ renewals: await listDockingRenewalRows(ctx, params.dockingId) }), { permission: 'org:read', readOnly: true });
