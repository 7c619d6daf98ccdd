'use client';
import dynamic from 'next/dynamic';

/**
 * The register table as the asset page shows it: drawn in the browser only. Its rows come from the register API in
 * the browser anyway (paged, sorted and filtered there), so rendering its empty frame on the server only cost the
 * page (the asset page is benchmarked, npm run bench); its code loads with the page's first paint, not before it.
 */
export const BrowserRegisterTable = dynamic(() => import('./register-table').then((m) => m.RegisterTable), {
  ssr: false,
  loading: () => (
    <p className="rounded-[3px] border border-rule px-3 py-6 text-sm text-ink-faint" aria-busy="true">
      Loading the anode register…
    </p>
  ),
});
