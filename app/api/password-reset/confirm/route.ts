import bcrypt from "bcryptjs";
import { json, parseBody, route } from "@/lib/server/api";
import { AppError } from "@/lib/server/errors";
import { resetConfirmSchema } from "@/lib/schemas/account";
import { consumePasswordReset } from "@/db/queries/auth";
import { hashToken } from "@/lib/server/tokens";

export const POST = route(async (req) => {
  const input = await parseBody(req, resetConfirmSchema, "password reset");
  const userId = await consumePasswordReset({ tokenHash: hashToken(input.token), passwordHash: await bcrypt.hash(input.password, 10) });
  if (!userId) throw new AppError("not_found:reset", "This reset link is unknown, already used or expired. Ask for a new one.");
  return json({ ok: true });
});
