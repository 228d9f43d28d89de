/**
 * Serves the built app (or the dev server with --dev) on one host and port.
 * What it adds to `next start`: unless TRUST_PROXY is true, any
 * X-Forwarded-For a client sent is dropped, so Next fills it from the socket
 * and the sign-in throttle sees the real client address; and the security
 * headers (CSP with a per-request nonce, framing, sniffing, referrer,
 * permissions, opener) go on every response.
 *
 *   node lib/server/http/serve.mjs <host> <port> [--dev]
 */
import http from "node:http";
import next from "next";
import { dropUntrustedForwarding } from "./forwarding.mjs";
import { applySecurityHeaders, storageOriginOf } from "./security-headers.mjs";

const [host = "127.0.0.1", portText = "3000", mode] = process.argv.slice(2);
const port = Number(portText);
const trustProxy = ["1", "true", "yes", "on"].includes(String(process.env.TRUST_PROXY ?? "").toLowerCase());
const dev = mode === "--dev";
// The same default as lib/env.ts: the local S3 fake.
const storageOrigin = storageOriginOf(process.env.S3_PUBLIC_ENDPOINT ?? process.env.S3_ENDPOINT ?? "http://127.0.0.1:54330");
const app = next({ dev: mode === "--dev", hostname: host, port, dir: process.cwd() });
const handle = app.getRequestHandler();
await app.prepare();
const server = http.createServer((req, res) => {
  dropUntrustedForwarding(req.headers, trustProxy);
  applySecurityHeaders(req, res, { storageOrigin, dev });
  void handle(req, res);
});
if (mode === "--dev") server.on("upgrade", app.getUpgradeHandler());
server.listen(port, host, () => console.log(`> ready on http://${host}:${port}`));
for (const sig of ["SIGTERM", "SIGINT"]) process.on(sig, () => server.close(() => process.exit(0)));
