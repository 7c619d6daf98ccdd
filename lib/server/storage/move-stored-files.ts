// Moves photos and reports that were kept in PostgreSQL (survey_attachment.data, and the copies of deleted
// ones in survey_attachment_bin and survey_bin) into the object storage. It runs outside any migration
// transaction: `tsx scripts/migrate.ts up` runs it after the migrations, and the worker at start (in case a
// release skipped the script, or the storage was down when it ran).
//
// Safe to stop and run again at any point: each file's key is fixed by its attachment id
// (org/<organisation>/survey/<survey>/<attachment id>); the bytes are written to the storage first and only
// then, in one statement that commits on its own, taken out of the row and replaced by the key. A crash leaves
// every row either with its bytes or with its key (and its object in the storage); the next run carries on.
// Bytes that cannot be read (not the "\x<hex>" a jsonb copy of bytea holds) stop the run with an error that
// names the row: they are never dropped.
import type { ObjectStorage } from './object-storage';
import { attachmentObjectKey } from './object-keys';

type Execute = (sql: string, params?: unknown[]) => Promise<Record<string, unknown>[]>;
type Storage = Pick<ObjectStorage, 'putObject' | 'ensureBucket'>;

const BATCH = 50;

/** What a jsonb copy of a bytea column holds: "\x" and the bytes in hex. Throws on anything else. */
function bytesOfJson(value: unknown, where: string): Buffer {
  if (typeof value !== 'string' || !/^\\x([0-9a-fA-F]{2})*$/.test(value)) {
    throw new Error(`The stored bytes of ${where} cannot be read (expected "\\x" and hex, found ${typeof value === 'string' ? `"${value.slice(0, 12)}…"` : typeof value}); nothing of that row was changed. Fix the row and run the move again.`);
  }
  return Buffer.from(value.slice(2), 'hex');
}

export interface MoveCounts {
  attachments: number;
  attachmentBin: number;
  surveyBin: number;
}

/** True while some row still holds bytes that are not in the object storage yet. */
export async function storedFilesAwaitingMove(execute: Execute): Promise<boolean> {
  const [row] = await execute(
    `select (exists (select 1 from information_schema.columns where table_schema = current_schema() and table_name = 'survey_attachment' and column_name = 'data')
             and exists (select 1 from survey_attachment where object_key is null))
         or exists (select 1 from survey_attachment_bin where payload->>'data' is not null)
         or exists (select 1 from survey_bin b, jsonb_array_elements(coalesce(b.payload->'attachments', '[]'::jsonb)) e where e->>'data' is not null) as waiting`,
  );
  return Boolean(row?.waiting);
}

export async function moveStoredFilesToObjectStorage(execute: Execute, storageFor: () => Storage): Promise<MoveCounts> {
  const counts: MoveCounts = { attachments: 0, attachmentBin: 0, surveyBin: 0 };
  let storage: Storage | null = null;
  // The storage is asked for only when there is something to move: a fresh database needs none.
  const store = async () => {
    if (!storage) {
      storage = storageFor();
      await storage.ensureBucket();
    }
    return storage;
  };

  const hasDataColumn = (await execute(`select 1 from information_schema.columns where table_schema = current_schema() and table_name = 'survey_attachment' and column_name = 'data'`)).length > 0;
  if (hasDataColumn) {
    for (;;) {
      const rows = await execute(`select id, organisation_id, survey_id, content_type, data from survey_attachment where object_key is null order by id limit ${BATCH}`);
      if (!rows.length) break;
      for (const row of rows) {
        if (!Buffer.isBuffer(row.data)) throw new Error(`survey_attachment ${String(row.id)} has neither an object key nor its bytes; nothing was changed. Check the row.`);
        const key = attachmentObjectKey(String(row.organisation_id), String(row.survey_id), String(row.id));
        await (await store()).putObject(key, row.data, String(row.content_type));
        await execute('update survey_attachment set object_key = ?, data = null where id = ? and object_key is null', [key, row.id]);
        counts.attachments++;
      }
    }
  }

  // A singly deleted attachment waiting for its undo: the payload is the whole row, bytes included.
  for (;;) {
    const rows = await execute(
      `select id, organisation_id, survey_id, payload->>'content_type' as content_type, payload->>'data' as data
         from survey_attachment_bin where payload->>'data' is not null order by id limit ${BATCH}`,
    );
    if (!rows.length) break;
    for (const row of rows) {
      const key = attachmentObjectKey(String(row.organisation_id), String(row.survey_id), String(row.id));
      const bytes = bytesOfJson(row.data, `the deleted attachment ${String(row.id)} (survey_attachment_bin)`);
      await (await store()).putObject(key, bytes, String(row.content_type));
      await execute(`update survey_attachment_bin set payload = (payload - 'data') || jsonb_build_object('object_key', ?::text) where id = ?`, [key, row.id]);
      counts.attachmentBin++;
    }
  }

  // A deleted survey in its bin: its attachments are rows in the payload's "attachments" array.
  for (;;) {
    const rows = await execute(
      `select b.id, b.organisation_id, b.payload->'attachments' as attachments from survey_bin b
        where exists (select 1 from jsonb_array_elements(coalesce(b.payload->'attachments', '[]'::jsonb)) e where e->>'data' is not null)
        order by b.id limit ${BATCH}`,
    );
    if (!rows.length) break;
    for (const row of rows) {
      const attachments = (typeof row.attachments === 'string' ? JSON.parse(row.attachments) : row.attachments) as Record<string, unknown>[];
      const moved: Record<string, unknown>[] = [];
      // Every file of the survey is written before the row changes (one statement): all of them move or none.
      for (const element of attachments) {
        if (element.data === undefined || element.data === null) {
          moved.push(element);
          continue;
        }
        const { data, ...rest } = element;
        const key = attachmentObjectKey(String(element.organisation_id ?? row.organisation_id), String(element.survey_id ?? row.id), String(element.id));
        const bytes = bytesOfJson(data, `attachment ${String(element.id)} of the deleted survey ${String(row.id)} (survey_bin)`);
        await (await store()).putObject(key, bytes, String(element.content_type));
        moved.push({ ...rest, object_key: key });
        counts.surveyBin++;
      }
      await execute(`update survey_bin set payload = jsonb_set(payload, '{attachments}', ?::jsonb) where id = ?`, [JSON.stringify(moved), row.id]);
    }
  }
  return counts;
}
