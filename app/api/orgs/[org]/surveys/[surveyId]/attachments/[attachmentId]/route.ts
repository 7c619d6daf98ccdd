import { withOrg } from '@/lib/server/with-org';
import { getSurveyAttachment } from '@/lib/server/services/surveys/attachments';

// GET /api/orgs/[org]/surveys/[surveyId]/attachments/[attachmentId]: the stored file, with its sniffed type.
export const GET = withOrg(
  async ({ ctx, params }) => {
    const a = await getSurveyAttachment(ctx, params.surveyId, params.attachmentId);
    return new Response(new Uint8Array(a.data.$ as Uint8Array), {
      headers: {
        'content-type': a.contentType,
        'content-disposition': `${a.contentType === 'application/pdf' ? 'attachment' : 'inline'}; filename="${a.filename}"`,
        'x-content-type-options': 'nosniff',
        'cache-control': 'private, max-age=3600',
      },
    });
  },
  { permission: 'org:read' },
);
