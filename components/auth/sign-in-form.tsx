"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import Link from "next/link";
import { signInSchema } from "@/lib/schemas/account";
import { safeCallbackPath } from "@/lib/safe-redirect";
import { TextField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { signInWithPassword } from "./api-client";
import type { z } from "zod";

type Form = z.input<typeof signInSchema>;

export function SignInForm({ callbackUrl, notice }: { callbackUrl: string; notice?: string }) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Form>({ resolver: zodResolver(signInSchema) });
  const onSubmit = handleSubmit(async (v) => {
    setError(null);
    const r = await signInWithPassword(v.email, v.password);
    if (!r.ok) return setError(r.message);
    window.location.assign(safeCallbackPath(callbackUrl));
  });
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <h1 className="text-xl font-bold">Sign in</h1>
      {notice ? <Notice tone="ok">{notice}</Notice> : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
      <TextField label="E-mail" type="email" autoComplete="email" {...register("email")} error={formState.errors.email?.message} />
      <TextField label="Password" type="password" autoComplete="current-password" {...register("password")} error={formState.errors.password?.message} />
      <Button type="submit" variant="primary" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
      <p className="text-sm">
        <Link className="text-chalk-600 underline" href="/forgot-password">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
