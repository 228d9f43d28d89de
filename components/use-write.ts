"use client";
/**
 * Every write from the browser is a TanStack mutation through fetchJson, so
 * failures are typed (ApiError), pending writes are visible to the query
 * client, and writes that share a scope run one after another, in the order
 * they were made (TanStack's mutation scopes). Reads are useQuery with
 * fetchJson. The only other ways out are the upload engine's part PUTs to
 * storage and the next-auth sign-in form.
 */
import { useCallback } from "react";
import { useMutation, type QueryKey, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "./fetch-json";

export type WriteMethod = "POST" | "PUT" | "PATCH" | "DELETE";
interface WriteRequest {
  url: string;
  method: WriteMethod;
  json?: unknown;
  /** A raw body (CSV text, say) with its own content type. */
  raw?: { body: BodyInit; contentType: string };
}

export function useWrite(opts: { scope?: string; invalidate?: QueryKey[] } = {}) {
  const qc = useQueryClient();
  const { scope, invalidate } = opts;
  const { mutateAsync } = useMutation({
    scope: scope ? { id: scope } : undefined,
    mutationFn: (r: WriteRequest) =>
      fetchJson(r.url, r.raw ? { method: r.method, body: r.raw.body, headers: { "content-type": r.raw.contentType } } : { method: r.method, json: r.json }),
    onSettled: () => Promise.all((invalidate ?? []).map((queryKey) => qc.invalidateQueries({ queryKey }))),
  });
  return useCallback(
    <T = any>(url: string, method: WriteMethod, json?: unknown, raw?: WriteRequest["raw"]): Promise<T> => mutateAsync({ url, method, json, raw }) as Promise<T>,
    [mutateAsync],
  );
}
