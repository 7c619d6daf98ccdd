/** The service worker's runtime caches (lib/offline/service-worker.ts); the page deletes them on sign-out. */
export const OFFLINE_CACHE_NAMES = { pages: 'tidewarden-survey-pages', lists: 'tidewarden-survey-lists' } as const;

/** The capture database's setting naming the member signed in on this phone (whose queue is sent). */
export const CURRENT_USER_SETTING = 'current-user';
