import { SafeHtml } from '@/lib/figures/markup';
import { NavigableHtml } from './navigable-html';

/**
 * Static markup built with `html` (lib/figures/markup.ts), in a wrapper that takes no box of its own (display:
 * contents), so its children lay out as if they stood in the parent. Never hydrated: for parts with nothing to
 * click but links and nothing that changes in the page. `navigable`: its links to the app's pages open in the page
 * (NavigableHtml), as next/link's do.
 */
export function StaticHtml({ markup, navigable = false }: { markup: SafeHtml; navigable?: boolean }) {
  if (!(markup instanceof SafeHtml)) throw new TypeError('StaticHtml takes markup built by html only.');
  if (navigable) return <NavigableHtml value={markup.value} />;
  return <div className="contents" dangerouslySetInnerHTML={{ __html: markup.value }} />;
}
