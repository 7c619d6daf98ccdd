import { withOrg } from '@/lib/server/with-org';
import { readUpload } from '@/lib/server/read-upload';
import { importSummary, importSurveyCsv, MAX_CSV_BYTES } from '@/lib/server/services/surveys/import-survey-csv';
import { importModeSchema } from '@/lib/schemas/surveys';
import { electrodeFromName } from '@/lib/surveys/survey-csv';

// POST /api/orgs/[org]/surveys/[surveyId]/readings: a CSV of readings (multipart "file" or text/csv body).
// Every row is checked first; errors come back by line number and nothing is written, unless the form asks
// for the good lines only ("goodLinesOnly=1", sent after the user has seen the errors). Rows already in the
// survey are skipped and counted.
export const POST = withOrg(
  async ({ ctx, req, params }) => {
    const upload = await readUpload(req, MAX_CSV_BYTES);
    const electrode = upload.fields.defaultElectrode ?? req.nextUrl.searchParams.get('defaultElectrode');
    const { goodLinesOnly } = importModeSchema.parse({ goodLinesOnly: upload.fields.goodLinesOnly ?? req.nextUrl.searchParams.get('goodLinesOnly') ?? undefined });
    const result = await importSurveyCsv(ctx, params.surveyId, upload.bytes, { defaultElectrode: electrode ? (electrodeFromName(electrode) ?? undefined) : undefined, goodLinesOnly });
    return { ...result, message: importSummary(result) };
  },
  { permission: 'survey:write' },
);
