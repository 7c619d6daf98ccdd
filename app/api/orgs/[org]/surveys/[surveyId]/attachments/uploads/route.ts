import { NextResponse } from 'next/server';
import { AppError } from '@/lib/server/errors';
import { withOrg } from '@/lib/server/with-org';
import { requestAttachmentUpload } from '@/lib/server/services/surveys/request-attachment-upload';

// POST /api/orgs/[org]/surveys/[surveyId]/attachments/uploads: an upload link for one photo or report
// (JSON { deviceId, filename, contentType, sizeBytes, caption }); the browser PUTs the file to it, then completes.
export const POST = withOrg(
  async ({ ctx, req, params }) => {
    let body: unknown;
    try {
      body = await req.json();
    } catch {
      throw new AppError('invalid', 'The request body is not valid JSON.');
    }
    const answer = await requestAttachmentUpload(ctx, params.surveyId, body);
    return NextResponse.json({ upload: answer }, { headers: { 'cache-control': 'no-store' } });
  },
  { permission: 'survey:write' },
);
