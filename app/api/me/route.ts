import { json } from "@/lib/server/http/api";
import { userRoute } from "@/lib/server/http/route-builder";
import { readingRateSchema } from "@/lib/schemas/script";
import { setReadingRate, getUserById } from "@/db/queries/users";

export const GET = userRoute({}, async ({ user }) => {
  const row = await getUserById({ id: user.id });
  return json({ user: { id: user.id, email: user.email, name: user.name, readingRateWpm: row?.readingRateWpm ?? 150 } });
});

/** Each person sets their own reading rate; scripts they present are timed with it. */
export const PATCH = userRoute({ body: readingRateSchema, what: "reading rate" }, async ({ user, body: { readingRateWpm } }) => {
  await setReadingRate({ id: user.id, readingRateWpm });
  return json({ user: { id: user.id, readingRateWpm } });
});
