"use client";
/**
 * The publish package: title and thumbnail, the description composed from
 * the episode's data with a live count against the platform's limits, and
 * the checklist that gates the move to published.
 */
import Link from "next/link";
import { useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson, ApiError } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { checkTexts, composeDescription, titleCarriesAdLabel, type DescriptionSections } from "@/lib/publish";
import type { PublishDto } from "@/lib/schemas/publish";

const SECTION_LABELS: Record<keyof DescriptionSections, string> = { chapters: "Chapters", credits: "Tools and credits", materials: "Materials", safety: "Safety caution" };

function Meter({ used, max, unit, label }: { used: number; max: number; unit: string; label: string }) {
  const over = used > max;
  return (
    <p className={`num text-xs ${over ? "font-bold text-fault-700" : used > max * 0.9 ? "text-heed-700" : "text-walnut-700"}`} aria-live="polite" data-testid={`meter-${label}`}>
      {used.toLocaleString("en")} / {max.toLocaleString("en")} {unit}
      {over ? ` — ${(used - max).toLocaleString("en")} over the limit` : ""}
    </p>
  );
}

type Props = { episodeId: string; base: string; canEdit: boolean; canMarkFinal: boolean; canPublish: boolean; isOwner: boolean };

export function PublishView(props: Props) {
  const q = useQuery({ queryKey: ["publish", props.episodeId], queryFn: () => fetchJson<PublishDto>(`/api/episodes/${props.episodeId}/publish`) });
  if (!q.data) return <p className="text-walnut-700">{q.error ? (q.error as Error).message : "Putting the package together…"}</p>;
  return <PublishEditor {...props} d={q.data} />;
}

