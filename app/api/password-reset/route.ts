import { addMinutes } from "date-fns";
import { json } from "@/lib/server/http/api";
import { publicRoute } from "@/lib/server/http/route-builder";
import { resetRequestSchema } from "@/lib/schemas/account";
import { createPasswordReset } from "@/db/queries/auth";
import { getUserByEmail } from "@/db/queries/users";
import { newToken } from "@/lib/server/infra/tokens";
import { appUrl, sendMail } from "@/lib/server/infra/mail";
import { assertResetAllowed, clientAddress, recordResetRequest } from "@/lib/server/infra/rate-limit";

/**
 * Always answers the same, and does the same work either way: one token, one
 * write, one message. An unknown address is told that no account uses it, so
 * the time taken does not reveal which accounts exist. Throttled per address
 * asked about and per client.
 */
export const POST = publicRoute({ body: resetRequestSchema, what: "password reset" }, async ({ req, body: { email } }) => {
  const keys = [`reset:${email.trim().toLowerCase()}`, `reset-from:${clientAddress(req.headers)}`];
  await assertResetAllowed(keys);
  await recordResetRequest(keys);
  const user = await getUserByEmail({ email });
  const { token, hash } = newToken();
  if (user) {
    await createPasswordReset({ userId: user.id, tokenHash: hash, expiresAt: addMinutes(new Date(), 30) });
    await sendMail({
      to: user.email,
      subject: "Reset your Jigboard password",
      text: `Someone asked to reset the password for ${user.email}.\n\nChoose a new password: ${appUrl(`/reset-password/${token}`)}\n\nThe link works once and expires in 30 minutes. Using it signs you out everywhere else. If it was not you, ignore this message.`,
      tag: { kind: "password_reset" },
    });
  } else {
    await sendMail({
      to: email,
      subject: "Reset your Jigboard password",
      text: `Someone asked to reset the Jigboard password for ${email}, but no Jigboard account uses this address.\n\nIf it was you, you may have signed up with another address. If it was not you, ignore this message.`,
      tag: { kind: "password_reset" },
    });
  }
  return json({ ok: true }, 202);
});
