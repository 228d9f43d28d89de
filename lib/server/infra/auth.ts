import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import bcrypt from "bcryptjs";
import { env } from "../../env";
import { signInSchema } from "../../schemas/account";
import { getUserByEmail } from "../../../db/queries/users";
import { clientAddress, recordSignIn, signInKeys } from "./rate-limit";
import { safeCallbackPath } from "../../safe-redirect";

// Compared against when the e-mail is unknown, so timing does not reveal which accounts exist.
const DUMMY_HASH = "$2b$10$ZQI5kAzYXXBOnH/TZkbJTOKXHQ58DY.9hJEcqZHMoaq/kRLgnVHjq";

export function authOptions(): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    session: { strategy: "jwt", maxAge: 30 * 24 * 3600 },
    pages: { signIn: "/sign-in", signOut: "/sign-out", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "E-mail and password",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        async authorize(credentials, req) {
          const parsed = signInSchema.safeParse(credentials ?? {});
          if (!parsed.success) return null;
          const headers = new Headers((req?.headers ?? {}) as Record<string, string>);
          const keys = signInKeys(parsed.data.email, clientAddress(headers));
          const user = await getUserByEmail({ email: parsed.data.email });
          const ok = await bcrypt.compare(parsed.data.password, user?.passwordHash ?? DUMMY_HASH);
          await recordSignIn(keys, Boolean(user && ok));
          if (!user || !ok) return null;
          return { id: user.id, email: user.email, name: user.name, sv: user.sessionVersion };
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          token.sub = user.id;
          token.sv = (user as { sv?: number }).sv ?? 0;
        }
        return token;
      },
      // Only same-site paths, whatever next-auth is handed; never a throw on an odd value.
      async redirect({ url, baseUrl }) {
        try {
          const u = new URL(url, baseUrl);
          if (u.origin !== new URL(baseUrl).origin) return baseUrl;
          return `${baseUrl}${safeCallbackPath(`${u.pathname}${u.search}`)}`;
        } catch {
          return baseUrl;
        }
      },
      async session({ session, token }) {
        if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
        return session;
      },
    },
  };
}
