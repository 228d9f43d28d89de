import bcrypt from "bcryptjs";
import { json } from "@/lib/server/http/api";
import { publicRoute } from "@/lib/server/http/route-builder";
import { AppError } from "@/lib/server/http/errors";
import { resetConfirmSchema } from "@/lib/schemas/account";
import { consumePasswordReset } from "@/lib/server/services/accounts";
import { hashToken } from "@/lib/server/infra/tokens";

/** Public: the token in the e-mailed link is the credential. */
export const POST = publicRoute({ body: resetConfirmSchema, what: "password reset" }, async ({ body: input }) => {
  const userId = await consumePasswordReset({ tokenHash: hashToken(input.token), passwordHash: await bcrypt.hash(input.password, 10) });
  if (!userId) throw new AppError("not_found:reset", "This reset link is unknown, already used or expired. Ask for a new one.");
  return json({ ok: true });
});
