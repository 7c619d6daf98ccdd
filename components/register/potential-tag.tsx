import { classifyPotential, type ClassifyPotentialInput, type PotentialStatus } from '@/lib/surveys/criteria';
import { StatusTag } from '@/components/ui/status-tag';
import { POTENTIAL_TONES } from '@/lib/status/palette';
import { fmt } from '@/lib/format';

/** The colour cue of a reading's status, the same on every screen (the one palette, lib/status/palette.ts). */
export const POTENTIAL_STATUS_TONES: typeof POTENTIAL_TONES = POTENTIAL_TONES;

type Criteria = Omit<ClassifyPotentialInput, 'potentialAgAgClV'>;

/** A potential in volts against Ag/AgCl/seawater with its protection status in words and colour, judged with the asset's criteria. */
export function PotentialTag({ valueV, criteria }: { valueV: number; criteria: Criteria }) {
  const c = classifyPotential({ potentialAgAgClV: valueV, ...criteria });
  return (
    <span className="inline-flex items-center gap-1.5" title={`${c.message} Criterion: ${c.criterion}.`}>
      <span className="num">{fmt(valueV, 3)} V</span>
      <StatusTag tone={POTENTIAL_STATUS_TONES[c.status]}>{c.label}</StatusTag>
    </span>
  );
}
