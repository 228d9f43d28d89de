/**
 * Security headers on every response, set by the serving process so they
 * hold for pages, API answers and static files alike.
 *
 * Scripts: only this app's, through a fresh nonce per request that Next puts
 * on its own script tags ('strict-dynamic' lets those load the chunks they
 * need); no inline script runs without it. Styles allow inline style
 * attributes, which React sets for drag transforms. Footage and photos load
 * from the S3 endpoint, and uploads PUT to it.
 */
import crypto from "node:crypto";

/** @param {{ nonce: string; storageOrigin: string | null; dev: boolean }} o */
export function contentSecurityPolicy({ nonce, storageOrigin, dev }) {
  const store = storageOrigin ? ` ${storageOrigin}` : "";
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' blob: data:${store}`,
    `media-src 'self' blob:${store}`,
    `connect-src 'self'${store}${dev ? " ws:" : ""}`,
    "worker-src 'self'",
    "manifest-src 'self'",
    "font-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

export const STATIC_HEADERS = {
  "X-Frame-Options": "DENY",
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "same-origin",
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()",
  "Cross-Origin-Opener-Policy": "same-origin",
};

/** The origin footage is served from, if S3_ENDPOINT names one. */
export function storageOriginOf(endpoint) {
  try {
    return endpoint ? new URL(endpoint).origin : null;
  } catch {
    return null;
  }
}

/**
 * Sets the headers on the response and hands Next the nonce through the
 * request's own CSP header, which is where it looks for it.
 * @param {import("node:http").IncomingMessage} req
 * @param {import("node:http").ServerResponse} res
 * @param {{ storageOrigin: string | null; dev: boolean }} o
 */
export function applySecurityHeaders(req, res, o) {
  const nonce = crypto.randomBytes(16).toString("base64");
  const csp = contentSecurityPolicy({ nonce, ...o });
  req.headers["content-security-policy"] = csp;
  res.setHeader("Content-Security-Policy", csp);
  for (const [k, v] of Object.entries(STATIC_HEADERS)) res.setHeader(k, v);
}
