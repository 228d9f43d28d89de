import type { IncomingMessage, ServerResponse } from "node:http";
export function contentSecurityPolicy(o: { nonce: string; storageOrigin: string | null; dev: boolean }): string;
export const STATIC_HEADERS: Record<string, string>;
export function storageOriginOf(endpoint: string | undefined): string | null;
export function applySecurityHeaders(req: IncomingMessage, res: ServerResponse, o: { storageOrigin: string | null; dev: boolean }): void;
