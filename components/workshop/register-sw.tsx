"use client";
/** Registers the service worker, so pages seen once open again without a signal. */
import { SerwistProvider } from "@serwist/turbopack/react";

export function ServiceWorker({ children }: { children: React.ReactNode }) {
  return (
    <SerwistProvider swUrl="/serwist/sw.js" disable={process.env.NODE_ENV !== "production"} reloadOnOnline={false}>
      {children}
    </SerwistProvider>
  );
}
