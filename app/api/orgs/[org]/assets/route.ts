import { withOrg, readJson } from '@/lib/server/with-org';
import { listQuerySchema } from '@/lib/schemas/register';
import { listFleet } from '@/lib/server/services/assets/list-fleet';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { z } from 'zod';
import { text } from '@/lib/schemas/text';

// GET /api/orgs/[org]/assets?page&pageSize&sort&dir&q&archived: the fleet, one page, with register and survey summaries and each asset's outlook.
export const GET = withOrg(async ({ ctx, query }) => listFleet(ctx, query), { permission: 'org:read', readOnly: true, query: listQuerySchema });

// POST /api/orgs/[org]/assets: a new vessel or structure (engineers).
export const POST = withOrg(
  async ({ ctx, req }) => {
    const asset = await createAsset(ctx, await readJson(req, z.record(text(), z.unknown())));
    return Response.json({ asset: { id: asset.id, name: asset.name, kind: asset.kind } }, { status: 201 });
  },
  { permission: 'asset:write' },
);
