import NextAuth from "next-auth";
import { authOptions } from "@/lib/server/infra/auth";
import { assertSignInAllowed, clientAddress, signInKeys } from "@/lib/server/infra/rate-limit";
import { toResponse } from "@/lib/server/http/errors";
import { env } from "@/lib/env";

type Ctx = { params: Promise<{ nextauth: string[] }> };

/** Back to the sign-in page, for requests next-auth cannot make sense of. */
function toSignIn(error: string) {
  return Response.redirect(new URL(`/sign-in?error=${encodeURIComponent(error)}`, env().NEXTAUTH_URL), 303);
}

/** next-auth throws on some odd input (a callback URL it cannot parse); that is the caller's mistake, never a 500. */
async function handler(req: Request, ctx: Ctx) {
  try {
    const res = await NextAuth(authOptions())(req, ctx);
    return res.status >= 500 ? toSignIn("Configuration") : res;
  } catch (e) {
    console.error("[auth] refused a request next-auth could not handle:", (e as Error).message);
    return toSignIn("Callback");
  }
}

export async function GET(req: Request, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  // Credentials are only ever posted; a GET here is a stray link.
  if (nextauth.join("/") === "callback/credentials") return toSignIn("CredentialsSignin");
  return handler(req, ctx);
}

/** Credentials sign-in is throttled here, before next-auth sees it, so the answer can be a 429 with Retry-After. */
export async function POST(req: Request, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") === "callback/credentials") {
    let email = "";
    try {
      email = String((await req.clone().formData()).get("email") ?? "");
    } catch {
      return toSignIn("CredentialsSignin"); // not a form post: nothing to sign in with
    }
    try {
      await assertSignInAllowed(signInKeys(email, clientAddress(req.headers)));
    } catch (e) {
      return toResponse(e);
    }
  }
  return handler(req, ctx);
}
