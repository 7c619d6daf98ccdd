// The service worker (bundled by @serwist/turbopack's route, app/serwist/[path]/route.ts, served as /serwist/sw.js).
// What it keeps on the phone:
//  - the build's static files (scripts, styles, fonts, icons: the precache, replaced with each build);
//  - the survey pages of the organisations the member opened (/o/<org>/surveys and /o/<org>/surveys/<id>):
//    network first with a short timeout, the last good copy when there is no signal;
//  - the JSON lists the survey pages read (assets, anode groups, surveys), the same way.
// Nothing else is cached: every other page and API goes to the network as if there were no worker. The page
// clears these caches and the capture queue on sign-out (lib/offline/sign-out.ts).
// It also sends the capture queue on a Background Sync, for the member signed in on this phone.
import { CacheableResponsePlugin, ExpirationPlugin, NetworkFirst, Serwist, type PrecacheEntry, type SerwistPlugin } from 'serwist';
import { getSetting } from './capture-db';
import { CURRENT_USER_SETTING, OFFLINE_CACHE_NAMES } from './cache-names';
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
};

const SURVEY_PAGE = /^\/o\/[^/]+\/surveys(?:\/[0-9a-f-]{36})?\/?$/i;
const SURVEY_LISTS = /^\/api\/orgs\/[^/]+\/(?:assets|anode-groups|surveys)\/?$/i;
const WEEK_SECONDS = 7 * 24 * 60 * 60;

// A page answered by a redirect (to the sign-in page, when the session has ended) is not a copy of that page.
const notRedirected: SerwistPlugin = {
  cacheWillUpdate: async ({ response }) => (response.redirected || response.type === 'opaqueredirect' ? null : response),
};
const plugins = () => [notRedirected, new CacheableResponsePlugin({ statuses: [200] }), new ExpirationPlugin({ maxEntries: 60, maxAgeSeconds: WEEK_SECONDS })];

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
      handler: new NetworkFirst({ cacheName: OFFLINE_CACHE_NAMES.pages, networkTimeoutSeconds: 4, plugins: plugins(), matchOptions: { ignoreVary: true } }),
    },
    {
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.method === 'GET' && SURVEY_LISTS.test(url.pathname),
      handler: new NetworkFirst({ cacheName: OFFLINE_CACHE_NAMES.lists, networkTimeoutSeconds: 4, plugins: plugins() }),
    },
  ],
});
serwist.addEventListeners();

self.addEventListener('sync', (event) => {
  if (event.tag !== CAPTURE_SYNC_TAG) return;
  event.waitUntil(
    (async () => {
      const userId = await getSetting<string>(CURRENT_USER_SETTING);
      // Only the member signed in on this phone: their session is the one the requests carry.
      if (userId) await sendCaptureQueue(userId);
    })(),
  );
});
