'use client';
import { useEffect, useState } from 'react';
import { offlineCopyWords } from '@/lib/labels/capture';
import { usePathname } from 'next/navigation';
import { markSignedIn } from '@/lib/offline/sign-out';
import { SignedInMark } from './signed-in-mark';

const SW_URL = '/serwist/sw.js';
const SURVEY_PAGE = /^\/o\/[^/]+\/surveys(?:\/[0-9a-f-]{36})?\/?$/i;

/**
 * Registers the service worker (lib/offline/service-worker.ts) inside an organisation, names the member signed
 * in (only their capture queue is sent and their cached pages served; other members' cached pages are
 * deleted), and asks the worker to keep the survey page just opened and its organisation's survey list, so it opens again without signal; `data-offline-ready` on <html> says it has been kept.
 */
export function OfflineSupport({ userId, renderedAt }: { userId: string; renderedAt: string }) {
  const pathname = usePathname();
  // Without signal the page says how old it is: a copy kept on the phone can be hours or days behind the desk.
  // Read after hydration only (the server always renders it online).
  const [offline, setOffline] = useState(false);
  useEffect(() => {
    const update = () => setOffline(!navigator.onLine);
    update();
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  }, []);

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
      const list = new URL(window.location.href.replace(/(\/o\/[^/]+\/surveys)(?:\/.*)?$/, '$1')).href;
      const urlsToCache = [...new Set([window.location.href, list])];
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
      {offline ? (
        <p role="status" data-testid="offline-copy" className="no-print mb-4 rounded-[3px] border border-rule bg-paper px-4 py-2 text-sm text-ink">
          {offlineCopyWords(new Date(renderedAt), SURVEY_PAGE.test(pathname))}
        </p>
      ) : null}
    </>
  );
}
