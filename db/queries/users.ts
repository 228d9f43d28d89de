import "server-only";
import { eq, inArray } from "drizzle-orm";
import { db } from "../client";
import { users } from "../schema";

export async function getUserById({ id }: { id: string }) {
  const [row] = await db().select().from(users).where(eq(users.id, id)).limit(1);
  return row ?? null;
}

export async function getUserByEmail({ email }: { email: string }) {
  const [row] = await db().select().from(users).where(eq(users.email, email.toLowerCase())).limit(1);
  return row ?? null;
}

export async function setReadingRate({ id, readingRateWpm }: { id: string; readingRateWpm: number }) {
  await db().update(users).set({ readingRateWpm }).where(eq(users.id, id));
}

/** Reading rates of many people in one query (the board times every episode with its presenter's). */
export async function listReadingRatesByUserIds({ ids }: { ids: string[] }): Promise<Map<string, number>> {
  if (!ids.length) return new Map();
  const rows = await db().select({ id: users.id, wpm: users.readingRateWpm }).from(users).where(inArray(users.id, ids));
  return new Map(rows.map((r) => [r.id, r.wpm]));
}
