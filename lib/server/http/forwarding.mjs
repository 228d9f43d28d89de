/**
 * Without a trusted proxy in front, a client's own X-Forwarded-For (or
 * X-Real-IP) is a lie it can choose: drop it, so Next fills X-Forwarded-For
 * from the socket address.
 * @param {Record<string, string | string[] | undefined>} headers
 * @param {boolean} trustProxy
 */
export function dropUntrustedForwarding(headers, trustProxy) {
  if (trustProxy) return headers;
  delete headers["x-forwarded-for"];
  delete headers["x-real-ip"];
  return headers;
}
