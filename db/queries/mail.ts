import "server-only";
import { desc } from "drizzle-orm";
import { db } from "../client";
import { mailMessages } from "../schema";

export async function listMailMessages({ limit = 100 }: { limit?: number } = {}) {
  return db().select().from(mailMessages).orderBy(desc(mailMessages.receivedAt)).limit(limit);
}
