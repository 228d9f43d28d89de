import { json } from "@/lib/server/api";
import { userRoute } from "@/lib/server/route-builder";
import { bumpSessionVersion } from "@/db/queries/auth";

/** Sign out everywhere: every session of this account, on every device, ends at its next request. */
export const DELETE = userRoute({}, async ({ user }) => {
  await bumpSessionVersion({ userId: user.id });
  return json({ ok: true });
});
