import { createElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import type { ReactElement } from 'react';
import { CalculationNote, type CalculationNoteData } from '@/components/pdf/calculation-note';
import { registerPdfFonts } from '@/components/pdf/pdf-kit';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getDesignOrThrow } from './get-design';
import { shownRevision } from './design-view';
import { HULL_MATERIAL_LABELS, inSentence, STRUCTURE_TYPE_LABELS } from '@/lib/labels';
import { SurveySchema } from '@/entities';
import { loadGroupForecasts } from '../forecast/group-forecasts';
import { loadAssetDrawing } from '../assets/asset-drawing';
import { formatDateOnly, toDateOnly } from '@/lib/dates/date-only';

/**
 * Renders a design revision's calculation note as PDF bytes: a checked or approved revision from its
 * stored record only (the screen shows the same), a draft recomputed as its page shows it.
 */
export async function renderCalculationNote(ctx: OrgContext, designId: string): Promise<{ pdf: Buffer; filename: string }> {
  requirePermission(ctx, 'org:print');
  const design = await getDesignOrThrow(ctx, designId);
  const { record, computed, source, recomputeError } = await shownRevision(ctx, design);
  const asset = design.asset;
  const particulars: [string, string][] =
    asset.kind === 'vessel'
      ? [
          ['Vessel', `${asset.name}${asset.vesselType ? `, ${asset.vesselType}` : ''}${asset.imoNumber ? `, IMO ${asset.imoNumber}` : ''}`],
          ['Length between perpendiculars × beam × draught', asset.lengthBppM ? `${asset.lengthBppM} × ${asset.beamM} × ${asset.draughtM} m` : 'not given'],
          ['Block coefficient', asset.blockCoefficient?.toString() ?? 'not given'],
          ['Hull material', asset.hullMaterial ? (HULL_MATERIAL_LABELS[asset.hullMaterial] ?? 'not given') : 'not given'],
          ['Impressed-current system', asset.hasImpressedCurrent ? 'fitted' : 'none'],
        ]
      : [
          ['Structure', `${asset.name}${asset.structureType ? `, ${inSentence(STRUCTURE_TYPE_LABELS[asset.structureType] ?? '')}` : ''}`],
          ['Location', asset.location ?? 'not given'],
          ['Piles', asset.pileCount ? `${asset.pileCount} × Ø ${asset.pileDiameterM ?? '?'} m` : 'not given'],
        ];
  const data: CalculationNoteData = {
    organisation: ctx.organisation.name,
    asset: { name: asset.name, kind: asset.kind, particulars },
    design: { title: design.title, revision: design.revision, status: design.status, appVersion: design.appVersion, basedOnRevision: design.basedOnRevision ?? null },
    inputs: record.inputs,
    // A revision stored without a snapshot prints that it has none; no model is made up for it.
    model: computed ? computed.model : record.anodeModel,
    source,
    result: computed?.result ?? null,
    resultError: computed?.error ? `${computed.error.field}: ${computed.error.message}` : recomputeError,
    notices: computed?.notices ?? [],
    signatures: [
      { role: 'Prepared', name: design.preparedBy.name, at: design.createdAt },
      { role: 'Checked', name: design.checkedBy?.name ?? null, at: design.checkedAt ?? null },
      { role: 'Approved', name: design.approvedBy?.name ?? null, at: design.approvedAt ?? null },
    ],
    printedAt: new Date(),
    printedBy: ctx.user.name,
  };
  // The asset's drawing: the groups fitted from this revision, or every fitted group when none was, each filled to
  // what its forecast leaves today, with the latest survey's readings. A fixed number of statements.
  const today = new Date();
  const forecasts = await loadGroupForecasts(ctx, { assetIds: [asset.id] });
  const fromThis = forecasts.filter((f) => f.group.design?.id === design.id);
  const latestSurvey = await ctx.em.findOne(SurveySchema, { asset }, { orderBy: { surveyedOn: 'desc', createdAt: 'desc' } });
  const drawn = await loadAssetDrawing(ctx, asset, fromThis.length ? fromThis : forecasts, latestSurvey, today);
  const drawing = drawn.drawing
    ? {
        drawing: drawn.drawing,
        heading: `Where the anodes are: ${asset.name}`,
        subtitle: `${fromThis.length ? `The groups fitted from this revision` : forecasts.length ? 'The groups fitted on the asset (none from this revision yet)' : 'No groups fitted yet'}, each filled to what its forecast leaves on ${formatDateOnly(toDateOnly(today))}${latestSurvey ? `; readings of the survey of ${formatDateOnly(latestSurvey.surveyedOn)}` : ''}.`,
      }
    : null;
  registerPdfFonts();
  const pdf = await renderToBuffer(createElement(CalculationNote, { data, drawing }) as unknown as ReactElement<DocumentProps>);
  audit(ctx, { action: 'design.printed', targetType: 'design', targetId: design.id, details: { revision: design.revision } });
  const safeName = asset.name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '');
  return { pdf, filename: `calculation-note-${safeName}-rev${design.revision}.pdf` };
}
