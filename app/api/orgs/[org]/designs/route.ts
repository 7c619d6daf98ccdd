import { z } from 'zod';
import { text } from '@/lib/schemas/text';
import { withOrg, readJson } from '@/lib/server/with-org';
import { listDesigns } from '@/lib/server/services/designs/list-designs';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { toDesignView } from '@/lib/server/services/designs/design-view';
import { getDesignOrThrow } from '@/lib/server/services/designs/get-design';

// GET /api/orgs/[org]/designs?assetId=: every design revision of the organisation, newest first.
export const GET = withOrg(async ({ ctx, query }) => ({ designs: await listDesigns(ctx, { assetId: query.assetId }) }), {
  permission: 'org:read',
  readOnly: true,
  query: z.object({ assetId: z.uuid().optional() }),
});

// POST /api/orgs/[org]/designs {assetId, title?}: a new draft revision for an asset (engineers).
export const POST = withOrg(
  async ({ ctx, req }) => {
    const design = await createDesign(ctx, await readJson(req, z.object({ assetId: text(), title: text().optional() })));
    return Response.json({ design: toDesignView(await getDesignOrThrow(ctx, design.id)) }, { status: 201 });
  },
  { permission: 'design:write' },
);
