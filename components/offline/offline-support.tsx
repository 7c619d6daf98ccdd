'use client';
import { useEffect, useRef, useState } from 'react';
import { offlineCopyWords } from '@/lib/labels/capture';
import { usePathname, useRouter } from 'next/navigation';
import { markSignedIn } from '@/lib/offline/sign-out';
import { SignedInMark } from './signed-in-mark';

const SW_URL = '/serwist/sw.js';
/** Older than this when the page starts, what it shows came from the worker's kept copy, not from the server just now. */
const COPY_AGE_MS = 5 * 60_000;
const SURVEY_PAGE = /^\/o\/[^/]+\/surveys(?:\/[0-9a-f-]{36})?\/?$/i;

/**
 * Registers the service worker (lib/offline/service-worker.ts) inside an organisation, names the member signed
 * in (only their capture queue is sent and their cached pages served; other members' cached pages are
 * deleted), and asks the worker to keep the survey page just opened and its organisation's survey list, so it opens again without signal; `data-offline-ready` on <html> says it has been kept.
 */
export function OfflineSupport({ userId, renderedAt }: { userId: string; renderedAt: string }) {
  const pathname = usePathname();
  const router = useRouter();
  // Without signal, or when the server did not answer and the worker served the copy it kept, the page says how
  // old what it shows is: a kept copy can be hours or days behind the desk. Read after hydration only.
  const [offline, setOffline] = useState(false);
  const [servedFromCopy, setServedFromCopy] = useState(false);
  const [shownSince, setShownSince] = useState(() => new Date(renderedAt));
  const [capturing, setCapturing] = useState(false);
  const stale = useRef({ offline, servedFromCopy });
  stale.current = { offline, servedFromCopy };
  const firstPage = useRef(true);
  useEffect(() => {
    setCapturing(Boolean(document.querySelector('[data-capture-panel]')));
    if (firstPage.current) {
      firstPage.current = false;
      return;
    }
    // The layout is not rendered again on an in-app link: a page reached while online is as fresh as that moment.
    if (navigator.onLine) {
      setShownSince(new Date());
      setServedFromCopy(false);
    }
  }, [pathname]);
  useEffect(() => {
    const made = new Date(renderedAt).getTime();
    // Made by the server well before this load: the worker answered with its copy (no answer in time).
    setServedFromCopy(Date.now() - made > COPY_AGE_MS);
    setShownSince(new Date(made));
    setOffline(!navigator.onLine);
    const update = () => {
      // The signal is back while the page still shows an old copy: ask the server for it again.
      if (navigator.onLine && (stale.current.offline || stale.current.servedFromCopy)) router.refresh();
      setOffline(!navigator.onLine);
    };
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  }, [renderedAt, router]);

  useEffect(() => {
    if (!('serviceWorker' in navigator)) return;
    void navigator.serviceWorker.register(SW_URL, { scope: '/', type: 'module' }).catch((error) => console.warn('[tidewarden] the offline worker could not start', error));
  }, []);

  useEffect(() => {
    if (!('serviceWorker' in navigator) || !SURVEY_PAGE.test(pathname)) return;
    const root = document.documentElement;
    root.removeAttribute('data-offline-ready');
    let live = true;
    void (async () => {
      if (!navigator.onLine) return;
      // The page is kept in the signed-in member's cache: name them before asking.
      await markSignedIn(userId);
      const registration = await navigator.serviceWorker.ready;
      const worker = registration.active;
      if (!worker || !live) return;
      const channel = new MessageChannel();
      const kept = new Promise<void>((resolve) => (channel.port1.onmessage = () => resolve()));
      // With the survey list of the organisation, so the way back to it opens offline too (a list first opened
      // before the worker was running was not kept).
      const list = new URL(window.location.href.replace(/(\/o\/[^/]+\/surveys)(?:[/?#].*)?$/, '$1'));
      // The list's first page of data as its table asks for it (components/ui/server-table.tsx), or the kept list
      // would open offline empty.
      const listData = new URL(`/api/orgs/${list.pathname.split('/')[2]}/surveys?page=1&pageSize=50`, window.location.origin);
      const urlsToCache = [...new Set([window.location.href, list.href, listData.href])];
      worker.postMessage({ type: 'CACHE_URLS', payload: { urlsToCache } }, [channel.port2]);
      await kept;
      if (live) root.setAttribute('data-offline-ready', 'true');
    })();
    return () => {
      live = false;
    };
  }, [pathname, userId]);

  return (
    <>
      <SignedInMark userId={userId} />
      {offline || servedFromCopy ? (
        <p role="status" data-testid="offline-copy" className="no-print mb-4 rounded-[3px] border border-rule bg-paper px-4 py-2 text-sm text-ink">
          {offlineCopyWords(shownSince, { offline, capturing })}
        </p>
      ) : null}
    </>
  );
}
