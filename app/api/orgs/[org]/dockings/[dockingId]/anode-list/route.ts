import { z } from 'zod';
import { withOrg } from '@/lib/server/with-org';
import { anodeListCsvFor, anodeListPdf } from '@/lib/server/services/planner/anode-list';

// GET /api/orgs/[org]/dockings/[dockingId]/anode-list?format=pdf|csv: the dry-dock anode list (works in read-only mode).
export const GET = withOrg(
  async ({ ctx, params, query }) => {
    if (query.format === 'csv') {
      const { csv, filename } = await anodeListCsvFor(ctx, params.dockingId);
      return new Response(csv, { headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${filename}"` } });
    }
    const { pdf, filename } = await anodeListPdf(ctx, params.dockingId);
    return new Response(new Uint8Array(pdf), { headers: { 'content-type': 'application/pdf', 'content-disposition': `inline; filename="${filename}"`, 'cache-control': 'private, no-store' } });
  },
  { permission: 'org:print', query: z.object({ format: z.enum(['pdf', 'csv']).default('pdf') }) },
);
