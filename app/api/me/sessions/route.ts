import { json } from "@/lib/server/http/api";
import { userRoute } from "@/lib/server/http/route-builder";
import { bumpSessionVersion } from "@/db/queries/auth";

/** Sign out everywhere: every session of this account, on every device, ends at its next request. */
export const DELETE = userRoute({}, async ({ user }) => {
  await bumpSessionVersion({ userId: user.id });
  return json({ ok: true });
});
