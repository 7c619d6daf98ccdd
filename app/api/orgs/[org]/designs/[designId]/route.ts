import { withOrg } from '@/lib/server/with-org';
import { getDesignOrThrow } from '@/lib/server/services/designs/get-design';
import { toDesignView } from '@/lib/server/services/designs/design-view';

// GET /api/orgs/[org]/designs/[designId]: one revision with its inputs, results, basis and signatures.
export const GET = withOrg(async ({ ctx, params }) => ({ design: toDesignView(await getDesignOrThrow(ctx, params.designId)) }), { permission: 'org:read', readOnly: true });
