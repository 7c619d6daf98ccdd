import { SafeHtml } from '@/lib/figures/markup';

/**
 * Static markup built with `html` (lib/figures/markup.ts), in a wrapper that takes no box of its own (display:
 * contents), so its children lay out as if they stood in the parent. Never hydrated: for parts with nothing to
 * click but links and nothing that changes in the page.
 */
export function StaticHtml({ markup }: { markup: SafeHtml }) {
  if (!(markup instanceof SafeHtml)) throw new TypeError('StaticHtml takes markup built by html only.');
  return <div className="contents" dangerouslySetInnerHTML={{ __html: markup.value }} />;
}
