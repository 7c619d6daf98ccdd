import { NextResponse } from 'next/server';
import { withOrg } from '@/lib/server/with-org';
import { completeAttachmentUpload } from '@/lib/server/services/surveys/complete-attachment-upload';

// POST /api/orgs/[org]/surveys/[surveyId]/attachments/uploads/[deviceId]/complete: the file is in the storage;
// it is checked there (type from its bytes, size, prefix) and recorded: 201 the first time, 200 for a repeat.
export const POST = withOrg(
  async ({ ctx, params }) => {
    const { created, attachment } = await completeAttachmentUpload(ctx, params.surveyId, params.deviceId ?? '');
    return NextResponse.json({ attachment }, { status: created ? 201 : 200 });
  },
  { permission: 'survey:write' },
);
