import { addMinutes } from "date-fns";
import { json, parseBody, route } from "@/lib/server/api";
import { resetRequestSchema } from "@/lib/schemas/account";
import { createPasswordReset } from "@/db/queries/auth";
import { getUserByEmail } from "@/db/queries/users";
import { newToken } from "@/lib/server/tokens";
import { appUrl, sendMail } from "@/lib/server/mail";

/** Always answers the same, whether or not the account exists. */
export const POST = route(async (req) => {
  const { email } = await parseBody(req, resetRequestSchema, "password reset");
  const user = await getUserByEmail({ email });
  if (user) {
    const { token, hash } = newToken();
    await createPasswordReset({ userId: user.id, tokenHash: hash, expiresAt: addMinutes(new Date(), 30) });
    await sendMail({
      to: user.email,
      subject: "Reset your Jigboard password",
      text: `Someone asked to reset the password for ${user.email}.\n\nChoose a new password: ${appUrl(`/reset-password/${token}`)}\n\nThe link works once and expires in 30 minutes. If it was not you, ignore this message.`,
    });
  }
  return json({ ok: true }, 202);
});
