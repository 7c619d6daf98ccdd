import type { Design } from '@/entities';

/** A design as plain data for pages and the JSON API (no entity internals). */
export function toDesignView(d: Design) {
  return {
    id: d.id,
    assetId: d.asset.id,
    assetName: d.asset.name ?? null,
    assetKind: d.asset.kind ?? null,
    revision: d.revision,
    title: d.title,
    status: d.status,
    inputs: d.inputs,
    results: d.results,
    resultError: d.resultError,
    basis: d.basis,
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
