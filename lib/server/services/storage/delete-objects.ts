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

/** Deletes the objects once the unit of work has committed (never when it rolls back). */
export function deleteObjectsLater(ctx: Pick<OrgContext, 'effects'>, keys: Keys) {
  const list = [...keys].filter((k): k is string => Boolean(k));
  if (list.length) ctx.effects.onCommit(() => deleteObjectsNow(list));
}
