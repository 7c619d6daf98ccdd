import { AnodeGroupSchema, SurveyReadingSchema } from '@/entities';
import { checkCsvBytes, parseSurveyCsv, type Electrode, type ParsedReading } from '@/lib/surveys/survey-csv';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getSurveyOrThrow } from './survey-access';
import { addReadings, surveyElectrodeOf } from './record-readings';
import { lockSurvey, underProtectionWords } from './reading-alerts';

export const MAX_CSV_BYTES = 5 * 1024 * 1024;

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export class CsvRowsError extends AppError {
  constructor(
    readonly rows: { line: number; column?: string; message: string }[],
    readonly goodLines = 0,
  ) {
    super('invalid', `${rows.length >= 200 ? 'Many' : rows.length} row${rows.length === 1 ? '' : 's'} of the file need attention; nothing was imported.`, {
      csv: rows.map((r) => `Line ${r.line}${r.column ? `, ${r.column}` : ''}: ${r.message}`),
      // The upload form offers "Import the good lines only" when there are some.
      ...(goodLines ? { goodLines: [`The other ${plural(goodLines, 'line is', 'lines are')} valid and can be imported on their own.`] } : {}),
    });
  }
}

/** Two readings are the same when they are of the same survey, at the same place, with the same values. */
const sameReadingKey = (r: { location: string; potentialV: number | null; electrode: string | null; remainingFraction: number | null }) =>
  JSON.stringify([r.location.trim().toLowerCase(), r.potentialV, r.potentialV === null ? null : r.electrode, r.remainingFraction === null ? null : Math.round(r.remainingFraction * 1e6)]);

export interface ImportResult {
  imported: number;
  underProtected: number;
  /** Whether this import sent the under-protection message (false: none was needed, or one about this survey is open). */
  engineersMailed: boolean;
  /** Rows already in the survey (the same file uploaded again, or rows repeated), skipped. */
  duplicates: number;
  /** Lines with errors left out at the user's request ("good lines only"). */
  badLinesSkipped: number;
}

/**
 * Imports a CSV of readings into a survey. Every row is checked first: with any bad line nothing is
 * written, unless the user, having seen the errors, asks for the good lines only. Rows already in the
 * survey (same location and values; the survey fixes the date) are skipped and counted, so uploading the
 * same file twice adds nothing.
 */
export async function importSurveyCsv(ctx: OrgContext, surveyId: string, bytes: Uint8Array, { defaultElectrode, goodLinesOnly = false }: { defaultElectrode?: Electrode; goodLinesOnly?: boolean } = {}): Promise<ImportResult> {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const checked = checkCsvBytes(bytes, { maxBytes: MAX_CSV_BYTES });
  if (!checked.ok) throw new AppError(checked.code === 'too-large' ? 'payload-too-large' : checked.code === 'binary' || checked.code === 'encoding' ? 'unsupported' : 'invalid', checked.message);
  const labels = (await ctx.em.find(AnodeGroupSchema, { asset: survey.asset, removedOn: null }, { fields: ['label'] })).map((g) => g.label);
  const electrode = defaultElectrode ?? surveyElectrodeOf(survey);
  const parsed = parseSurveyCsv(checked.text, { defaultElectrode: electrode, knownGroupLabels: labels });
  let rows: ParsedReading[];
  let badLinesSkipped = 0;
  if (parsed.ok) rows = parsed.rows;
  else if (goodLinesOnly && parsed.goodRows.length) {
    rows = parsed.goodRows;
    badLinesSkipped = new Set(parsed.errors.map((e) => e.line)).size;
  } else throw new CsvRowsError(parsed.errors, parsed.goodRows.length);
  if (!rows.length) throw new AppError('invalid', 'The file has a header but no readings.');

  // Serialise imports into one survey, so two uploads of the same file cannot both find it new.
  await lockSurvey(ctx, survey);
  const existing = await ctx.em.find(SurveyReadingSchema, { survey }, { fields: ['location', 'potentialV', 'electrode', 'remainingFraction'] });
  const seen = new Set(existing.map((r) => sameReadingKey({ location: r.location, potentialV: r.potentialV ?? null, electrode: r.electrode ?? null, remainingFraction: r.remainingFraction ?? null })));
  const fresh = rows.filter((r) => {
    const key = sameReadingKey(r);
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
  const duplicates = rows.length - fresh.length;
  const { under, mailed } = fresh.length ? await addReadings(ctx, survey, fresh) : { under: 0, mailed: false };
  audit(ctx, {
    action: 'survey.readings-imported',
    targetType: 'survey',
    targetId: survey.id,
    details: { rows: fresh.length, underProtected: under, duplicatesSkipped: duplicates, badLinesSkipped },
  });
  if (fresh.length) ctx.effects.assetChanged(survey.asset.id);
  return { imported: fresh.length, underProtected: under, engineersMailed: mailed, duplicates, badLinesSkipped };
}

/** What the upload form tells the user after an import. */
export function importSummary(result: ImportResult): string {
  const parts = [result.imported ? `${plural(result.imported, 'reading')} imported` : 'No new readings imported'];
  if (result.underProtected) parts.push(`${result.underProtected} under-protected (${underProtectionWords({ under: result.underProtected, mailed: result.engineersMailed })})`);
  if (result.duplicates) parts.push(`${plural(result.duplicates, 'row was', 'rows were')} already in this survey and skipped`);
  if (result.badLinesSkipped) parts.push(`${plural(result.badLinesSkipped, 'line', 'lines')} with errors left out`);
  return `${parts.join('; ')}.`;
}
