"use client";
/** The call sheet on screen and on paper (A4 or Letter), with the send to the crew. */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { SHOT_KIND_LABELS, type ShotKind } from "@/lib/schemas/footage";
import type { CallSheetDto } from "@/lib/schemas/shoot";

export function CallSheet({ sheet, canSend }: { sheet: CallSheetDto; canSend: boolean }) {
  const d = sheet.day;
  const router = useRouter();
  const write = useWrite({ scope: `call-sheet:${d.id}` });
  const [paper, setPaper] = useState<"A4" | "letter">("A4");
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  return (
    <article className="mx-auto max-w-[186mm] space-y-4 bg-white p-4 text-sm print:max-w-none print:p-0" aria-label="Call sheet">
      {/* Both papers: 186 mm of text fits A4 (210 mm) and Letter (216 mm) with 12 mm margins. */}
      <style>{`@page { size: ${paper === "A4" ? "A4" : "letter"}; margin: 12mm; }`}</style>
      <div className="flex flex-wrap items-center gap-2 print:hidden">
        <label className="text-sm">
          Paper{" "}
          <select aria-label="Paper size" className="rounded-plank border border-timber-300 px-1 py-1" value={paper} onChange={(e) => setPaper(e.target.value as "A4" | "letter")}>
            <option value="A4">A4</option>
            <option value="letter">Letter</option>
          </select>
        </label>
        <Button onClick={() => window.print()}>Print</Button>
        <a className="inline-flex items-center rounded-plank border border-timber-300 px-3 py-1.5 text-sm hover:bg-timber-100" href={`/api/shoot-days/${d.id}/ics`}>
          Download .ics
        </a>
        {canSend ? (
          <Button
            variant="primary"
            onClick={async () => {
              try {
                const r = await write<{ send: { recipients: string[] } }>(`/api/shoot-days/${d.id}/call-sheet`, "POST", {});
                setMsg({ tone: "ok", text: `Call sheet queued to ${r.send.recipients.join(", ")}. It goes out in a moment.` });
                setTimeout(() => router.refresh(), 2500);
              } catch (e) {
                setMsg({ tone: "error", text: (e as Error).message });
              }
            }}
          >
            Send to the crew
          </Button>
        ) : null}
      </div>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      <header className="border-b-2 border-walnut-900 pb-2">
        <p className="text-xs uppercase tracking-wide text-walnut-600">{sheet.channelName} · call sheet</p>
        <h1 className="text-xl font-bold">{sheet.episodeTitle ?? "Shoot day"}</h1>
        <p>
          <span className="num">{d.date}</span> · call <span className="num font-bold">{d.callTime}</span> · wrap <span className="num">{d.wrapTime}</span> ({d.timeZone}){d.status === "cancelled" ? " · CANCELLED" : ""}
        </p>
        {d.location ? <p>Location: {d.location}</p> : null}
        {d.weatherNote ? <p>Weather: {d.weatherNote}</p> : null}
      </header>

      <section aria-labelledby="crew-h">
        <h2 id="crew-h" className="font-bold">
          Crew
        </h2>
        <table className="w-full border-collapse">
          <tbody>
            {d.crew.map((c) => (
              <tr key={c.userId} className="border-b border-timber-200">
                <td className="py-0.5 pr-2">{c.name}</td>
                <td className="pr-2 text-walnut-700">{c.duty}</td>
                <td className="num">{c.callTime ?? d.callTime}</td>
                <td className="text-heed-800">{c.away ? "marked away that day" : ""}</td>
              </tr>
            ))}
            {d.helpers.map((h) => (
              <tr key={h.id} className="border-b border-timber-200">
                <td className="py-0.5 pr-2">{h.name} (helper)</td>
                <td className="pr-2 text-walnut-700">{h.duty}</td>
                <td className="num">{h.callTime ?? d.callTime}</td>
                <td />
              </tr>
            ))}
          </tbody>
        </table>
        {d.crew.length + d.helpers.length === 0 ? <p className="text-walnut-600">No crew on this day yet.</p> : null}
      </section>

      <section aria-labelledby="order-h">
        <h2 id="order-h" className="font-bold">
          Running order
        </h2>
        {sheet.steps.length === 0 ? <p className="text-walnut-600">No steps planned on this day. Plan the episode&apos;s schedule first.</p> : null}
        <ol className="space-y-2">
          {sheet.steps.map((s) => (
            <li key={s.stepId} className="break-inside-avoid border-l-4 border-walnut-700 pl-2" data-testid="call-sheet-step">
              <p>
                <span className="num font-bold">
                  {s.startClock}–{s.endClock}
                </span>{" "}
                {s.title}
                {s.mustFilm ? "" : " (off camera)"}
              </p>
              {s.tools.length ? <p className="text-walnut-700">Tools: {s.tools.join(", ")}</p> : null}
              {s.shots.length ? (
                <ul className="ml-4 list-disc">
                  {s.shots.map((sh) => (
                    <li key={sh.id}>
                      {SHOT_KIND_LABELS[sh.kind as ShotKind] ?? sh.kind}: {sh.description}
                      {sh.framing ? ` · ${sh.framing}` : ""}
                    </li>
                  ))}
                </ul>
              ) : null}
              {s.cautions.map((c) => (
                <p key={c.signalWord + c.text} className={`mt-1 rounded-plank border-l-4 px-2 py-0.5 ${c.signalWord === "WARNING" ? "border-hazard-warning" : "border-hazard-caution"}`}>
                  <strong>{c.signalWord}</strong> {c.text}
                </p>
              ))}
              {s.waitAfter ? <p className="text-walnut-700">{s.waitAfter}</p> : null}
            </li>
          ))}
        </ol>
      </section>

      <section aria-labelledby="safety-h" className="break-inside-avoid">
        <h2 id="safety-h" className="font-bold">
          Safety
        </h2>
        {d.safetyNotes ? <p>{d.safetyNotes}</p> : null}
        <ul className="ml-4 list-disc">
          {sheet.generalCautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </section>
      {d.equipmentNotes ? (
        <section>
          <h2 className="font-bold">Equipment</h2>
          <p className="whitespace-pre-wrap">{d.equipmentNotes}</p>
        </section>
      ) : null}
      {d.contacts ? (
        <section>
          <h2 className="font-bold">Contacts</h2>
          <p className="whitespace-pre-wrap">{d.contacts}</p>
        </section>
      ) : null}
      <section className="print:hidden" aria-labelledby="sends-h">
        <h2 id="sends-h" className="font-bold">
          Sent
        </h2>
        <ul data-testid="call-sheet-sends">
          {sheet.sends.map((s) => (
            <li key={s.id}>
              {new Date(s.queuedAt).toLocaleString()} to {s.recipients.join(", ")}: {s.status === "sent" ? "sent" : s.status === "failed" ? `failed (${s.error})` : `queued${s.error ? ` (${s.error})` : ""}`}
            </li>
          ))}
          {sheet.sends.length ? null : <li className="text-walnut-600">Not sent yet.</li>}
        </ul>
      </section>
    </article>
  );
}
