import { designAnodeSystem } from '@/lib/cp';
import { withOrg } from '@/lib/server/with-org';
import { AppError } from '@/lib/server/errors';

// POST /api/orgs/[org]/calculations: a stateless sizing for integrations. The body is lib/cp's
// DesignInput in SI units; the answer is the full result (nothing is stored).
export const POST = withOrg(
  async ({ req }) => {
    let body: unknown;
    try {
      body = await req.json();
    } catch {
      throw new AppError('invalid', 'The request body is not valid JSON.');
    }
    return { result: designAnodeSystem(body as Parameters<typeof designAnodeSystem>[0]) };
  },
  { permission: 'org:read', readOnly: true },
);
