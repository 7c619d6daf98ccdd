import { withOrg } from '@/lib/server/with-org';
import { SURVEY_CSV_TEMPLATE } from '@/lib/surveys/survey-csv';

// GET /api/orgs/[org]/surveys/template: the survey readings CSV template.
export const GET = withOrg(
  async () => new Response(SURVEY_CSV_TEMPLATE, { headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="tidewarden-survey-readings-template.csv"' } }),
  { permission: 'org:read' },
);
