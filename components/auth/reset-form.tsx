"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import type { z } from "zod";
import { resetConfirmSchema } from "@/lib/schemas/account";
import { TextField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { usePostJson } from "./api-client";

export function ResetForm({ token }: { token: string }) {
  const postJson = usePostJson();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<z.input<typeof resetConfirmSchema>>({
    resolver: zodResolver(resetConfirmSchema),
    defaultValues: { token, password: "" },
  });
  const onSubmit = handleSubmit(async (v) => {
    const r = await postJson("/api/password-reset/confirm", v);
    if (!r.ok) return setError(r.message);
    window.location.assign("/sign-in?reset=1");
  });
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <h1 className="text-xl font-bold">Choose a new password</h1>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <input type="hidden" {...register("token")} />
      <TextField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." {...register("password")} error={formState.errors.password?.message} />
      <Button type="submit" variant="primary" className="w-full" disabled={formState.isSubmitting}>
        Save password
      </Button>
    </form>
  );
}
