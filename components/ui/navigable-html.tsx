'use client';
import { useRouter } from 'next/navigation';

/**
 * Static markup whose links to the app's pages open in the page, as next/link's do (no full reload), by one
 * listener on the wrapper: a plain click on a same-site page link. A modified click, a link with a target, a
 * download or an API address keeps the browser's own handling. Use through StaticHtml's `navigable`.
 */
export function NavigableHtml({ value }: { value: string }) {
  const router = useRouter();
  return (
    <div
      className="contents"
      onClick={(event) => {
        if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
        const link = event.target instanceof Element ? event.target.closest('a[href]') : null;
        if (!link || link.hasAttribute('target') || link.hasAttribute('download')) return;
        const href = link.getAttribute('href') ?? '';
        if (!href.startsWith('/') || href.startsWith('//') || href.startsWith('/api/')) return;
        event.preventDefault();
        router.push(href);
      }}
      dangerouslySetInnerHTML={{ __html: value }}
    />
  );
}
