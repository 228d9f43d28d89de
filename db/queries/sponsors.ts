import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "../client";
import { sponsors } from "../schema";

export async function listSponsorsByChannel({ channelId }: { channelId: string }) {
  return db()
    .select()
    .from(sponsors)
    .where(and(eq(sponsors.channelId, channelId), isNull(sponsors.archivedAt)))
    .orderBy(asc(sponsors.name));
}
