"use client";
import { signOut } from "next-auth/react";
import { Button } from "@/components/ui/button";
import { useWrite } from "@/components/use-write";

export function SignOutButton({ variant = "primary" }: { variant?: "primary" | "quiet" }) {
  return (
    <Button variant={variant} onClick={() => void signOut({ callbackUrl: "/sign-in" })}>
      Sign out
    </Button>
  );
}

/** Ends every session of the account (every device), then this one. */
export function SignOutEverywhereButton() {
  const write = useWrite();
  return (
    <Button
      variant="plain"
      onClick={async () => {
        await write("/api/me/sessions", "DELETE").catch(() => null);
        await signOut({ callbackUrl: "/sign-in" });
      }}
    >
      Sign out everywhere
    </Button>
  );
}
