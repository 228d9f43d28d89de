/// <reference lib="webworker" />
/**
 * The service worker (Serwist): the app's static files are precached and
 * pages are kept as they were last seen, so the workshop view opens without
 * a signal. Notes written offline wait in IndexedDB in the page itself
 * (components/workshop/note-queue.ts), not here.
 */
import { CacheFirst, ExpirationPlugin, NetworkFirst, Serwist, type PrecacheEntry, type SerwistGlobalConfig } from "serwist";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  // No navigation preload: with it, a navigation without a signal could fail on the
  // preload's network error in Chromium before the kept copy of the page was used.
  navigationPreload: false,
  // The API is never cached here (the live stream never ends, and notes have their own queue);
  // pages are fresh when there is a signal and as last seen when there is none.
  runtimeCaching: [
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith("/_next/static/"),
      handler: new CacheFirst({ cacheName: "static", plugins: [new ExpirationPlugin({ maxEntries: 300, maxAgeSeconds: 30 * 24 * 3600 })] }),
    },
    {
      matcher: ({ request, sameOrigin, url }) => sameOrigin && request.mode === "navigate" && !url.pathname.startsWith("/api/"),
      handler: new NetworkFirst({ cacheName: "pages", networkTimeoutSeconds: 4, plugins: [new ExpirationPlugin({ maxEntries: 50 })] }),
    },
  ],
});

serwist.addEventListeners();
