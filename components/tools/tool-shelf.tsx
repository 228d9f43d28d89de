"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { toolCreateSchema, ACQUISITIONS, ACQUISITION_LABELS, type Acquisition } from "@/lib/schemas/build";
import { TOOL_KINDS, TOOL_KIND_LABELS, type ToolKind } from "@/lib/safety";
import { TextField, SelectField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import type { ToolDto } from "@/lib/schemas/build";
import { useWrite } from "@/components/use-write";

type Form = z.input<typeof toolCreateSchema>;

export function ToolShelf({ channelId, tools, sponsors, canEdit, photoUrls }: { channelId: string; tools: ToolDto[]; sponsors: { id: string; name: string }[]; canEdit: boolean; photoUrls: Record<string, string> }) {
  const write = useWrite({ scope: `tools:${channelId}` });
  const router = useRouter();
  const [photo, setPhoto] = useState<File | null>(null);
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const form = useForm<Form>({ resolver: zodResolver(toolCreateSchema), defaultValues: { name: "", kind: "power_tool", acquisition: "bought", sponsorId: null, caution: "" } });
  const e = form.formState.errors;
  const sponsorName = (id: string | null) => sponsors.find((s) => s.id === id)?.name;

  return (
    <div className="space-y-4">
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      {tools.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-4 text-sm">
          <strong>The shelf is empty.</strong> {canEdit ? "Add the tools your builds use; mark the ones a sponsor gave or lent, so their credit and disclosure are never forgotten." : "The presenter fills the shelf."}
        </div>
      ) : (
        <table className="w-full border-collapse rounded-plank bg-white text-sm" data-testid="tool-shelf">
          <thead>
            <tr className="border-b border-timber-300 bg-timber-100 text-left">
              <th className="px-2 py-1.5">Tool</th>
              <th className="px-2">Kind</th>
              <th className="px-2">How we have it</th>
              <th className="px-2">Caution</th>
              <th className="px-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {tools.map((t) => (
              <tr key={t.id} className="border-b border-timber-200 align-top">
                <td className="px-2 py-1.5 font-medium">
                  <span className="flex items-center gap-2">
                    {/* A short-lived presigned URL from storage: the image optimizer would fetch and keep it server-side. */}
                    {photoUrls[t.id] ? (
                      // eslint-disable-next-line @next/next/no-img-element
                      <img src={photoUrls[t.id]} alt="" className="h-10 w-10 rounded-plank border border-timber-300 object-cover" />
                    ) : null}
                    {t.name}
                  </span>
                </td>
                <td className="px-2">{TOOL_KIND_LABELS[t.kind as ToolKind] ?? t.kind}</td>
                <td className="px-2">
                  {ACQUISITION_LABELS[t.acquisition as Acquisition] ?? t.acquisition}
                  {t.sponsorId ? ` (${sponsorName(t.sponsorId) ?? "sponsor"})` : ""}
                  {t.sponsored ? <span className="ml-1 rounded-plank border border-walnut-700 px-1 text-xs">needs disclosure</span> : null}
                </td>
                <td className="px-2 text-xs">{t.caution || "—"}</td>
                <td className="px-2">
                  {canEdit ? (
                    <Button
                      variant="quiet"
                      onClick={async () => {
                        await write(`/api/tools/${t.id}`, "DELETE").catch((err: Error) => setMessage({ tone: "error", text: err.message }));
                        router.refresh();
                      }}
                    >
                      Off the shelf
                    </Button>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canEdit ? (
        <form
          aria-label="Add a tool"
          noValidate
          className="grid gap-3 rounded-plank border border-timber-300 bg-white p-4 sm:grid-cols-2"
          onSubmit={form.handleSubmit(async (v) => {
            try {
              let photoKey: string | null = null;
              if (photo) {
                const signed = await write<{ key: string; uploadUrl: string; headers: Record<string, string> }>(`/api/channels/${channelId}/photos`, "POST", { contentType: photo.type, size: photo.size });
                // The bytes go straight to storage on the presigned URL, not to the API.
                // eslint-disable-next-line no-restricted-globals
                const put = await fetch(signed.uploadUrl, { method: "PUT", headers: signed.headers, body: photo });
                if (!put.ok) throw new Error("The photo upload failed; try again or add the tool without it.");
                photoKey = signed.key;
              }
              await write(`/api/channels/${channelId}/tools`, "POST", { ...v, photoKey });
              setPhoto(null);
              setMessage({ tone: "ok", text: `${v.name} is on the shelf.` });
              form.reset();
              router.refresh();
            } catch (err) {
              setMessage({ tone: "error", text: (err as Error).message });
            }
          })}
        >
          <h2 className="font-bold sm:col-span-2">Add a tool</h2>
          <TextField label="Name" {...form.register("name")} error={e.name?.message} />
          <SelectField label="Kind" {...form.register("kind")}>
            {TOOL_KINDS.map((k) => (
              <option key={k} value={k}>
                {TOOL_KIND_LABELS[k]}
              </option>
            ))}
          </SelectField>
          <SelectField label="How the channel has it" {...form.register("acquisition")}>
            {ACQUISITIONS.map((a) => (
              <option key={a} value={a}>
                {ACQUISITION_LABELS[a]}
              </option>
            ))}
          </SelectField>
          <SelectField label="Sponsor" {...form.register("sponsorId", { setValueAs: (v: string) => (v ? v : null) })}>
            <option value="">— none —</option>
            {sponsors.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </SelectField>
          <TextField className="sm:col-span-2" label="Caution for this tool (from its manual)" {...form.register("caution")} error={e.caution?.message} />
          <label className="text-sm sm:col-span-2">
            Photo (optional; JPEG, PNG or WebP)
            <input type="file" accept="image/jpeg,image/png,image/webp" className="mt-1 block" onChange={(ev) => setPhoto(ev.target.files?.[0] ?? null)} />
          </label>
          <div>
            <Button type="submit" variant="primary">
              Add to shelf
            </Button>
          </div>
        </form>
      ) : null}
    </div>
  );
}
