"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import type { z } from "zod";
import { invitationAcceptSchema } from "@/lib/schemas/account";
import { TextField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { usePostJson } from "./api-client";

export function InviteForm({ token, email, channelName, roles }: { token: string; email: string; channelName: string; roles: string }) {
  const postJson = usePostJson();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError: setFieldError } = useForm<z.input<typeof invitationAcceptSchema>>({
    resolver: zodResolver(invitationAcceptSchema),
    defaultValues: { token, name: "", password: "" },
  });
  const onSubmit = handleSubmit(async (v) => {
    const r = await postJson("/api/invitations/accept", v);
    if (!r.ok) {
      if (r.fields?.password) setFieldError("password", { message: r.fields.password[0] });
      return setError(r.message);
    }
    window.location.assign("/sign-in?joined=1");
  });
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <h1 className="text-xl font-bold">Join {channelName}</h1>
      <p className="text-sm text-walnut-700">
        Invitation for <strong>{email}</strong> as {roles}.
      </p>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <input type="hidden" {...register("token")} />
      <TextField label="Your name" autoComplete="name" {...register("name")} error={formState.errors.name?.message} />
      <TextField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." {...register("password")} error={formState.errors.password?.message} />
      <Button type="submit" variant="primary" className="w-full" disabled={formState.isSubmitting}>
        Join the channel
      </Button>
    </form>
  );
}
