// Moves photos and reports that were kept in PostgreSQL (survey_attachment.data, and the copies of deleted
// ones in survey_attachment_bin and survey_bin) into the object storage. Used by the migration
// Migration20261211000000_object_storage; exported so its test can run it against a storage that fails.
//
// Safe to run again at any point: each file's key is fixed by its attachment id
// (org/<organisation>/survey/<survey>/<attachment id>), the bytes are written to the storage first and only
// then taken out of the row in one statement, so a rerun after a crash writes the same object again and
// carries on; a row whose bytes are gone already has its key.
import type { ObjectStorage } from './object-storage';
import { attachmentObjectKey } from './object-keys';

type Execute = (sql: string, params?: unknown[]) => Promise<Record<string, unknown>[]>;
type Storage = Pick<ObjectStorage, 'putObject' | 'ensureBucket'>;

const BATCH = 50;

/** What a jsonb copy of a bytea column holds: "\x" and the bytes in hex. */
function bytesOfJson(value: unknown): Buffer | null {
  if (typeof value !== 'string' || !value.startsWith('\\x')) return null;
  return Buffer.from(value.slice(2), 'hex');
}

export interface MoveCounts {
  attachments: number;
  attachmentBin: number;
  surveyBin: number;
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
      const rows = await execute(
        `select id, organisation_id, survey_id, content_type, data from survey_attachment where object_key is null and data is not null order by id limit ${BATCH}`,
      );
      if (!rows.length) break;
      for (const row of rows) {
        const key = attachmentObjectKey(String(row.organisation_id), String(row.survey_id), String(row.id));
        await (await store()).putObject(key, row.data as Buffer, String(row.content_type));
        await execute('update survey_attachment set object_key = ?, data = null where id = ?', [key, row.id]);
        counts.attachments++;
      }
    }
  }

  // A singly deleted attachment waiting for its undo: the payload is the whole row, bytes included.
  for (;;) {
    const rows = await execute(
      `select id, organisation_id, survey_id, payload->>'content_type' as content_type, payload->>'data' as data
         from survey_attachment_bin where jsonb_exists(payload, 'data') order by id limit ${BATCH}`,
    );
    if (!rows.length) break;
    for (const row of rows) {
      const key = attachmentObjectKey(String(row.organisation_id), String(row.survey_id), String(row.id));
      const bytes = bytesOfJson(row.data);
      if (bytes) await (await store()).putObject(key, bytes, String(row.content_type));
      await execute(`update survey_attachment_bin set payload = (payload - 'data') || jsonb_build_object('object_key', ?::text) where id = ?`, [key, row.id]);
      counts.attachmentBin++;
    }
  }

  // A deleted survey in its bin: its attachments are rows in the payload's "attachments" array.
  for (;;) {
    const rows = await execute(
      `select b.id, b.organisation_id, b.payload->'attachments' as attachments from survey_bin b
        where exists (select 1 from jsonb_array_elements(coalesce(b.payload->'attachments', '[]'::jsonb)) e where jsonb_exists(e, 'data'))
        order by b.id limit ${BATCH}`,
    );
    if (!rows.length) break;
    for (const row of rows) {
      const attachments = (typeof row.attachments === 'string' ? JSON.parse(row.attachments) : row.attachments) as Record<string, unknown>[];
      const moved: Record<string, unknown>[] = [];
      for (const element of attachments) {
        if (!('data' in element)) {
          moved.push(element);
          continue;
        }
        const { data, ...rest } = element;
        const key = attachmentObjectKey(String(element.organisation_id ?? row.organisation_id), String(element.survey_id ?? row.id), String(element.id));
        const bytes = bytesOfJson(data);
        if (bytes) await (await store()).putObject(key, bytes, String(element.content_type));
        moved.push({ ...rest, object_key: key });
        counts.surveyBin++;
      }
      await execute(`update survey_bin set payload = jsonb_set(payload, '{attachments}', ?::jsonb) where id = ?`, [JSON.stringify(moved), row.id]);
    }
  }
  return counts;
}
