import "server-only";
import { eq } from "drizzle-orm";
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
