import { withSerwist } from "@serwist/turbopack";

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The local service launchers and their packages never belong in the app bundle.
  serverExternalPackages: ["pg", "s3rver", "smtp-server", "mailparser", "bcryptjs", "mediainfo.js"],
  outputFileTracingExcludes: { "*": [".data/**", ".test-data/**"] },
};
// The service worker (app/sw.ts) is bundled by Serwist and served from /serwist/sw.js.
export default withSerwist(nextConfig);
