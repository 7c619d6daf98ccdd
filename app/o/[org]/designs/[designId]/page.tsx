import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getPageOrgContext } from '@/lib/server/page-context';
import { AppError } from '@/lib/server/errors';
import { allowed } from '@/lib/server/org-context';
import { getDesignDesk, type DesignDesk as DesignDeskView } from '@/lib/server/services/designs/design-view';
import { assetKindWord, dockingKindWords, HULL_MATERIAL_LABELS, STATUS_LABELS, STRUCTURE_TYPE_LABELS, WATER_TYPE_LABELS } from '@/lib/labels';
import { PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { DESIGN_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { ButtonLink } from '@/components/ui/button';
import { DesignDesk } from '@/components/design-desk/design-desk';
import { SignatureBlock } from '@/components/design-desk/signature-block';
import { FitDesignForm } from '@/components/design-desk/fit-design-form';
import { listPlannedDockings } from '@/lib/server/services/planner/dockings';
import { proposeDesignPositions } from '@/lib/server/services/designs/fit-design';
import { formatDateOnly } from '@/lib/dates/date-only';
import type { DeskState } from '@/components/design-desk/desk-state';

export const metadata: Metadata = { title: 'Design desk' };

export default async function DesignPage({ params }: { params: Promise<{ org: string; designId: string }> }) {
  const { org, designId } = await params;
  const ctx = await getPageOrgContext(org);
  let view: DesignDeskView;
  try {
    view = await getDesignDesk(ctx, designId);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not-found') notFound();
    throw error;
  }
  // A signed revision comes back as stored, a draft recomputed (see shownRevision); the page computes nothing.
  const { design, record, computed, source, recomputeError, catalogue } = view;
  const approved = design.status === 'approved';
  const isPreparer = design.preparedBy.id === ctx.user.id;
  const editable = !approved && allowed(ctx, 'design:write');
  const asset = design.asset;
  const canFit = { install: allowed(ctx, 'asset:write'), book: allowed(ctx, 'renewal:write') };
  const dockings = approved && (canFit.install || canFit.book) ? await listPlannedDockings(ctx, asset.id) : [];
  const proposals = approved && canFit.install ? (await proposeDesignPositions(ctx, design.id)).map((p) => ({ zone: p.zone, text: p.text, basis: p.basis })) : [];
  const reason = approved
    ? 'This revision is approved and immutable. Make a new revision to change anything.'
    : isPreparer && allowed(ctx, 'design:approve')
      ? 'You prepared this revision: a second engineer checks and approves it.'
      : !allowed(ctx, 'design:write')
        ? 'Your role reads and prints designs; engineers prepare and approve them.'
        : null;
  return (
    <>
      <PageHeader
        title={
          <span className="flex items-center gap-3">
            {design.title}
            <StatusTag tone={toneOf(DESIGN_STATUS_TONES, design.status)}>{STATUS_LABELS[design.status]}</StatusTag>
          </span>
        }
        subtitle={
          <>
            <Link href={`/o/${org}/designs`} className="text-tide-600 hover:underline">Design desk</Link> · {asset.name} ({assetKindWord(asset.kind)}) · revision {design.revision}
            {design.basedOnRevision ? ` (from revision ${design.basedOnRevision})` : ''} · app {design.appVersion}
            {source === 'stored' ? ' · results as stored with this revision, not recomputed' : ''}
          </>
        }
        actions={
          <ButtonLink href={`/api/orgs/${org}/designs/${design.id}/note`} variant="secondary" prefetch={false} target="_blank">
            Print calculation note (PDF)
          </ButtonLink>
        }
      />
      <div className="mb-4 grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,1fr)_26rem]">
        <Panel title="Asset">
          <AssetSummary asset={asset} />
        </Panel>
        <Panel title="Revision block">
          <SignatureBlock
            org={org}
            designId={design.id}
            status={design.status}
            prepared={{ name: design.preparedBy.name, at: design.createdAt.toISOString() }}
            checked={design.checkedBy ? { name: design.checkedBy.name, at: design.checkedAt?.toISOString() ?? null } : null}
            approved={design.approvedBy ? { name: design.approvedBy.name, at: design.approvedAt?.toISOString() ?? null } : null}
            can={{ check: allowed(ctx, 'design:write') && !isPreparer, approve: allowed(ctx, 'design:approve') && !isPreparer, revise: allowed(ctx, 'design:write') }}
            reason={reason}
          />
        </Panel>
      </div>
      {approved && (canFit.install || canFit.book) ? (
        <div className="mb-4">
          <Panel title="Fit this design">
            <FitDesignForm
              org={org}
              designId={design.id}
              assetName={asset.name}
              dockings={dockings.map((d) => ({ value: d.id, label: `${dockingKindWords(d.kind)} from ${formatDateOnly(d.plannedStart)}${d.yard ? ` · ${d.yard}` : ''}` }))}
              can={canFit}
              proposals={proposals}
              assetKind={asset.kind}
            />
          </Panel>
        </div>
      ) : null}
      {recomputeError ? (
        <p role="alert" className="mb-4 rounded-[3px] border border-state-action/40 bg-state-actionbg px-3 py-2 text-sm text-state-action">
          This draft&apos;s stored inputs cannot be computed today: {recomputeError}
        </p>
      ) : null}
      <DesignDesk
        key={`${design.id}:${design.status}`}
        org={org}
        designId={design.id}
        initialTitle={design.title}
        initialInputs={record.inputs as DeskState}
        initialComputed={computed}
        catalogue={catalogue}
        editable={editable}
        storedModel={source === 'stored' ? { key: record.inputs.anodeModelKey, model: record.anodeModel } : undefined}
        vessel={asset.kind === 'vessel' ? { lengthBppM: asset.lengthBppM ?? null, beamM: asset.beamM ?? null, draughtM: asset.draughtM ?? null, blockCoefficient: asset.blockCoefficient ?? null } : null}
      />
    </>
  );
}

function AssetSummary({ asset }: { asset: DesignDeskView['design']['asset'] }) {
  const rows: [string, string | null | undefined][] =
    asset.kind === 'vessel'
      ? [
          ['Type', asset.vesselType],
          ['IMO', asset.imoNumber],
          ['Lpp × B × T', asset.lengthBppM ? `${asset.lengthBppM} × ${asset.beamM} × ${asset.draughtM} m` : null],
          ['Block coefficient', asset.blockCoefficient?.toString()],
          ['Hull', asset.hullMaterial ? HULL_MATERIAL_LABELS[asset.hullMaterial] : null],
          ['Impressed current', asset.hasImpressedCurrent ? 'fitted' : 'none'],
          ['Trading waters', asset.tradingWaters],
        ]
      : [
          ['Type', asset.structureType ? STRUCTURE_TYPE_LABELS[asset.structureType] : null],
          ['Location', asset.location],
          ['Water', asset.waterType ? WATER_TYPE_LABELS[asset.waterType] : null],
          ['Piles', asset.pileCount ? `${asset.pileCount} × Ø ${asset.pileDiameterM ?? '?'} m` : null],
          ['Design life', asset.designLifeYears ? `${asset.designLifeYears} years` : null],
        ];
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-4">
      {rows.map(([label, value]) => (
        <div key={label}>
          <dt className="text-2xs uppercase tracking-wide text-ink-faint">{label}</dt>
          <dd>{value ?? '—'}</dd>
        </div>
      ))}
    </dl>
  );
}
