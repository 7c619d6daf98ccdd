import { z } from 'zod';
import { text } from '@/lib/schemas/text';
import { withOrg } from '@/lib/server/with-org';
import { notFound } from '@/lib/server/errors';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { assetFigures, figureDay, FIGURE_NAMES } from '@/lib/server/services/assets/asset-figures';

// GET /api/orgs/[org]/assets/[assetId]/figures/[figure]?v=<version>: one of the asset page's figures (a view of
// the drawing, or the depletion chart) as an SVG image, for any member who may see the asset. Asked for with the
// version it has now, it may be kept for a day without asking again (a change gives it a new address); asked for with another (a page
// open across a change), it is the current figure, checked again next time. An ETag answers a repeat with 304.
export const GET = withOrg(
  async ({ ctx, params, query, req }) => {
    const name = z.enum(FIGURE_NAMES).safeParse(params.figure);
    if (!name.success) throw notFound('Figure');
    const figures = assetFigures(await getAssetPage(ctx, params.assetId ?? '', figureDay()));
    const figure = name.data === 'chart' ? figures.chart : figures.views.find((v) => v.name === name.data);
    if (!figure) throw notFound('Figure');
    const etag = `"${figure.version}"`;
    const headers = {
      'content-type': 'image/svg+xml; charset=utf-8',
      etag,
      // A day at most: a browser's copy goes soon after a sign-out too (the version changes with the day's forecast anyway).
      'cache-control': query.v === figure.version ? 'private, max-age=86400, immutable' : 'private, no-cache',
    };
    if (req.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers });
    return new Response(figure.document, { headers });
  },
  { permission: 'org:read', readOnly: true, query: z.object({ v: text().max(40).optional() }) },
);
