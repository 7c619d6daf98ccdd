import type { PotentialStatus, RemainingStatus } from '@/lib/surveys/criteria';
import { inSentence } from './text';

/** Words for surveys and readings (safe for client code). */
export const SURVEY_METHOD_LABELS: Record<string, string> = {
  diver: 'Diver',
  'drop-cell': 'Drop cell',
  rov: 'ROV',
  'dry-dock': 'In dry dock',
  other: 'Other',
};

/** "Diver survey", "ROV survey", "Survey in dry dock": a survey named by how it was made. */
export function surveyMethodWords(method: string): string {
  if (method === 'dry-dock') return 'Survey in dry dock';
  if (method === 'other') return 'Survey';
  return `${SURVEY_METHOD_LABELS[method] ?? 'Other'} survey`;
}

/** The reference electrodes a survey can use, in full (forms, e-mails). */
export const ELECTRODE_LABELS: Record<string, string> = {
  'ag-agcl-seawater': 'Ag/AgCl/seawater',
  cse: 'Cu/CuSO₄ (CSE)',
  sce: 'Saturated calomel (SCE)',
  zinc: 'Zinc',
};

/** The same, short, for a table column or after a potential: "−0.95 V vs Ag/AgCl". */
export const ELECTRODE_SHORT_LABELS: Record<string, string> = { 'ag-agcl-seawater': 'Ag/AgCl', cse: 'CSE', sce: 'SCE', zinc: 'Zn' };

export const POTENTIAL_STATUS_LABELS: Readonly<Record<PotentialStatus, string>> = {
  'under-protected': 'Under-protected',
  protected: 'Protected',
  'over-protected': 'Over-protected',
};

export const REMAINING_STATUS_LABELS: Readonly<Record<RemainingStatus, string>> = {
  sound: 'Sound',
  'renew-soon': 'Renew soon',
  renew: 'Renew',
};

/** The electrode inside a sentence: "against zinc", "against Ag/AgCl/seawater" (symbols keep their capitals). */
export function electrodeWords(electrode: string): string {
  return inSentence(ELECTRODE_LABELS[electrode] ?? 'an unnamed electrode');
}

/** The survey named inside a sentence: "the diver survey", "the ROV survey", "the survey in dry dock". */
export const surveyInSentence = (method: string): string => inSentence(surveyMethodWords(method));
