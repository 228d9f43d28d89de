/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The local service launchers and their packages never belong in the app bundle.
  serverExternalPackages: ["pg", "s3rver", "smtp-server", "mailparser", "bcryptjs", "mediainfo.js"],
  outputFileTracingExcludes: { "*": [".data/**", ".test-data/**"] },
};
export default nextConfig;
