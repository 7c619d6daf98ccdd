import { SafeHtml, html } from '@/lib/figures/markup';
import { TONE_SPECS, type StatusTone } from '@/lib/status/palette';
import { SHAPE_MARKUP, STATUS_TAG_CLASSES } from '@/lib/status/shape-markup';

/**
 * StatusTag as static markup (for the static parts of a page, StaticHtml): the same word, shape and colour, the same
 * markup. A file of its own so the client components that draw StatusTag do not carry the html builder.
 */
export function statusTagHtml(tone: StatusTone, words: string): SafeHtml {
  const spec = TONE_SPECS[tone] ?? TONE_SPECS.neutral;
  return html`<span data-tone="${tone}" class="${STATUS_TAG_CLASSES} ${spec.classes}"><svg width="10" height="10" viewBox="0 0 10 10" aria-hidden="true" focusable="false" class="shrink-0" data-shape="${spec.shape}">${new SafeHtml(SHAPE_MARKUP[spec.shape] ?? SHAPE_MARKUP.dash)}</svg>${words}</span>`;
}
