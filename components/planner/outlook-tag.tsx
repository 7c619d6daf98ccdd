import type { AssetOutlook } from '@/lib/forecast/outlook';
import { OUTLOOK_WORDS } from '@/lib/labels';
import { StatusTag } from '@/components/ui/status-tag';
import { OUTLOOK_TONES } from '@/lib/status/palette';

/** An asset's protection outlook as a tag, with the same words everywhere it is shown. */
export function OutlookTag({ outlook }: { outlook: AssetOutlook }) {
  return <StatusTag tone={OUTLOOK_TONES[outlook] ?? 'neutral'}>{OUTLOOK_WORDS[outlook] ?? outlook}</StatusTag>;
}
