// The service worker (bundled by Serwist's route, app/serwist/[path]/route.ts, served at
// /serwist/sw.js with scope /). What it keeps:
// - the build's hashed static files (precached at install, then cache first: a hash never changes);
// - the field pages (Scan, the pack's unit page, visit pages, the P-T chart), network first, so a
//   phone always gets the live page when there is signal and its last copy when there is none;
// - nothing from /api: answers there belong to one person and change; the site pack lives in
//   IndexedDB (lib/offline), not here.
// A unit's own address (/T/<code>, /tag/<code>, /equipment/<id>) that fails for want of signal is
// answered with the pack's unit page for it, and a visit page never kept here with the phone's copy
// of the visit (/offline/visit). The kept pages are wiped on sign-out (lib/offline/store).
import { CacheableResponsePlugin, CacheFirst, ExpirationPlugin, NetworkFirst, NetworkOnly, Serwist, type PrecacheEntry, type SerwistPlugin } from 'serwist';
import { isFieldPage, offlineUnitTarget, offlineVisitTarget, pageCacheKey, PAGES_CACHE, VISIT_PAGE } from '@/lib/offline/cache-names';

declare const self: { __SW_MANIFEST: (PrecacheEntry | string)[] | undefined; location: Location };

/** Pages whose query only the browser reads (the phone's unit and visit pages, a visit page): one copy each. */
const onePageCopy: SerwistPlugin = {
  cacheKeyWillBeUsed: async ({ request }) => pageCacheKey(new URL(request.url)) ?? request,
};

const pages = new NetworkFirst({
  cacheName: PAGES_CACHE,
  // A weak roof signal: after a while the kept copy is better than a spinner.
  networkTimeoutSeconds: 8,
  // Next varies pages on its router headers; a navigation never sends them.
  matchOptions: { ignoreVary: true },
  // Only a page itself is kept: never a redirect to sign-in (status 0 to a worker) or an error page.
  plugins: [onePageCopy, new CacheableResponsePlugin({ statuses: [200] }), new ExpirationPlugin({ maxEntries: 40, maxAgeSeconds: 30 * 24 * 3600 })],
});

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  precacheOptions: { cleanupOutdatedCaches: true },
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    { matcher: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/api/'), handler: new NetworkOnly() },
    {
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.mode === 'navigate' && offlineUnitTarget(url.pathname) !== null,
      handler: async ({ request, url }) => {
        try {
          return await fetch(request);
        } catch {
          return Response.redirect(new URL(offlineUnitTarget(url.pathname)!, url.origin).href, 302);
        }
      },
    },
    {
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.mode === 'navigate' && VISIT_PAGE.test(url.pathname),
      handler: async (options) => {
        try {
          return await pages.handle(options);
        } catch {
          // Neither the network nor a kept copy: the phone's own copy of the visit.
          return Response.redirect(new URL(offlineVisitTarget(options.url)!, options.url.origin).href, 302);
        }
      },
    },
    { matcher: ({ request, url, sameOrigin }) => sameOrigin && request.mode === 'navigate' && isFieldPage(url.pathname), handler: pages },
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && (url.pathname.startsWith('/_next/static/') || url.pathname.startsWith('/icons/')),
      handler: new CacheFirst({ cacheName: 'rimeline-static', plugins: [new CacheableResponsePlugin({ statuses: [200] }), new ExpirationPlugin({ maxEntries: 400 })] }),
    },
  ],
});

serwist.addEventListeners();
