import { withOrg } from '@/lib/server/with-org';
import { readUpload } from '@/lib/server/read-upload';
import { importSurveyCsv, MAX_CSV_BYTES } from '@/lib/server/services/surveys/import-survey-csv';
import { electrodeFromName } from '@/lib/surveys/survey-csv';

// POST /api/orgs/[org]/surveys/[surveyId]/readings: a CSV of readings (multipart "file" or text/csv body).
// Every row is checked first; errors come back by line number and nothing is written.
export const POST = withOrg(
  async ({ ctx, req, params }) => {
    const upload = await readUpload(req, MAX_CSV_BYTES);
    const electrode = upload.fields.defaultElectrode ?? req.nextUrl.searchParams.get('defaultElectrode');
    return importSurveyCsv(ctx, params.surveyId, upload.bytes, { defaultElectrode: electrode ? (electrodeFromName(electrode) ?? undefined) : undefined });
  },
  { permission: 'survey:write' },
);
