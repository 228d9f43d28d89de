import "server-only";
import crypto from "node:crypto";

/** A URL-safe single-use token; only its SHA-256 is stored. */
export function newToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return crypto.createHash("sha256").update(token).digest("hex");
}
