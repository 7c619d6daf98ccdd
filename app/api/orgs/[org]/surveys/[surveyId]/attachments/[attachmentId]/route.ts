import { withOrg } from '@/lib/server/with-org';
import { attachmentDownloadUrl, getSurveyAttachment } from '@/lib/server/services/surveys/attachments';

// GET /api/orgs/[org]/surveys/[surveyId]/attachments/[attachmentId]: after the permission check, a redirect to a
// short-lived link that serves the stored file from the object storage with its sniffed type and its name.
export const GET = withOrg(
  async ({ ctx, params }) => {
    const a = await getSurveyAttachment(ctx, params.surveyId, params.attachmentId);
    return new Response(null, {
      status: 302,
      headers: { location: await attachmentDownloadUrl(a), 'cache-control': 'private, no-store' },
    });
  },
  { permission: 'org:read', readOnly: true },
);
