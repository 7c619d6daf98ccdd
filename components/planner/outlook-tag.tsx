import type { AssetOutlook } from '@/lib/forecast/outlook';
import { OUTLOOK_WORDS } from '@/lib/labels';
import { StatusTag, type StatusTone } from '@/components/ui/panel';

/** The colour cue of each outlook; nothing recorded is neutral (no colour of its own). */
const OUTLOOK_TONES: Readonly<Record<AssetOutlook, StatusTone>> = {
  sound: 'sound',
  'no-anodes': 'neutral',
  'renew-at-next-docking': 'due',
  overdue: 'overdue',
  'over-protected': 'over',
  'under-protected': 'under',
};

/** An asset's protection outlook as a tag, with the same words everywhere it is shown. */
export function OutlookTag({ outlook }: { outlook: AssetOutlook }) {
  return <StatusTag tone={OUTLOOK_TONES[outlook] ?? 'neutral'}>{OUTLOOK_WORDS[outlook] ?? outlook}</StatusTag>;
}
