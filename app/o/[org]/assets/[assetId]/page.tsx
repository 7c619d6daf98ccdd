import type { Metadata } from 'next';
import Link from 'next/link';
import { Disclosure } from '@/components/ui/disclosure';
import { notFound } from 'next/navigation';
import { getPageOrgContext } from '@/lib/server/page-context';
import { AppError } from '@/lib/server/errors';
import { allowed } from '@/lib/server/org-context';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { ALLOY_LABELS, ASSET_KIND_LABELS, HULL_MATERIAL_LABELS, STATUS_LABELS, STRUCTURE_TYPE_LABELS, WATER_TYPE_LABELS, eventWords } from '@/lib/labels';
import { fmt } from '@/lib/format';
import { FORECAST_DATE_LABELS, PARTICULAR_SOURCE_LABELS, RENEW_BY_DATE_WORDS } from '@/lib/labels';
import { Caution, PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { surveyCriteriaOf, waterSalinityOf } from '@/lib/register/protected-metal';
import { criteriaSubject } from '@/lib/surveys/criteria';
import { ButtonLink } from '@/components/ui/button';
import { ArchiveAssetButton } from '@/components/register/archive-asset-button';
import { ZoneForm } from '@/components/register/lazy-forms';
import { EditorDisclosure } from '@/components/register/asset-editors';
import { editorData } from '@/components/register/editor-data';
import { BrowserRegisterTable } from '@/components/register/lazy-register-table';
import { depletionChartHtml } from '@/components/register/depletion-chart';
import { ZonesTable } from '@/components/register/zones-table';
import { html } from '@/lib/figures/markup';
import { OutlookTag } from '@/components/planner/outlook-tag';
import { AssetDrawingPanel, DRAWING_LIST_ID } from '@/components/drawings/asset-drawing-panel';
import { StaticHtml } from '@/components/ui/static-html';
import { changesHtml, designsHtml, drawingListHtml, forecastTableHtml, particularsHtml, surveysHtml, zonesTableHtml } from '@/components/register/asset-page-markup';
import { keptWith } from '@/lib/server/kept-with';
import { estimatedFrameSpacingM } from '@/lib/drawings/hull-drawing';
import { assetFigures, figureDay, figureHref, type AssetPageData } from '@/lib/server/services/assets/asset-figures';

export const metadata: Metadata = { title: 'Asset' };

export default async function AssetPage({ params }: { params: Promise<{ org: string; assetId: string }> }) {
  const { org, assetId } = await params;
  const ctx = await getPageOrgContext(org);
  let page;
  try {
    // Drawn for the day (figureDay), as the figures' route draws them: their versions hold all day.
    page = await getAssetPage(ctx, assetId, figureDay());
  } catch (error) {
    if (error instanceof AppError && error.code === 'not-found') notFound();
    throw error;
  }
  const { asset, canWrite, zones, outlook, mixedAlloys, drawing } = page;
  const deskLink = allowed(ctx, 'design:write') && !asset.archivedAt;
  // Built once for each version of the page's data (getAssetPage keeps the page while its data stand).
  const view = keptWith(page, `view ${org} ${deskLink}`, () => pageView(page, org, deskLink));
  const { imageHrefs } = view;

  return (
    <>
      <PageHeader
        title={
          <span className="flex items-center gap-3">
            {asset.name}
            {asset.archivedAt ? <StatusTag tone="neutral">Archived</StatusTag> : outlook ? <span aria-label="Protection outlook"><OutlookTag outlook={outlook} /></span> : null}
          </span>
        }
        subtitle={
          <>
            <Link href={`/o/${org}`} className="text-tide-600 hover:underline">Fleet overview</Link> · {ASSET_KIND_LABELS[asset.kind]}
            {asset.kind === 'vessel' ? (asset.vesselType ? ` · ${asset.vesselType}` : '') : asset.structureType ? ` · ${STRUCTURE_TYPE_LABELS[asset.structureType]}` : ''}
          </>
        }
        actions={
          <>
            {allowed(ctx, 'survey:write') && !asset.archivedAt ? <ButtonLink href={`/o/${org}/surveys?assetId=${asset.id}`} variant="secondary">Record a survey</ButtonLink> : null}
            {allowed(ctx, 'asset:write') ? <ArchiveAssetButton org={org} assetId={asset.id} archived={Boolean(asset.archivedAt)} name={asset.name} /> : null}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-2">
          <Panel title="Particulars">
            <StaticHtml markup={view.particularsMarkup} />
            {canWrite ? <EditorDisclosure className="mt-3" summary="Edit particulars" kind="asset" data={view.editors.asset} /> : null}
          </Panel>
          <Panel title="Designs">
            <StaticHtml navigable markup={view.designsMarkup} />
          </Panel>
        </div>

        <Panel title={asset.kind === 'vessel' ? 'Drawing: where the anodes are' : 'Plan: anodes by pile'}>
          <AssetDrawingPanel result={drawing} imageHrefs={imageHrefs} listMarkup={view.drawingListMarkup} />
        </Panel>

        <Panel title="Zones">
          <ZonesTable org={org} assetId={asset.id} markup={view.zonesMarkup.value} zones={canWrite ? zones : null} />
          {canWrite ? (
            <Disclosure className="mt-3" summary="Add a zone">
              <div className="mt-3">
                <ZoneForm org={org} assetId={asset.id} />
              </div>
            </Disclosure>
          ) : null}
        </Panel>

        <Panel title="Installed anode groups">
          {mixedAlloys ? (
            <p role="note" className="mb-2 rounded-[3px] border border-state-soon/40 bg-state-soonbg px-2 py-1 text-sm text-ink" data-warning="mixed-alloys">
              <span className="font-semibold text-state-soon">Warning: </span>
              Anodes of {mixedAlloys.map((a) => ALLOY_LABELS[a] ?? a).join(' and ')} are fitted on this asset. Mixed alloys work at different potentials: the more active one is consumed protecting the other, and the forecast of both is off. Fit one alloy at the next renewal.
            </p>
          ) : null}
          <BrowserRegisterTable org={org} assetId={asset.id} pageSize={25} />
          {canWrite ? (
            <div className="mt-4 grid gap-4">
              <EditorDisclosure summary="Record a fitted group" kind="record-group" data={view.editors.recordGroup} />
              {view.editors.editGroup ? <EditorDisclosure summary="Edit a fitted group" kind="edit-group" data={view.editors.editGroup} /> : null}
              {view.editors.closeGroup ? <EditorDisclosure summary="Close a group (removed, lost or renewed)" kind="close-group" data={view.editors.closeGroup} /> : null}
            </div>
          ) : null}
          {view.changesMarkup ? <StaticHtml markup={view.changesMarkup} /> : null}
        </Panel>

        <Panel title="Depletion forecast">
          <StaticHtml markup={view.forecastMarkup} />
        </Panel>

        <Panel title="Surveys">
          <StaticHtml navigable markup={view.surveysMarkup} />
        </Panel>
        <Caution />
      </div>
    </>
  );
}

/** What the page derives from its data: the static parts' markup and the forms' choices (kept with the page). */
function pageView(page: AssetPageData, org: string, deskLink: boolean) {
  const { asset, canWrite, zones, designs, surveys, forecasts, rows, renewalRule, marginWords, catalogue, changes, series, drawing } = page;
  const salinity = waterSalinityOf(asset);
  const surveyParticulars: [string, string | null | undefined][] = [
    ['Water salinity', salinity === null ? 'not recorded' : `${salinity} PSU${asset.waterSalinityPsu === null || asset.waterSalinityPsu === undefined ? ' (seawater, assumed)' : ''}`],
    ['Survey criteria for', criteriaSubject(surveyCriteriaOf(asset))],
  ];
  const particulars: [string, string | null | undefined][] =
    asset.kind === 'vessel'
      ? [
          ['Type', asset.vesselType],
          ['IMO number', asset.imoNumber],
          ['Lpp × B × T', asset.lengthBppM ? `${asset.lengthBppM} × ${asset.beamM ?? '?'} × ${asset.draughtM ?? '?'} m` : null],
          ['Block coefficient', asset.blockCoefficient?.toString()],
          [
            'Frame spacing',
            asset.frameSpacingM
              ? `${asset.frameSpacingM} m${asset.frameSpacingSource === 'estimate' ? ` (${PARTICULAR_SOURCE_LABELS.estimate})` : ''}`
              : // Not entered: the drawing uses the estimate, so the particulars say it too, with where it came from.
                asset.lengthBppM
                ? `${estimatedFrameSpacingM(asset.lengthBppM)} m (${PARTICULAR_SOURCE_LABELS.estimate} from the length, 0.002 L + 0.48 m, common practice)`
                : null,
          ],
          ['Hull material', asset.hullMaterial ? HULL_MATERIAL_LABELS[asset.hullMaterial] : null],
          ['Impressed current', asset.hasImpressedCurrent ? 'fitted' : 'none'],
          ['Trading waters', asset.tradingWaters],
        ]
      : [
          ['Structure', asset.structureType ? STRUCTURE_TYPE_LABELS[asset.structureType] : null],
          ['Location', asset.location],
          ['Water', asset.waterType ? WATER_TYPE_LABELS[asset.waterType] : null],
          ['Piles', asset.pileCount ? `${asset.pileCount} × Ø ${asset.pileDiameterM ?? '?'} m` : null],
          ['Pile grid', asset.pileRows && asset.pileBents ? `${asset.pileRows} rows × ${asset.pileBents} bents${asset.pileGridSource === 'estimate' ? ` (${PARTICULAR_SOURCE_LABELS.estimate})` : ''}` : null],
          ['Design life', asset.designLifeYears ? `${asset.designLifeYears} years` : null],
        ];
  particulars.push(...surveyParticulars);
  const formValues = Object.fromEntries(
    Object.entries(asset)
      .filter(([, v]) => v !== null && v !== undefined && typeof v !== 'object')
      .map(([k, v]) => [k, typeof v === 'boolean' ? (v ? 'on' : '') : String(v)]),
  );
  const activeGroups = forecasts.map((f) => f.group);
  const modelChoices = catalogue.map((m) => ({ key: m.key, label: `${m.designation} (${ALLOY_LABELS[m.alloy]}, ${fmt(m.netMassKg, 1)} kg net)` }));
  const zoneChoices = zones.map((z) => ({ id: z.id, name: z.name }));
  // The drawing's views and the chart are images of their own addresses (with their versions): kept by the
  // browser until they change, so the page carries only the links and marks over them.
  const figures = assetFigures(page);
  const imageHrefs = Object.fromEntries(figures.views.map((v) => [v.name, figureHref(org, asset.id, v.name, v.version)]));
  const forecastMarkup = html`${depletionChartHtml({ series, figure: figures.chart, src: figures.chart ? figureHref(org, asset.id, 'chart', figures.chart.version) : '', dockingsWord: eventWords(asset.kind).events })}${forecastTableHtml(rows)}${
    !rows.length && !asset.archivedAt ? html`<p class="mt-2 text-sm text-ink-soft">No anodes recorded: record the fitted groups above so their renewals can be forecast and proposed.</p>` : null
  }<p class="mt-2 text-sm text-ink-soft">${marginWords}</p><p class="mt-1 text-xs text-ink-soft">${renewalRule}</p><p class="mt-1 text-xs text-ink-faint">${FORECAST_DATE_LABELS.endOfLife}: the utilisation factor used up, shown for reference; renewals are scheduled on ${RENEW_BY_DATE_WORDS}. Consumption = I × 8760 / ε per year (handbook practice) at the forecast’s start. A group linked to a design follows its zone’s demand as the coating breaks down, averaging the group’s share of the design’s mean current; one without a design runs on its mean current. Surveys scale the demand; a survey showing no loss leaves it as designed.</p>`;
  const groupForm = { org, assetId: asset.id, assetKind: asset.kind, zones: zoneChoices, models: modelChoices };
  return {
    editors: {
      asset: editorData('asset', { org, asset: { id: asset.id, kind: asset.kind, values: formValues } }),
      recordGroup: editorData('record-group', { ...groupForm, designs: designs.map((d) => ({ id: d.id, label: `Rev. ${d.revision} (${STATUS_LABELS[d.status]})` })) }),
      editGroup: activeGroups.length
        ? editorData('edit-group', {
            ...groupForm,
            designs: [],
            groups: activeGroups.map((g) => ({ id: g.id, label: g.label, zoneId: g.zone?.id ?? null, anodeModelKey: g.model.key, quantity: g.quantity, positions: g.positions ?? null, installedOn: g.installedOn, meanCurrentA: g.meanCurrentA ?? null, notes: g.notes ?? null })),
          })
        : null,
      closeGroup: activeGroups.length ? editorData('close-group', { org, groups: activeGroups.map((g) => ({ id: g.id, label: g.label })) }) : null,
    },
    imageHrefs,
    particularsMarkup: particularsHtml(particulars),
    zonesMarkup: zonesTableHtml(zones, canWrite),
    designsMarkup: designsHtml(org, designs, deskLink),
    drawingListMarkup: drawing.drawing ? drawingListHtml(drawing.drawing, DRAWING_LIST_ID) : null,
    changesMarkup: changes.length ? changesHtml(changes) : null,
    forecastMarkup,
    surveysMarkup: surveysHtml(org, surveys),
  };
}
