"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import type { z } from "zod";
import { invitationCreateSchema } from "@/lib/schemas/account";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/roles";
import { TextField, Notice } from "./ui/field";
import { Button } from "./ui/button";
import { CheckboxLabel } from "./ui/checkbox";
import type { InvitationDto, MemberDto } from "@/lib/schemas/account";
import { useWrite } from "@/components/use-write";

type Member = Omit<MemberDto, "joinedAt">;
type Invite = InvitationDto;

function RoleBoxes({ value, onChange, name }: { value: Role[]; onChange: (r: Role[]) => void; name: string }) {
  return (
    <fieldset className="flex flex-wrap gap-x-3 gap-y-1">
      <legend className="sr-only">Roles for {name}</legend>
      {ROLES.map((r) => (
        <CheckboxLabel key={r} className="text-sm" label={ROLE_LABELS[r]} checked={value.includes(r)} onChange={(e) => onChange(e.target.checked ? [...value, r] : value.filter((x) => x !== r))} />
      ))}
    </fieldset>
  );
}

export function MembersPanel({ channelId, members, invites, manage, selfId }: { channelId: string; members: Member[]; invites: Invite[]; manage: boolean; selfId: string }) {
  const write = useWrite({ scope: `members:${channelId}` });
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [draft, setDraft] = useState<Record<string, Role[]>>({});
  const form = useForm<z.input<typeof invitationCreateSchema>>({ resolver: zodResolver(invitationCreateSchema), defaultValues: { email: "", roles: ["presenter"] } });
  const inviteRoles = form.watch("roles") as Role[];

  return (
    <div className="space-y-6">
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Channel members</caption>
        <thead>
          <tr className="border-b border-timber-300 text-left">
            <th className="py-1 pr-2">Name</th>
            <th className="py-1 pr-2">E-mail</th>
            <th className="py-1">Roles</th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) => {
            const roles = draft[m.userId] ?? m.roles;
            const changed = draft[m.userId] && draft[m.userId]!.slice().sort().join() !== m.roles.slice().sort().join();
            return (
              <tr key={m.userId} className="border-b border-timber-200 align-top">
                <td className="py-2 pr-2 font-medium">
                  {m.name}
                  {m.userId === selfId ? <span className="text-walnut-600"> (you)</span> : null}
                </td>
                <td className="py-2 pr-2">{m.email}</td>
                <td className="py-2">
                  {manage ? (
                    <div className="flex flex-wrap items-center gap-2">
                      <RoleBoxes name={m.name} value={roles} onChange={(r) => setDraft((d) => ({ ...d, [m.userId]: r }))} />
                      {changed ? (
                        <Button
                          onClick={async () => {
                            try {
                              await write(`/api/channels/${channelId}/members/${m.userId}`, "PATCH", { roles });
                              setMessage({ tone: "ok", text: `Roles of ${m.name} saved; they apply from the next request.` });
                              setDraft((d) => {
                                const { [m.userId]: _, ...rest } = d;
                                return rest;
                              });
                              router.refresh();
                            } catch (e) {
                              setMessage({ tone: "error", text: (e as Error).message });
                            }
                          }}
                        >
                          Save roles
                        </Button>
                      ) : null}
                      {m.userId !== selfId ? (
                        <Button
                          variant="danger"
                          aria-label={`Remove ${m.name} from the channel`}
                          onClick={async () => {
                            if (!window.confirm(`Remove ${m.name} from the channel? What they made stays; they lose access at once.`)) return;
                            try {
                              await write(`/api/channels/${channelId}/members/${m.userId}`, "DELETE");
                              setMessage({ tone: "ok", text: `${m.name} is no longer a member.` });
                              router.refresh();
                            } catch (e) {
                              setMessage({ tone: "error", text: (e as Error).message });
                            }
                          }}
                        >
                          Remove
                        </Button>
                      ) : null}
                    </div>
                  ) : (
                    m.roles.map((r) => ROLE_LABELS[r]).join(", ")
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>

      {manage ? (
        <section className="rounded-plank border border-timber-300 bg-white p-4">
          <h2 className="font-bold">Invite someone</h2>
          <p className="text-sm text-walnut-700">They get an e-mail with a link that works once, for 7 days.</p>
          <form
            className="mt-3 space-y-3"
            noValidate
            onSubmit={form.handleSubmit(async (v) => {
              try {
                await write(`/api/channels/${channelId}/invitations`, "POST", v);
                setMessage({ tone: "ok", text: `Invitation sent to ${v.email}.` });
                form.reset({ email: "", roles: ["presenter"] });
                router.refresh();
              } catch (e) {
                const fields = (e as { fields?: Record<string, string[]> }).fields;
                if (fields?.email) form.setError("email", { message: fields.email[0] });
                setMessage({ tone: "error", text: (e as Error).message });
              }
            })}
          >
            <TextField label="E-mail" type="email" {...form.register("email")} error={form.formState.errors.email?.message} />
            <RoleBoxes name="the invitee" value={inviteRoles} onChange={(r) => form.setValue("roles", r, { shouldValidate: true })} />
            {form.formState.errors.roles ? <p className="text-sm text-fault-700">{form.formState.errors.roles.message}</p> : null}
            <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
              Send invitation
            </Button>
          </form>
          {invites.length ? (
            <div className="mt-4">
              <h3 className="text-sm font-bold">Waiting for an answer</h3>
              <ul className="mt-1 space-y-1 text-sm">
                {invites.map((i) => (
                  <li key={i.id} className="flex items-center gap-2">
                    <span>{i.email}</span>
                    <span className="text-walnut-600">{i.roles.map((r) => ROLE_LABELS[r]).join(", ")}</span>
                    <span className="num text-xs text-walnut-600">until {i.expiresAt.slice(0, 10)}</span>
                    <Button
                      variant="quiet"
                      onClick={async () => {
                        await write(`/api/channels/${channelId}/invitations/${i.id}`, "DELETE").catch((e: Error) => setMessage({ tone: "error", text: e.message }));
                        router.refresh();
                      }}
                    >
                      Revoke
                    </Button>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