/** The texts start from the stored package and are the team's while they type; each saves on leaving its field. */
function PublishEditor({ episodeId, base, canEdit, canMarkFinal, canPublish, isOwner, d }: Props & { d: PublishDto }) {
  const key = ["publish", episodeId];
  const qc = useQueryClient();
  const write = useWrite({ scope: `publish:${episodeId}` });
  const [title, setTitle] = useState(d.package.title);
  const [summary, setSummary] = useState(d.package.summary);
  const [closing, setClosing] = useState(d.package.closing);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [reason, setReason] = useState("");
  const [copied, setCopied] = useState(false);

  // The same composition the server runs, live as the team types.
  const description = composeDescription({ ...d.parts, summary, closing, sections: d.package.sections });
  const texts = checkTexts(title, description);
  const adInTitle = titleCarriesAdLabel(title);

  async function run<T>(label: string, fn: () => Promise<T>) {
    setError(null);
    setBusy(label);
    try {
      const out = await fn();
      if (out && typeof out === "object" && "checklist" in out) qc.setQueryData(key, out);
      return out;
    } catch (e) {
      setError((e as Error).message);
      return undefined;
    } finally {
      setBusy(null);
    }
  }
  const save = (patch: Record<string, unknown>) => run("Saving…", () => write<PublishDto>(`/api/episodes/${episodeId}/publish`, "PATCH", patch));

  async function uploadThumbnail(file: File) {
    await run("Uploading thumbnail…", async () => {
      const signed = await write<{ key: string; uploadUrl: string; headers: Record<string, string> }>(`/api/episodes/${episodeId}/publish/thumbnail-upload`, "POST", { contentType: file.type, size: file.size });
      // The bytes go straight to storage on the presigned URL, not to the API.
      // eslint-disable-next-line no-restricted-globals
      const put = await fetch(signed.uploadUrl, { method: "PUT", headers: signed.headers, body: file });
      if (!put.ok) throw new Error("The thumbnail upload failed; try again.");
      return write<PublishDto>(`/api/episodes/${episodeId}/publish/thumbnail`, "PUT", { key: signed.key });
    });
  }

  async function publish(override?: string) {
    await run("Publishing…", async () => {
      try {
        await write(`/api/episodes/${episodeId}`, "PATCH", { stage: "published", ...(override ? { publishOverride: override } : {}) });
      } catch (e) {
        if (e instanceof ApiError && e.status === 409) throw new Error("The checklist fails; fix the items marked below, or (owner only) publish anyway with a reason.");
        throw e;
      }
      await qc.invalidateQueries({ queryKey: key });
      setReason("");
      return undefined;
    });
  }

  const published = d.stage === "published";
  const checklist = d.checklist;

  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="space-y-4">
        {error ? (
          <p role="alert" className="rounded-plank border-l-4 border-fault-700 bg-fault-50 px-3 py-2 text-sm">
            {error}
          </p>
        ) : null}
        <section aria-labelledby="pkg-title" className="rounded-plank border border-timber-300 bg-white p-3">
          <h2 id="pkg-title" className="font-bold">
            Title and thumbnail
          </h2>
          <label htmlFor="pub-title" className="mt-2 block text-sm font-medium">
            Video title
          </label>
          <input
            id="pub-title"
            className="mt-1 w-full rounded-plank border border-timber-300 px-2 py-1.5"
            value={title}
            disabled={!canEdit}
            onChange={(e) => setTitle(e.target.value)}
            onBlur={() => title !== d.package.title && void save({ title })}
            aria-describedby="pub-title-count"
          />
          <div id="pub-title-count">
            <Meter used={texts.titleChars} max={d.limits.titleMaxChars} unit="characters" label="title" />
          </div>
          {d.adLabel.needed ? (
            <p className={`mt-1 text-sm ${adInTitle || d.adLabel.onThumbnail ? "text-pass-700" : "text-fault-700"}`} data-testid="ad-label">
              {adInTitle ? '✓ "Ad" is in the title.' : d.adLabel.onThumbnail ? '✓ The thumbnail carries the "Ad" label.' : '✕ A paid or affiliate deal: put "Ad" in the title or on the thumbnail, so viewers know before they click.'}
            </p>
          ) : null}
          <div className="mt-3 flex flex-wrap items-start gap-3">
            {d.package.thumbnailUrl ? (
              // eslint-disable-next-line @next/next/no-img-element
              <img src={d.package.thumbnailUrl} alt="Thumbnail" className="h-24 w-[10.67rem] rounded-plank border border-timber-300 object-cover" />
            ) : (
              <div className="flex h-24 w-[10.67rem] items-center justify-center rounded-plank border border-dashed border-timber-400 text-xs text-walnut-700">No thumbnail</div>
            )}
            {canEdit ? (
              <div className="space-y-2 text-sm">
                <label className="block">
                  <span className="font-medium">Upload a thumbnail</span>
                  <span className="block text-xs text-walnut-700">JPEG or PNG, at most 2 MB</span>
                  <input type="file" accept="image/jpeg,image/png" className="mt-1 block text-sm" onChange={(e) => e.target.files?.[0] && void uploadThumbnail(e.target.files[0])} aria-label="Thumbnail image" />
                </label>
                {d.package.thumbnailUrl ? (
                  <label className="flex items-center gap-2">
                    <input type="checkbox" checked={d.package.thumbnailAdLabel} onChange={(e) => void save({ thumbnailAdLabel: e.target.checked })} />
                    The image itself shows the &quot;Ad&quot; label
                  </label>
                ) : null}
              </div>
            ) : null}
          </div>
        </section>

        <section aria-labelledby="pkg-desc" className="rounded-plank border border-timber-300 bg-white p-3">
          <h2 id="pkg-desc" className="font-bold">
            Description
          </h2>
          <p className="text-xs text-walnut-700">Disclosures, chapters, tools, materials and the caution come from the episode; write the opening and the closing.</p>
          {d.parts.disclosures.length ? (
            <div className="mt-2 rounded-plank border-l-4 border-heed-600 bg-heed-50 px-2 py-1 text-sm">
              <p className="font-medium">Disclosure, first in the description</p>
              <p className="whitespace-pre-line">{d.parts.disclosures.join("\n")}</p>
            </div>
          ) : null}
          <label htmlFor="pub-summary" className="mt-2 block text-sm font-medium">
            Opening
          </label>
          <textarea id="pub-summary" rows={4} className="mt-1 w-full rounded-plank border border-timber-300 p-2 text-sm" value={summary} disabled={!canEdit} onChange={(e) => setSummary(e.target.value)} onBlur={() => summary !== d.package.summary && void save({ summary })} />
          <fieldset className="mt-2">
            <legend className="text-sm font-medium">Generated sections</legend>
            <div className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
              {(Object.keys(SECTION_LABELS) as (keyof DescriptionSections)[]).map((s) => (
                <label key={s} className="flex items-center gap-1.5">
                  <input type="checkbox" checked={d.package.sections[s]} disabled={!canEdit} onChange={(e) => void save({ sections: { [s]: e.target.checked } })} />
                  {SECTION_LABELS[s]}
                </label>
              ))}
            </div>
          </fieldset>
          <label htmlFor="pub-closing" className="mt-2 block text-sm font-medium">
            Closing (links, thanks)
          </label>
          <textarea id="pub-closing" rows={3} className="mt-1 w-full rounded-plank border border-timber-300 p-2 text-sm" value={closing} disabled={!canEdit} onChange={(e) => setClosing(e.target.value)} onBlur={() => closing !== d.package.closing && void save({ closing })} />
          <div className="mt-3 flex items-center justify-between gap-2">
            <h3 className="text-sm font-bold">As it will read</h3>
            <Button
              type="button"
              onClick={() => {
                void navigator.clipboard?.writeText(description).then(() => setCopied(true));
                setTimeout(() => setCopied(false), 2000);
              }}
            >
              {copied ? "Copied" : "Copy description"}
            </Button>
          </div>
          <pre tabIndex={0} role="region" aria-label="Description as it will read" className="mt-1 max-h-96 overflow-auto whitespace-pre-wrap rounded-plank border border-timber-200 bg-timber-50 p-2 font-sans text-sm" data-testid="description-preview">
            {description || "Nothing yet."}
          </pre>
          <Meter used={texts.descriptionBytes} max={d.limits.descriptionMaxBytes} unit="bytes" label="description" />
          {d.chapters.lines.some((c) => c.problems.length) ? (
            <ul className="mt-2 space-y-0.5 text-sm" aria-label="Chapter problems">
              {d.chapters.lines.map((c) => (
                <li key={c.line} className={c.problems.length ? "text-fault-700" : ""}>
                  <span className="num">{c.line}</span>
                  {c.problems.length ? ` — ${c.problems.join("; ")}` : ""}
                </li>
              ))}
            </ul>
          ) : null}
          {d.chapters.problems.map((p) => (
            <p key={p} className="text-sm text-fault-700">
              Chapters: {p}
            </p>
          ))}
          <p className="mt-2 text-xs text-walnut-700">Limits from the large video platform&apos;s API reference: title 100 characters, description 5,000 bytes, no &quot;&lt;&quot; or &quot;&gt;&quot;; chapters start at 0:00, at least three, each 10 s or longer.</p>
        </section>
      </div>

      <aside className="space-y-4" aria-label="Publish checklist">
        <section className="rounded-plank border border-timber-300 bg-white">
          <div className="flex items-center justify-between border-b border-timber-200 px-3 py-2">
            <h2 className="font-bold">Ready to publish?</h2>
            <span className={`text-sm font-bold ${checklist.pass ? "text-pass-700" : "text-fault-700"}`} data-testid="checklist-state">
              {checklist.pass ? "All clear" : `${checklist.failing.length} to fix`}
            </span>
          </div>
          <ol className="divide-y divide-timber-200" data-testid="checklist">
            {checklist.items.map((i) => (
              <li key={i.key} className="flex gap-2 px-3 py-2 text-sm" data-pass={i.pass} data-key={i.key}>
                <span aria-hidden className={`font-bold ${i.pass ? "text-pass-700" : "text-fault-700"}`}>
                  {i.pass ? "✓" : "✕"}
                </span>
                <div className="min-w-0">
                  <p className="font-medium">
                    <span className="sr-only">{i.pass ? "Passing: " : "Failing: "}</span>
                    {i.label}
                  </p>
                  <p className="text-walnut-700">{i.detail}</p>
                  {!i.pass ? (
                    i.action === "mark_final" && canMarkFinal ? (
                      <Button type="button" className="mt-1" onClick={() => void run("Marking…", () => write<PublishDto>(`/api/episodes/${episodeId}/publish/script-final`, "PUT", { final: true }))}>
                        Mark the script final
                      </Button>
                    ) : i.tab !== "publish" ? (
                      <Link className="text-chalk-700 underline" href={`${base}/${i.tab}`}>
                        Fix in {i.tab === "sponsors" ? "sponsor checks" : i.tab === "coverage" ? "B-roll coverage" : i.tab === "shots" ? "the shot list" : "the script"}
                      </Link>
                    ) : null
                  ) : null}
                </div>
              </li>
            ))}
          </ol>
          <div className="border-t border-timber-200 p-3">
            {published ? (
              <p className="text-sm font-bold text-pass-700" data-testid="published">
                Published.
              </p>
            ) : canPublish ? (
              <>
                <Button type="button" variant="primary" disabled={!checklist.pass || Boolean(busy)} onClick={() => void publish()}>
                  Move to published
                </Button>
                {!checklist.pass && isOwner ? (
                  <div className="mt-3 space-y-1">
                    <label htmlFor="override" className="block text-sm font-medium">
                      Publish anyway (owner): why?
                    </label>
                    <textarea id="override" rows={2} className="w-full rounded-plank border border-timber-300 p-2 text-sm" value={reason} onChange={(e) => setReason(e.target.value)} placeholder="At least 10 characters; kept with the list of what was failing" />
                    <Button type="button" variant="danger" disabled={reason.trim().length < 10 || Boolean(busy)} onClick={() => void publish(reason.trim())}>
                      Publish with the checklist failing
                    </Button>
                  </div>
                ) : null}
              </>
            ) : (
              <p className="text-sm text-walnut-700">Your role cannot move this episode to published.</p>
            )}
            {busy ? <p className="mt-1 text-xs text-walnut-700">{busy}</p> : null}
          </div>
        </section>
        {d.overrides.length ? (
          <section className="rounded-plank border border-timber-300 bg-white p-3">
            <h2 className="font-bold">Published over a failing checklist</h2>
            <ul className="mt-1 space-y-2 text-sm">
              {d.overrides.map((o) => (
                <li key={o.id}>
                  <p>
                    <span className="font-medium">{o.userName ?? "A former member"}</span>, {new Date(o.createdAt).toLocaleString("en-GB")}: {o.reason}
                  </p>
                  <p className="text-xs text-walnut-700">Failing then: {o.failing.join(", ").replace(/_/g, " ")}</p>
                </li>
              ))}
            </ul>
          </section>
        ) : null}
        {d.package.scriptFinalAt ? <p className="text-xs text-walnut-700">Script marked final {new Date(d.package.scriptFinalAt).toLocaleString("en-GB")}.</p> : null}
      </aside>
    </div>
  );
}
