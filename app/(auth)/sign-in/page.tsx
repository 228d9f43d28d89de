import { SignInForm } from "@/components/auth/sign-in-form";
import { safeCallbackPath } from "@/lib/safe-redirect";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const sp = await searchParams;
  const notice = sp.joined ? "You joined the channel. Sign in with your new password." : sp.reset ? "Password changed. Sign in with the new one." : undefined;
  return <SignInForm callbackUrl={safeCallbackPath(sp.callbackUrl)} notice={notice} />;
}
