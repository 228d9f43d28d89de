/**
 * Serves the service worker (app/sw.ts, bundled with esbuild by Serwist at
 * build time) and its source map. Public by design, like any static file:
 * it holds no data.
 */
import { createSerwistRoute } from "@serwist/turbopack";

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute({
  swSrc: "app/sw.ts",
  useNativeEsbuild: true,
  // Nothing is precached: what the workshop view needs is cached as it is first used.
  globPatterns: [],
});
