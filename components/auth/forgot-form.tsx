"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import type { z } from "zod";
import { resetRequestSchema } from "@/lib/schemas/account";
import { TextField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { usePostJson } from "./api-client";

export function ForgotForm() {
  const postJson = usePostJson();
  const [sent, setSent] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<z.input<typeof resetRequestSchema>>({ resolver: zodResolver(resetRequestSchema) });
  const onSubmit = handleSubmit(async (v) => {
    const r = await postJson("/api/password-reset", v);
    if (!r.ok) return setError(r.message);
    setSent(true);
  });
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <h1 className="text-xl font-bold">Reset your password</h1>
      {sent ? <Notice tone="ok">If that address has an account, a reset link is on its way. It works once, for 30 minutes.</Notice> : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
      <TextField label="E-mail" type="email" autoComplete="email" {...register("email")} error={formState.errors.email?.message} />
      <Button type="submit" variant="primary" className="w-full" disabled={formState.isSubmitting}>
        Send reset link
      </Button>
    </form>
  );
}
