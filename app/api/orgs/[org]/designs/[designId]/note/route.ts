import { withOrg } from '@/lib/server/with-org';
import { renderCalculationNote } from '@/lib/server/services/designs/calculation-note';

// GET /api/orgs/[org]/designs/[designId]/note: the revision's calculation note as a PDF.
export const GET = withOrg(
  async ({ ctx, params }) => {
    const { pdf, filename } = await renderCalculationNote(ctx, params.designId);
    return new Response(new Uint8Array(pdf), { headers: { 'content-type': 'application/pdf', 'content-disposition': `inline; filename="${filename}"`, 'cache-control': 'private, no-store' } });
  },
  { permission: 'org:print' },
);
