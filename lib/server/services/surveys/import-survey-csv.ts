import { AnodeGroupSchema } from '@/entities';
import { checkCsvBytes, parseSurveyCsv, type Electrode } from '@/lib/surveys/survey-csv';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getSurveyOrThrow } from './survey-access';
import { addReadings } from './record-readings';

export const MAX_CSV_BYTES = 5 * 1024 * 1024;

export class CsvRowsError extends AppError {
  constructor(readonly rows: { line: number; column?: string; message: string }[]) {
    super('invalid', `${rows.length >= 200 ? 'Many' : rows.length} row${rows.length === 1 ? '' : 's'} of the file need attention; nothing was imported.`, {
      csv: rows.map((r) => `Line ${r.line}${r.column ? `, ${r.column}` : ''}: ${r.message}`),
    });
  }
}

/** Imports a CSV of readings into a survey: every row is checked first, and nothing is written unless all are valid. */
export async function importSurveyCsv(ctx: OrgContext, surveyId: string, bytes: Uint8Array, { defaultElectrode }: { defaultElectrode?: Electrode } = {}) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const checked = checkCsvBytes(bytes, { maxBytes: MAX_CSV_BYTES });
  if (!checked.ok) throw new AppError(checked.code === 'too-large' ? 'payload-too-large' : checked.code === 'binary' || checked.code === 'encoding' ? 'unsupported' : 'invalid', checked.message);
  const labels = (await ctx.em.find(AnodeGroupSchema, { asset: survey.asset, removedOn: null }, { fields: ['label'] })).map((g) => g.label);
  const parsed = parseSurveyCsv(checked.text, { defaultElectrode, knownGroupLabels: labels });
  if (!parsed.ok) throw new CsvRowsError(parsed.errors);
  if (!parsed.rows.length) throw new AppError('invalid', 'The file has a header but no readings.');
  const { under } = await addReadings(ctx, survey, parsed.rows);
  audit(ctx, { action: 'survey.readings-imported', targetType: 'survey', targetId: survey.id, details: { rows: parsed.rows.length, underProtected: under } });
  ctx.effects.assetChanged(survey.asset.id);
  return { imported: parsed.rows.length, underProtected: under };
}
