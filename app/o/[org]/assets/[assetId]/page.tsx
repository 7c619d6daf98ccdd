import type { Metadata } from 'next';
import Link from 'next/link';
import { Disclosure } from '@/components/ui/disclosure';
import { notFound } from 'next/navigation';
import { format } from 'date-fns';
import { getPageOrgContext } from '@/lib/server/page-context';
import { AppError } from '@/lib/server/errors';
import { allowed } from '@/lib/server/org-context';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { ALLOY_LABELS, ASSET_KIND_LABELS, CLIMATE_LABELS, COATING_LABELS, DEPTH_BAND_LABELS, HULL_MATERIAL_LABELS, METAL_WORDS, STATUS_LABELS, STRUCTURE_TYPE_LABELS, WATER_TYPE_LABELS, ZONE_KIND_LABELS, eventWords, inSentence, surveyMethodWords } from '@/lib/labels';
import { fmt } from '@/lib/format';
import { formatDateOnly } from '@/lib/dates/date-only';
import { FORECAST_DATE_LABELS, PARTICULAR_SOURCE_LABELS, RENEW_BY_DATE_WORDS } from '@/lib/labels';
import { Caution, PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { DESIGN_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { surveyCriteriaOf, waterSalinityOf } from '@/lib/register/protected-metal';
import { criteriaSubject } from '@/lib/surveys/criteria';
import { ButtonLink } from '@/components/ui/button';
import { ArchiveAssetButton } from '@/components/register/archive-asset-button';
import { ArchiveZoneButton } from '@/components/register/archive-zone-button';
import { AnodeGroupForm, AssetForm, RemoveGroupForm, ZoneForm } from '@/components/register/lazy-forms';
import { RegisterTable } from '@/components/register/register-table';
import { DepletionChart } from '@/components/register/depletion-chart';
import { OutlookTag } from '@/components/planner/outlook-tag';
import { TableFrame } from '@/components/ui/table-frame';
import { AssetDrawingPanel } from '@/components/drawings/asset-drawing-panel';
import { StaticHtml } from '@/components/ui/static-html';
import { changesHtml, forecastTableHtml, particularsHtml } from '@/components/register/asset-page-markup';
import { estimatedFrameSpacingM } from '@/lib/drawings/hull-drawing';
import { assetFigures, figureDay, figureHref } from '@/lib/server/services/assets/asset-figures';

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
  const { asset, canWrite, zones, designs, surveys, forecasts, rows, renewalRule, marginWords, outlook, catalogue, changes, series, mixedAlloys, drawing } = page;
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
            <StaticHtml markup={particularsHtml(particulars)} />
            {canWrite ? (
              <Disclosure className="mt-3" summary="Edit particulars">
                <div className="mt-3">
                  <AssetForm org={org} asset={{ id: asset.id, kind: asset.kind, values: formValues }} />
                </div>
              </Disclosure>
            ) : null}
          </Panel>
          <Panel title="Designs">
            {designs.length ? (
              <ul className="divide-y divide-rule text-sm">
                {designs.map((d) => (
                  <li key={d.id} className="flex items-center justify-between gap-3 py-1.5">
                    <Link href={`/o/${org}/designs/${d.id}`} className="text-tide-600 hover:underline">
                      Rev. {d.revision}: {d.title}
                    </Link>
                    <span className="flex items-center gap-2 text-xs text-ink-soft">
                      {d.preparedBy.name}
                      <StatusTag tone={toneOf(DESIGN_STATUS_TONES, d.status)}>{STATUS_LABELS[d.status]}</StatusTag>
                    </span>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-sm text-ink-faint">No designs yet.</p>
            )}
            {allowed(ctx, 'design:write') && !asset.archivedAt ? (
              <Link href={`/o/${org}/designs`} className="mt-2 inline-block text-sm text-tide-600 underline">
                Open a new design on the design desk
              </Link>
            ) : null}
          </Panel>
        </div>

        <Panel title={asset.kind === 'vessel' ? 'Drawing: where the anodes are' : 'Plan: anodes by pile'}>
          <AssetDrawingPanel result={drawing} imageHrefs={imageHrefs} />
        </Panel>

        <Panel title="Zones">
          <TableFrame label="Zones">
          <table className="w-full text-sm" aria-label="Zones">
            <thead className="text-xs text-ink-soft">
              <tr className="border-b border-rule">
                <th className="py-1 text-left font-medium">Zone</th>
                <th className="py-1 text-left font-medium">Kind</th>
                <th className="py-1 text-right font-medium">Area m²</th>
                <th className="py-1 pl-3 text-left font-medium">Coating</th>
                <th className="py-1 text-left font-medium">Environment</th>
                <th className="py-1 text-left font-medium">Depth</th>
                <th><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {zones.map((z) => (
                <tr key={z.id} className="border-b border-rule align-top">
                  <td className="py-1.5">
                    {z.name}
                    {canWrite ? (
                      <Disclosure className="mt-1" summaryClassName="cursor-pointer text-xs text-tide-600" summary="Edit">
                        <div className="mt-2 rounded-[3px] border border-rule bg-paper p-3">
                          <ZoneForm org={org} assetId={asset.id} zone={{ id: z.id, name: z.name, kind: z.kind, areaM2: z.areaM2, coatingCategory: z.coatingCategory, coatingAgeYears: z.coatingAgeYears, waterType: z.waterType, climate: z.climate, depthBand: z.depthBand, drainsCurrent: z.drainsCurrent ?? null }} />
                        </div>
                      </Disclosure>
                    ) : null}
                  </td>
                  <td className="py-1.5">{ZONE_KIND_LABELS[z.kind] ?? 'Other'}</td>
                  <td className="num py-1.5">{fmt(z.areaM2, 1)}</td>
                  <td className="py-1.5 pl-3">
                    {COATING_LABELS[z.coatingCategory] ?? z.coatingCategory}
                    {z.coatingCategory !== 'bare' && z.coatingAgeYears ? `, ${z.coatingAgeYears} yr old` : ''}
                    {z.drainsCurrent ? ` · bare ${METAL_WORDS[z.drainsCurrent]}` : ''}
                  </td>
                  <td className="py-1.5">{WATER_TYPE_LABELS[z.waterType]}, {inSentence(CLIMATE_LABELS[z.climate] ?? '')}</td>
                  <td className="py-1.5">{DEPTH_BAND_LABELS[z.depthBand] ?? '–'}</td>
                  <td className="py-1.5 text-right">{canWrite ? <ArchiveZoneButton org={org} assetId={asset.id} zoneId={z.id} name={z.name} /> : null}</td>
                </tr>
              ))}
              {!zones.length ? (
                <tr>
                  <td colSpan={7} className="py-4 text-center text-ink-faint">No zones recorded.</td>
                </tr>
              ) : null}
            </tbody>
          </table>
          </TableFrame>
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
          <RegisterTable org={org} assetId={asset.id} pageSize={25} />
          {canWrite ? (
            <div className="mt-4 grid gap-4">
              <Disclosure summary="Record a fitted group">
                <div className="mt-3">
                  <AnodeGroupForm
                    org={org}
                    assetId={asset.id}
                    assetKind={asset.kind}
                    zones={zoneChoices}
                    models={modelChoices}
                    designs={designs.map((d) => ({ id: d.id, label: `Rev. ${d.revision} (${STATUS_LABELS[d.status]})` }))}
                  />
                </div>
              </Disclosure>
              {activeGroups.length ? (
                <Disclosure summary="Edit a fitted group">
                  <div className="mt-3">
                    <AnodeGroupForm
                      org={org}
                      assetId={asset.id}
                      assetKind={asset.kind}
                      zones={zoneChoices}
                      models={modelChoices}
                      designs={[]}
                      groups={activeGroups.map((g) => ({ id: g.id, label: g.label, zoneId: g.zone?.id ?? null, anodeModelKey: g.model.key, quantity: g.quantity, positions: g.positions ?? null, installedOn: g.installedOn, meanCurrentA: g.meanCurrentA ?? null, notes: g.notes ?? null }))}
                    />
                  </div>
                </Disclosure>
              ) : null}
              {activeGroups.length ? (
                <Disclosure summary="Close a group (removed, lost or renewed)">
                  <div className="mt-3">
                    <RemoveGroupForm org={org} groups={activeGroups.map((g) => ({ id: g.id, label: g.label }))} />
                  </div>
                </Disclosure>
              ) : null}
            </div>
          ) : null}
          {changes.length ? <StaticHtml markup={changesHtml(changes)} /> : null}
        </Panel>

        <Panel title="Depletion forecast">
          <DepletionChart series={series} figure={figures.chart} src={figures.chart ? figureHref(org, asset.id, 'chart', figures.chart.version) : ''} dockingsWord={eventWords(asset.kind).events} />
          <StaticHtml markup={forecastTableHtml(rows)} />
          {!rows.length && !asset.archivedAt ? <p className="mt-2 text-sm text-ink-soft">No anodes recorded: record the fitted groups above so their renewals can be forecast and proposed.</p> : null}
          <p className="mt-2 text-sm text-ink-soft">{marginWords}</p>
          <p className="mt-1 text-xs text-ink-soft">{renewalRule}</p>
          <p className="mt-1 text-xs text-ink-faint">
            {FORECAST_DATE_LABELS.endOfLife}: the utilisation factor used up, shown for reference; renewals are scheduled on {RENEW_BY_DATE_WORDS}. Consumption = I × 8760 / ε per year (handbook practice) at the forecast’s start. A group linked to a design follows its zone’s demand as the coating breaks down, averaging the group’s share of the design’s mean current; one without a design runs on its mean current. Surveys scale the demand; a survey showing no loss leaves it as designed.
          </p>
        </Panel>

        <Panel title="Surveys">
          {surveys.length ? (
            <ul className="divide-y divide-rule text-sm">
              {surveys.map((s) => (
                <li key={s.id} className="flex items-center justify-between py-1.5">
                  <Link href={`/o/${org}/surveys/${s.id}`} className="text-tide-600 hover:underline">
                    {formatDateOnly(s.surveyedOn)}: {surveyMethodWords(s.method)}{s.surveyor ? ` by ${s.surveyor}` : ''}
                  </Link>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-ink-faint">No surveys yet.</p>
          )}
        </Panel>
        <Caution />
      </div>
    </>
  );
}
