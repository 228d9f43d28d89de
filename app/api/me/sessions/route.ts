import { json, route, sessionUser } from "@/lib/server/api";
import { bumpSessionVersion } from "@/db/queries/auth";

/** Sign out everywhere: every session of this account, on every device, ends at its next request. */
export const DELETE = route(async (req) => {
  const user = await sessionUser(req);
  await bumpSessionVersion({ userId: user.id });
  return json({ ok: true });
});
