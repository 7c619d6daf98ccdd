import { classifyPotential, type ClassifyPotentialInput, type PotentialStatus } from '@/lib/surveys/criteria';
import { StatusTag, type StatusTone } from '@/components/ui/panel';
import { fmt } from '@/lib/format';

/** The colour cue of a reading's status, the same on every screen (over-protection has its own). */
export const POTENTIAL_STATUS_TONES: Readonly<Record<PotentialStatus, StatusTone>> = {
  'under-protected': 'overdue',
  protected: 'sound',
  'over-protected': 'over',
};

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
