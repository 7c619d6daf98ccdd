import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { readJson, withOrg } from '@/lib/server/with-org';
import { runInOrg } from '@/lib/server/unit-of-work';
import { CAPTURE_CONFLICT_MESSAGES } from '@/lib/labels';
import { captureBatchSchema, type CaptureItemResult } from '@/lib/schemas/surveys';
import { captureReading, captureRefusal, getCaptureSurveyOrThrow } from '@/lib/server/services/surveys/capture-reading';

// POST /api/orgs/[org]/surveys/[surveyId]/capture: a batch from a phone's capture queue, each item recorded once
// (by the UUID the phone gave it) in a unit of work of its own, answered item by item.
//
// The wrapper checks the session and the membership (404 for a non-member), and a survey that does not exist
// (deleted since the phone opened it) is a 404 for the whole batch, whose sentence the phone shows beside each
// item (a survey deleted while the batch runs is a conflict per item). Each item
// then runs through runInOrg on its own, so one refused item does not refuse the others, and an item the
// member may no longer write (role changed, organisation read-only) comes back as a conflict beside the rest.
// A batch names the member who captured it (`capturedBy`); one captured by anyone but the signed-in member is
// answered as a conflict per item and nothing is recorded.
// The items carry their own keys, so no Idempotency-Key is needed. Anything unexpected fails the whole
// request (500): the phone keeps every item and sends again, and the items already recorded answer `duplicate`.
export const POST = withOrg(
  async ({ ctx, req, params }) => {
    await getCaptureSurveyOrThrow(ctx, params.surveyId);
    const { capturedBy, items } = await readJson(req, captureBatchSchema);
    // Items captured by another member on this phone (their session ended, someone else signed in, a tab left
    // open from their session) are never recorded as this member's: each stays on the phone until its own
    // member signs in and sends it.
    if (capturedBy !== ctx.user.id) {
      return { results: items.map((item): CaptureItemResult => ({ deviceId: item.deviceId, status: 'conflict', message: CAPTURE_CONFLICT_MESSAGES.otherMember })) };
    }
    const access = { user: ctx.user, slug: ctx.organisation.slug, permission: 'org:read' as const, ip: ctx.ip };
    const results: CaptureItemResult[] = [];
    for (const item of items) {
      results.push(await captureOne(access, params.surveyId, item));
    }
    return { results };
  },
  { permission: 'org:read', readOnly: true },
);

async function captureOne(access: Parameters<typeof runInOrg>[0], surveyId: string, item: { deviceId: string } & Record<string, unknown>): Promise<CaptureItemResult> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await runInOrg(access, (ctx) => captureReading(ctx, surveyId, item));
    } catch (error) {
      // The survey lock makes a second send wait for the first; should two still meet at the unique index,
      // the next attempt finds the first one's reading and answers `duplicate`.
      if (error instanceof UniqueConstraintViolationException && attempt === 0) continue;
      const refusal = captureRefusal(item.deviceId, error);
      if (refusal) return refusal;
      throw error;
    }
  }
}
