import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { readingRateSchema } from "@/lib/schemas/script";
import { setReadingRate, getUserById } from "@/db/queries/users";

export const GET = route(async (req) => {
  const user = await sessionUser(req);
  const row = await getUserById({ id: user.id });
  return json({ user: { id: user.id, email: user.email, name: user.name, readingRateWpm: row?.readingRateWpm ?? 150 } });
});

/** Each person sets their own reading rate; scripts they present are timed with it. */
export const PATCH = route(async (req) => {
  const { readingRateWpm } = await parseBody(req, readingRateSchema, "reading rate");
  const user = await sessionUser(req);
  await setReadingRate({ id: user.id, readingRateWpm });
  return json({ user: { id: user.id, readingRateWpm } });
});
