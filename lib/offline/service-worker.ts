// The service worker (bundled by @serwist/turbopack's route, app/serwist/[path]/route.ts, served as /serwist/sw.js).
// What it keeps on the phone:
//  - the build's static files (scripts, styles, fonts, icons: the precache, replaced with each build), and a
//    copy of the build's /_next/static files kept across builds (a survey page kept from last week's build still
//    needs last week's scripts to start offline);
//  - the survey pages of the organisations the member opened (/o/<org>/surveys and /o/<org>/surveys/<id>):
//    network first with a short timeout, the last good copy when there is no signal;
//  - the survey lists the survey pages read, the same way.
// Pages and lists are kept per member (caches named with the member's id) and served only to the member named
// as signed in on this phone; a copy the server now answers with 401, 403, 404 or a redirect is dropped. Nothing
// else is cached: every other page and API goes to the network as if there were no worker. The page clears
// these caches and the capture queue on sign-out (lib/offline/sign-out.ts), and other members' caches whenever
// the signed-in member changes (components/offline/offline-support.tsx).
// It also sends the capture queue on a Background Sync, for the member signed in on this phone.
import { CacheExpiration, CacheFirst, CacheableResponsePlugin, ExpirationPlugin, NetworkFirst, Serwist, cacheNames, type PrecacheEntry, type RouteHandlerObject, type SerwistPlugin } from 'serwist';
import { getSetting } from './capture-db';
import { CURRENT_USER_SETTING, OFFLINE_CACHE_BASES, STATIC_CACHE_NAME, userCacheName } from './cache-names';
import { CAPTURE_SYNC_TAG, sendCaptureQueue } from './send-queue';

interface ExtendableEventLike extends Event {
  waitUntil(promise: Promise<unknown>): void;
}
interface SyncEventLike extends ExtendableEventLike {
  tag: string;
}
declare const self: {
  __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  addEventListener(type: 'sync', listener: (event: SyncEventLike) => void): void;
  addEventListener(type: 'install', listener: (event: ExtendableEventLike) => void): void;
};

const SURVEY_PAGE = /^\/o\/[^/]+\/surveys(?:\/[0-9a-f-]{36})?\/?$/i;
// Only the survey list: the fleet's assets and the register's groups are not the survey page's to keep.
const SURVEY_LISTS = /^\/api\/orgs\/[^/]+\/surveys\/?$/i;
const STATIC_FILE = /^\/_next\/static\//;
const WEEK_SECONDS = 7 * 24 * 60 * 60;
const STATIC_KEEP_SECONDS = 5 * WEEK_SECONDS;

// A page answered by a redirect (to the sign-in page, when the session has ended) is not a copy of that page.
const notRedirected: SerwistPlugin = {
  cacheWillUpdate: async ({ response }) => (response.redirected || response.type === 'opaqueredirect' ? null : response),
};
// The server no longer gives this member this page (session ended, role or membership gone, survey deleted):
// the copy kept earlier is dropped, so it cannot be opened offline afterwards either.
const dropRefused = (cacheName: string): SerwistPlugin => ({
  fetchDidSucceed: async ({ request, response }) => {
    if ([401, 403, 404].includes(response.status) || response.redirected || response.type === 'opaqueredirect') {
      await caches
        .open(cacheName)
        .then((cache) => cache.delete(request, { ignoreVary: true }))
        .catch(() => false);
    }
    return response;
  },
});
const plugins = (cacheName: string) => [dropRefused(cacheName), notRedirected, new CacheableResponsePlugin({ statuses: [200] }), new ExpirationPlugin({ maxEntries: 60, maxAgeSeconds: WEEK_SECONDS })];

/** Network first into the signed-in member's own cache; with nobody named as signed in, the network only. */
function perMember(base: string, options: { ignoreVary?: boolean }): RouteHandlerObject {
  const strategies = new Map<string, NetworkFirst>();
  return {
    async handle({ request, event }) {
      const userId = await getSetting<string | null>(CURRENT_USER_SETTING).catch(() => null);
      if (!userId) return fetch(request);
      const cacheName = userCacheName(base, userId);
      let strategy = strategies.get(cacheName);
      if (!strategy) {
        strategy = new NetworkFirst({ cacheName, networkTimeoutSeconds: 4, plugins: plugins(cacheName), ...(options.ignoreVary ? { matchOptions: { ignoreVary: true } } : {}) });
        strategies.set(cacheName, strategy);
      }
      return strategy.handle({ request, event });
    },
  };
}

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  // A new build's worker takes over at once; an open page is not claimed mid-way (a form being sent, a router
  // navigation under way): it is served by the worker from its next load. Offline reloads need no more.
  skipWaiting: true,
  clientsClaim: false,
  navigationPreload: false,
  runtimeCaching: [
    {
      // The page's HTML (not the router's RSC requests, which carry an RSC header and fall back to a page load).
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.method === 'GET' && !request.headers.has('RSC') && SURVEY_PAGE.test(url.pathname),
      // Only HTML is kept here, so the router's Vary headers need not split it.
      handler: perMember(OFFLINE_CACHE_BASES.pages, { ignoreVary: true }),
    },
    {
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.method === 'GET' && SURVEY_LISTS.test(url.pathname),
      handler: perMember(OFFLINE_CACHE_BASES.lists, {}),
    },
    {
      // An earlier build's script or style (the precache answers the current build's): from the copy kept across
      // builds, so a kept page of that build still starts offline.
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.method === 'GET' && STATIC_FILE.test(url.pathname),
      handler: new CacheFirst({ cacheName: STATIC_CACHE_NAME, plugins: [new CacheableResponsePlugin({ statuses: [200] }), new ExpirationPlugin({ maxEntries: 600, maxAgeSeconds: STATIC_KEEP_SECONDS })] }),
    },
  ],
});
serwist.addEventListeners();

// Before a new build's worker takes over (its activation deletes the precache entries the new build does not
// list), copy the precached /_next/static files into the cache kept across builds. Each is timed from its first
// copy, so an old build's files go some weeks after the pages that needed them.
self.addEventListener('install', (event) => {
  event.waitUntil(
    (async () => {
      const precache = await caches.open(cacheNames.precache);
      const kept = await caches.open(STATIC_CACHE_NAME);
      const expiration = new CacheExpiration(STATIC_CACHE_NAME, { maxEntries: 600, maxAgeSeconds: STATIC_KEEP_SECONDS });
      for (const request of await precache.keys()) {
        const url = new URL(request.url);
        if (!STATIC_FILE.test(url.pathname)) continue;
        url.searchParams.delete('__WB_REVISION__');
        if (await kept.match(url.href)) continue;
        const response = await precache.match(request);
        if (!response || !response.ok) continue;
        await kept.put(url.href, response);
        await expiration.updateTimestamp(url.href);
      }
      await expiration.expireEntries();
    })().catch(() => undefined),
  );
});

self.addEventListener('sync', (event) => {
  if (event.tag !== CAPTURE_SYNC_TAG) return;
  event.waitUntil(
    (async () => {
      const userId = await getSetting<string | null>(CURRENT_USER_SETTING);
      // Only the member signed in on this phone: their session is the one the requests carry (and the server
      // refuses items captured by anyone else).
      if (!userId) return;
      const outcome = await sendCaptureQueue(userId);
      // Rejecting asks the browser to fire the sync again later: something still waits.
      if (outcome.offline || outcome.waiting) throw new Error('Captured items still wait to be sent.');
    })(),
  );
});
