import { classifyPotential } from '@/lib/surveys/criteria';
import { StatusTag } from '@/components/ui/panel';
import { fmt } from '@/lib/format';

/** A potential in volts against Ag/AgCl/seawater with its protection status in words and colour. */
export function PotentialTag({ valueV, metal }: { valueV: number; metal: 'steel' | 'aluminium' }) {
  const c = classifyPotential({ potentialAgAgClV: valueV, protectedMetal: metal });
  const tone = c.status === 'protected' ? 'sound' : c.status === 'under-protected' ? 'overdue' : 'under';
  return (
    <span className="inline-flex items-center gap-1.5" title={c.message}>
      <span className="num">{fmt(valueV, 3)} V</span>
      <StatusTag tone={tone}>{c.label}</StatusTag>
    </span>
  );
}
