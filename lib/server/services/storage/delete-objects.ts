// Files leave the object storage only after the rows that named them are gone for good (committed). A delete
// that fails is logged and left to the storage clean-up job (sweep-orphan-objects.ts): the object has no row,
// so nothing is lost and the job removes it on its next pass.
import type { OrgContext } from '../../org-context';
import { getStorage, type ObjectStorage } from '../../storage/object-storage';

type Keys = Iterable<string | null | undefined>;

/** Deletes the objects now; returns how many went. Never throws (see above). */
export async function deleteObjectsNow(keys: Keys, storage: Pick<ObjectStorage, 'deleteObject'> = getStorage()): Promise<number> {
  let deleted = 0;
  for (const key of new Set([...keys].filter((k): k is string => Boolean(k)))) {
    try {
      await storage.deleteObject(key);
      deleted++;
    } catch (error) {
      console.error(`[tidewarden] could not delete a stored file (the clean-up job will): ${error instanceof Error ? error.message : error}`);
    }
  }
  return deleted;
}

/**
 * Deletes the objects once the unit of work has committed (never when it rolls back), in the background: the
 * request does not wait on the storage (a slow or stalled one must not hold the user's answer, nor another
 * organisation's). A delete that fails or never ends leaves an object no row names; the clean-up job removes it.
 */
export function deleteObjectsLater(ctx: Pick<OrgContext, 'effects'>, keys: Keys) {
  const list = [...keys].filter((k): k is string => Boolean(k));
  if (list.length) ctx.effects.onCommit(() => deleteObjectsInBackground(list));
}

/** Starts the deletes and returns at once; failures are logged (deleteObjectsNow never throws). */
export function deleteObjectsInBackground(keys: Keys): void {
  void deleteObjectsNow(keys);
}
