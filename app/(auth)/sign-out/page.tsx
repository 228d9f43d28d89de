import Link from "next/link";
import { SignOutButton, SignOutEverywhereButton } from "@/components/auth/sign-out-button";

export const metadata = { title: "Sign out" };

export default function SignOutPage() {
  return (
    <div className="space-y-4">
      <h1 className="text-xl font-bold">Leaving the workshop?</h1>
      <p className="text-sm text-walnut-700">Signing out ends your session on this device. Unsaved form input is lost. Signing out everywhere also ends your sessions on every other phone and computer, for example one you left signed in at a shared bench.</p>
      <div className="flex flex-wrap gap-2">
        <SignOutButton />
        <SignOutEverywhereButton />
        <Link href="/" className="inline-flex items-center px-3 text-sm text-chalk-600 underline">
          Stay signed in
        </Link>
      </div>
    </div>
  );
}
