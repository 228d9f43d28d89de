import NextAuth from "next-auth";
import { authOptions } from "@/lib/server/auth";
import { assertSignInAllowed, clientAddress, signInKeys } from "@/lib/server/rate-limit";
import { toResponse } from "@/lib/server/errors";

type Ctx = { params: Promise<{ nextauth: string[] }> };

async function handler(req: Request, ctx: Ctx) {
  return NextAuth(authOptions())(req, ctx);
}

export async function GET(req: Request, ctx: Ctx) {
  return handler(req, ctx);
}

/** Credentials sign-in is throttled here, before next-auth sees it, so the answer can be a 429 with Retry-After. */
export async function POST(req: Request, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") === "callback/credentials") {
    try {
      const form = await req.clone().formData();
      const email = String(form.get("email") ?? "");
      await assertSignInAllowed(signInKeys(email, clientAddress(req.headers)));
    } catch (e) {
      return toResponse(e);
    }
  }
  return handler(req, ctx);
}
