import { ZodError } from 'zod';
import type { Design } from '@/entities';
import { storedComputed, type DeskComputed } from '@/lib/design/desk-computed';
import type { DesignRecord } from '@/lib/schemas/design-record';
import { AppError } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { listCatalogue } from '../catalogue/anode-models';
import { computeDesk, toDeskComputed } from './compute-design';
import { getDesignOrThrow } from './get-design';
import { readDesignRecord } from './read-design-record';

/** A design as plain data for the JSON API: the stored record as it is, typed (no entity internals). */
export function toDesignView(d: Design) {
  const record = readDesignRecord(d);
  return {
    id: d.id,
    assetId: d.asset.id,
    assetName: d.asset.name ?? null,
    assetKind: d.asset.kind ?? null,
    revision: d.revision,
    title: d.title,
    status: d.status,
    schemaVersion: record.schemaVersion,
    inputs: record.inputs,
    anodeModel: record.anodeModel,
    results: record.results,
    resultError: record.resultError,
    basis: record.basis,
    appVersion: d.appVersion,
    preparedBy: d.preparedBy ? { id: d.preparedBy.id, name: d.preparedBy.name ?? null } : null,
    checkedBy: d.checkedBy ? { id: d.checkedBy.id, name: d.checkedBy.name ?? null } : null,
    checkedAt: d.checkedAt?.toISOString() ?? null,
    approvedBy: d.approvedBy ? { id: d.approvedBy.id, name: d.approvedBy.name ?? null } : null,
    approvedAt: d.approvedAt?.toISOString() ?? null,
    basedOnRevision: d.basedOnRevision,
    createdAt: d.createdAt.toISOString(),
    updatedAt: d.updatedAt.toISOString(),
  };
}
export type DesignView = ReturnType<typeof toDesignView>;

export interface ShownRevision {
  record: DesignRecord;
  /** Null when a draft's stored inputs can no longer be computed (recomputeError says why). */
  computed: DeskComputed | null;
  /** 'stored' for any signed revision (never recomputed); 'recomputed' for a draft. */
  source: 'stored' | 'recomputed';
  recomputeError: string | null;
}

/**
 * What a revision shows on screen and on paper. A checked or approved revision is its stored record and
 * nothing else, so screen and print agree with what was signed whatever the tables or catalogue say
 * today. A draft is recomputed from its stored inputs, as the desk would on the first keystroke.
 */
export async function shownRevision(ctx: OrgContext, design: Design): Promise<ShownRevision> {
  requirePermission(ctx, 'org:read');
  const record = readDesignRecord(design);
  if (design.status !== 'draft') return { record, computed: storedComputed(record), source: 'stored', recomputeError: null };
  try {
    const desk = await computeDesk(ctx, record.inputs, { hasImpressedCurrent: Boolean(design.asset.hasImpressedCurrent) });
    return { record, computed: toDeskComputed(desk), source: 'recomputed', recomputeError: null };
  } catch (error) {
    // The draft's model left the catalogue or an input is outside today's limits: the desk says so on first change.
    if (error instanceof AppError) return { record, computed: null, source: 'recomputed', recomputeError: error.message };
    if (error instanceof ZodError) return { record, computed: null, source: 'recomputed', recomputeError: error.issues.map((i) => i.message).join(' ') };
    throw error;
  }
}

/** Everything the design page shows: the revision, what it shows (see shownRevision) and the catalogue to choose from. */
export async function getDesignDesk(ctx: OrgContext, designId: string) {
  requirePermission(ctx, 'org:read');
  const design = await getDesignOrThrow(ctx, designId);
  const shown = await shownRevision(ctx, design);
  const catalogue = await listCatalogue(ctx, { includeArchived: true });
  return { design, ...shown, catalogue };
}
export type DesignDesk = Awaited<ReturnType<typeof getDesignDesk>>;
