'use client';
import { useMemo } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper } from '@tanstack/react-table';
import { DataTable } from '@/components/ui/data-table';
import { Button } from '@/components/ui/button';
import { useBoundAction } from '@/components/ui/action-form';
import { StatusTag } from '@/components/ui/panel';
import { fetchJson, queryKeys } from '@/lib/client/query-client';
import { ALLOY_LABELS, MOUNTING_LABELS } from '@/lib/labels';
import { fmt } from '@/lib/format';
import type { CatalogueModel } from '@/lib/server/services/catalogue/anode-models';
import { archiveAnodeModelAction } from '@/app/o/[org]/catalogue/actions';
import { announce, undoBy } from '@/components/ui/toast';
import type { ActionState } from '@/lib/server/action';

function dimensions(m: CatalogueModel) {
  const d = m.dimensions;
  const mm = (x?: number) => (x ? Math.round(x * 1000) : null);
  if (d.radiusM) return `${mm(d.lengthM)} long, r ${mm(d.radiusM)} mm`;
  if (d.innerDiameterM) return `Ø ${mm(d.innerDiameterM)} inside, ${mm(d.lengthM)} long`;
  return [mm(d.lengthM), mm(d.widthM), mm(d.thicknessM)].filter(Boolean).join(' × ') + ' mm';
}

function ArchiveButton({ org, model }: { org: string; model: CatalogueModel }) {
  const client = useQueryClient();
  // Archiving says so in the page's notice, with an Undo (the same action, restoring); restoring needs none.
  const archiveWithUndo = async (prev: ActionState, formData: FormData): Promise<ActionState> => {
    const answer = await archiveAnodeModelAction(org, prev, formData);
    if (!answer.ok || formData.get('archive') !== '1') return answer;
    announce({
      ok: true,
      message: answer.message ?? `${model.designation} archived.`,
      undo: {
        label: `Undo: restore ${model.designation}`,
        run: undoBy(archiveAnodeModelAction.bind(null, org), { modelId: model.id, archive: '0' }, () => client.invalidateQueries({ queryKey: queryKeys.catalogue(org) })),
      },
    });
    return answer;
  };
  const { action, pending } = useBoundAction(archiveWithUndo, { invalidate: [queryKeys.catalogue(org)] });
  return (
    <form action={action}>
      <input type="hidden" name="modelId" value={model.id} />
      <input type="hidden" name="archive" value={model.archived ? '0' : '1'} />
      <Button type="submit" variant="ghost" className="text-xs" disabled={pending}>
        {model.archived ? 'Restore' : 'Archive'}
        <span className="sr-only"> {model.designation}</span>
      </Button>
    </form>
  );
}

export function CatalogueTable({ org, initial, canWrite }: { org: string; initial: CatalogueModel[]; canWrite: boolean }) {
  const query = useQuery({ queryKey: queryKeys.catalogue(org), queryFn: async () => (await fetchJson<{ models: CatalogueModel[] }>(`/api/orgs/${org}/catalogue`)).models, initialData: initial });
  const columns = useMemo(() => {
    const col = createColumnHelper<CatalogueModel>();
    return [
      col.accessor('designation', { header: 'Designation', cell: (c) => <span className="font-medium">{c.getValue()}</span> }),
      col.accessor('source', { header: 'Source', cell: (c) => (c.row.original.archived ? <StatusTag tone="neutral">archived</StatusTag> : c.getValue()) }),
      col.accessor((m) => ALLOY_LABELS[m.alloy], { id: 'alloy', header: 'Alloy' }),
      col.accessor((m) => MOUNTING_LABELS[m.mounting], { id: 'mounting', header: 'Mounting' }),
      col.accessor((m) => m.shape.kind.replace(/-/g, ' '), { id: 'formula', header: 'Resistance formula' }),
      col.display({ id: 'dimensions', header: 'Dimensions', cell: (c) => dimensions(c.row.original) }),
      col.accessor('netMassKg', { header: 'Net kg', meta: { numeric: true }, cell: (c) => fmt(c.getValue(), 1) }),
      col.accessor('grossMassKg', { header: 'Gross kg', meta: { numeric: true }, cell: (c) => fmt(c.getValue(), 1) }),
      col.accessor('unitPrice', { header: 'Unit price', meta: { numeric: true }, cell: (c) => (c.getValue() === undefined ? '—' : fmt(c.getValue(), 2)) }),
      col.display({ id: 'actions', header: () => <span className="sr-only">Actions</span>, cell: (c) => (canWrite && c.row.original.source === 'organisation' ? <ArchiveButton org={org} model={c.row.original} /> : null) }),
    ];
  }, [org, canWrite]);
  return <DataTable label="Anode models" data={query.data ?? []} columns={columns} pageSize={50} filterPlaceholder="Filter by designation, alloy, mounting…" />;
}
