import { withOrg } from '@/lib/server/with-org';
import { readUpload } from '@/lib/server/read-upload';
import { addSurveyAttachment, MAX_ATTACHMENT_BYTES } from '@/lib/server/services/surveys/attachments';

// POST /api/orgs/[org]/surveys/[surveyId]/attachments: a JPEG/PNG photo or a PDF report (multipart "file", "caption").
export const POST = withOrg(
  async ({ ctx, req, params }) => {
    const upload = await readUpload(req, MAX_ATTACHMENT_BYTES);
    const a = await addSurveyAttachment(ctx, params.surveyId, { name: upload.name, bytes: upload.bytes }, upload.fields.caption ?? null);
    return Response.json({ attachment: { id: a.id, filename: a.filename, contentType: a.contentType, sizeBytes: a.sizeBytes } }, { status: 201 });
  },
  { permission: 'survey:write' },
);
