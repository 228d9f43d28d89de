import bcrypt from "bcryptjs";
import { json } from "@/lib/server/http/api";
import { publicRoute } from "@/lib/server/http/route-builder";
import { AppError } from "@/lib/server/http/errors";
import { invitationAcceptSchema } from "@/lib/schemas/account";
import { getOpenInvitationByTokenHash } from "@/db/queries/auth";
import { acceptInvitation } from "@/lib/server/services/accounts";
import { getUserByEmail } from "@/db/queries/users";
import { hashToken } from "@/lib/server/infra/tokens";

/** Public: the token in the e-mailed link is the credential. */
export const POST = publicRoute({ body: invitationAcceptSchema, what: "invitation" }, async ({ body: input }) => {
  const tokenHash = hashToken(input.token);
  const inv = await getOpenInvitationByTokenHash({ tokenHash });
  if (!inv) throw new AppError("not_found:invitation", "This invitation link is unknown, already used or expired. Ask the channel owner for a new one.");
  const existing = await getUserByEmail({ email: inv.email });
  if (existing && !(await bcrypt.compare(input.password, existing.passwordHash))) {
    throw new AppError("unprocessable:invitation.password", "An account with this e-mail already exists: enter its password to join.", {
      fields: { password: ["enter the password of your existing account"] },
    });
  }
  const passwordHash = existing?.passwordHash ?? (await bcrypt.hash(input.password, 10));
  const result = await acceptInvitation({ tokenHash, name: input.name, passwordHash });
  if (!result) throw new AppError("not_found:invitation", "This invitation was used a moment ago.");
  return json({ email: result.email, channelId: result.channelId }, 201);
});
