import { z } from 'zod';
import { text } from '@/lib/schemas/text';
import { withOrg, readJson } from '@/lib/server/with-org';
import { listQuerySchema } from '@/lib/schemas/register';
import { listSurveys } from '@/lib/server/services/surveys/survey-details';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';

// GET /api/orgs/[org]/surveys?page&pageSize&sort&dir&q&assetId: surveys with their reading counts.
export const GET = withOrg(async ({ ctx, query }) => listSurveys(ctx, query), { permission: 'org:read', readOnly: true, query: listQuerySchema });

// POST /api/orgs/[org]/surveys: a survey with its readings, as JSON (inspectors, engineers, owners).
export const POST = withOrg(
  async ({ ctx, req }) => {
    const survey = await createSurvey(ctx, await readJson(req, z.record(text(), z.unknown())));
    return Response.json({ survey: { id: survey.id } }, { status: 201 });
  },
  { permission: 'survey:write' },
);
