"use client";
import { signOut } from "next-auth/react";
import { Button } from "@/components/ui/button";

export function SignOutButton({ variant = "primary" }: { variant?: "primary" | "quiet" }) {
  return (
    <Button variant={variant} onClick={() => void signOut({ callbackUrl: "/sign-in" })}>
      Sign out
    </Button>
  );
}
