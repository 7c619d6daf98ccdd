// The nightly storage clean-up: removes objects that no row names any more. It is the safety net behind the
// deletes after commit (a failed one, a crash between the commit and the delete, a server-side upload whose
// transaction rolled back, an upload link that was used but never completed).
// An object is kept while any of these names it: a live attachment, an attachment waiting in its undo bin,
// an attachment of a deleted survey in the survey bin, or an upload asked for less than a day ago.
// Objects younger than ORPHAN_GRACE_MINUTES are never touched: their row may be in a transaction not yet committed.
// Nothing at all is touched while any row still holds bytes awaiting the move into the storage
// (move-stored-files.ts): a half-done move must never meet a clean-up.
import type { EntityManager } from '@mikro-orm/postgresql';
import { getStorage, type ObjectStorage } from '../../storage/object-storage';
import { STORED_FILES_PREFIX } from '../../storage/object-keys';
import { deleteObjectsNow } from './delete-objects';
import { pgArray } from '../../sql';
import { storedFilesAwaitingMove } from '../../storage/move-stored-files';

/** A pending upload is kept this long; its presigned link expired long before. */
export const PENDING_UPLOAD_HOURS = 24;
/** An object newer than this is left alone whatever the rows say (see above). */
export const ORPHAN_GRACE_MINUTES = 60;

export interface OrphanSweep {
  /** True when the sweep did nothing because files still await the move out of PostgreSQL. */
  skipped: boolean;
  listed: number;
  deleted: number;
  staleUploads: number;
}

/** Which of these keys some row still names (see the list above). */
async function referencedKeys(em: EntityManager, keys: string[], now: Date): Promise<Set<string>> {
  if (!keys.length) return new Set();
  const rows = await em.execute<{ key: string }[]>(
    `select k.key from unnest(?::text[]) as k(key)
      where exists (select 1 from survey_attachment a where a.object_key = k.key)
         or exists (select 1 from survey_attachment_bin b where b.payload->>'object_key' = k.key)
         or exists (select 1 from survey_bin s where s.payload->'attachments' @> jsonb_build_array(jsonb_build_object('object_key', k.key)))
         or exists (select 1 from survey_attachment_upload u where u.object_key = k.key and u.created_at > ?::timestamptz - ? * interval '1 hour')`,
    [pgArray(keys), now.toISOString(), PENDING_UPLOAD_HOURS],
  );
  return new Set(rows.map((r) => r.key));
}

/**
 * Pages through the storage (ListObjectsV2) and deletes every unreferenced object older than the grace period;
 * first forgets uploads asked for more than PENDING_UPLOAD_HOURS ago (their objects then go in the same pass).
 * Runs outside any transaction; each page is checked against the rows as they are at that moment.
 */
export async function sweepOrphanObjects(em: EntityManager, options: { now?: Date; storage?: ObjectStorage; pageSize?: number } = {}): Promise<OrphanSweep> {
  const now = options.now ?? new Date();
  const storage = options.storage ?? getStorage();
  if (await storedFilesAwaitingMove((sql, params) => em.execute(sql, params ?? []))) return { skipped: true, listed: 0, deleted: 0, staleUploads: 0 };
  const stale = await em.execute<{ id: string }[]>(`delete from survey_attachment_upload where created_at <= ?::timestamptz - ? * interval '1 hour' returning id`, [now.toISOString(), PENDING_UPLOAD_HOURS]);
  const result: OrphanSweep = { skipped: false, listed: 0, deleted: 0, staleUploads: stale.length };
  const graceStart = now.getTime() - ORPHAN_GRACE_MINUTES * 60_000;
  let token: string | undefined;
  do {
    const page = await storage.listObjects(STORED_FILES_PREFIX, token, options.pageSize);
    result.listed += page.objects.length;
    const old = page.objects.filter((o) => o.lastModified.getTime() <= graceStart).map((o) => o.key);
    const kept = await referencedKeys(em, old, now);
    result.deleted += await deleteObjectsNow(old.filter((key) => !kept.has(key)), storage);
    token = page.nextToken ?? undefined;
  } while (token);
  return result;
}
