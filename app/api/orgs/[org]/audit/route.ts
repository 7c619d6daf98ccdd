import { z } from 'zod';
import { withOrg } from '@/lib/server/with-org';
import { getAuditLog } from '@/lib/server/services/accounts/get-audit-log';

const query = z.object({ page: z.coerce.number().int().min(1).max(10_000).default(1) });

// GET /api/orgs/[org]/audit?page=N: the organisation's audit log, newest first (owners only).
export const GET = withOrg(async ({ ctx, query }) => getAuditLog(ctx, { page: query.page }), { permission: 'audit:read', readOnly: true, query });
