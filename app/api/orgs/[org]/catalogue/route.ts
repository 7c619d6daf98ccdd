import { withOrg } from '@/lib/server/with-org';
import { listCatalogue } from '@/lib/server/services/catalogue/anode-models';

// GET /api/orgs/[org]/catalogue: the built-in generic models and the organisation's own.
export const GET = withOrg(async ({ ctx }) => ({ models: await listCatalogue(ctx, { includeArchived: true }) }), { permission: 'org:read', readOnly: true });
