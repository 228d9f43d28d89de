/**
 * Sponsor checks: every promise in a deal, and every material connection,
 * checked against the timed script, the build plan and the B-roll on the
 * timeline, with the segments and timecodes as evidence. Pure, no I/O.
 *
 * The disclosure rules follow regulator guidance:
 *  - 16 CFR 255.5 (FTC Endorsement Guides, 2023): a material connection
 *    (payment, or a free or lent product) must be disclosed, whether or not
 *    the sponsor asked for a mention: a gifted or loaned tool needs it too;
 *  - 16 CFR 255.0(f): a disclosure must be difficult to miss and easy to
 *    understand;
 *  - FTC "Disclosures 101 for Social Media Influencers": in the video itself,
 *    not only in the description, said and shown, early rather than at the
 *    end, in plain words such as "Ad", "Sponsored" or "Thanks to [brand] for
 *    the free product";
 *  - ASA/CAP with CMA, "Influencers' guide to making clear that ads are ads"
 *    (3rd ed., 2023): labelled up front; vague labels such as "gift",
 *    "collab" or "spon" are not enough.
 * A tool the channel bought itself needs no disclosure.
 */
import type { SegmentKind } from "./script-timing";
import { formatTimecode, type Rate } from "./timecode";

export const DEAL_KINDS = ["paid_integration", "gifted_tool", "loaned_tool", "affiliate"] as const;
export type DealKind = (typeof DEAL_KINDS)[number];
export const DEAL_KIND_LABELS: Record<DealKind, string> = { paid_integration: "Paid integration", gifted_tool: "Gifted tool", loaned_tool: "Loaned tool", affiliate: "Affiliate" };

export const DELIVERABLE_KINDS = ["mention_min_seconds", "mention_max_seconds", "mention_before", "talking_points", "spoken_disclosure", "onscreen_disclosure", "description_link", "tool_credit"] as const;
export type DeliverableKind = (typeof DELIVERABLE_KINDS)[number];
export const DELIVERABLE_LABELS: Record<DeliverableKind, string> = {
  mention_min_seconds: "Spoken mention at least",
  mention_max_seconds: "Spoken mention at most",
  mention_before: "Mention starts before",
  talking_points: "Talking points in the read",
  spoken_disclosure: "Disclosure said at or before the first mention",
  onscreen_disclosure: "Disclosure shown on screen at the start",
  description_link: "Link and written disclosure in the description",
  tool_credit: "On-screen credit while the tool is in use",
};

/** How early "at the start" is for the on-screen label: the first 30 s (common practice, no published source; the guides say "up front"). */
export const ONSCREEN_START_SECONDS = 30;

export interface CheckSegment {
  id: string;
  kind: SegmentKind;
  text: string;
  stepId: string | null;
  /** Frames at the episode's rate. */
  start: number;
  end: number;
}

export interface CheckDeal {
  id: string;
  sponsorId: string;
  sponsorName: string;
  kind: DealKind;
  toolIds: string[];
}

export interface CheckDeliverable {
  id: string;
  dealId: string;
  kind: DeliverableKind;
  seconds?: number | null;
  phrases?: string[];
  url?: string | null;
}

export interface CheckInput {
  rate: Rate;
  segments: CheckSegment[];
  steps: { id: string; title: string; toolIds: string[] }[];
  tools: { id: string; name: string; acquisition: "bought" | "gifted" | "loaned" | "paid_placement"; sponsorId: string | null; sponsorName: string | null }[];
  /** B-roll on the timeline with the build step its shot belongs to (if any). */
  broll: { start: number; end: number; stepId: string | null }[];
  description: string;
  deals: CheckDeal[];
  deliverables: CheckDeliverable[];
}

export interface Evidence {
  segmentId?: string;
  start?: string;
  end?: string;
  phrase?: string;
  found?: boolean;
  note?: string;
}

export interface CheckResult {
  deliverableId: string | null;
  dealId: string | null;
  toolId?: string;
  kind: DeliverableKind | "undisclosed_connection";
  pass: boolean;
  message: string;
  source: string;
  evidence: Evidence[];
}

export interface ToolCredit {
  toolId: string;
  name: string;
  sponsorName: string | null;
  acquisition: string;
  appearances: { start: string; end: string }[];
  descriptionLine: string;
  onScreen: string;
}

export interface CheckReport {
  results: CheckResult[];
  credits: ToolCredit[];
  /** For the board card: nothing to check, all met, open items, or a connection left undisclosed. */
  state: "none" | "met" | "open" | "blocked";
}

const SPOKEN: SegmentKind[] = ["to_camera", "voice_over", "sponsor_read"];
const SRC = {
  cfr2555: "16 CFR 255.5 (material connections must be disclosed)",
  cfr2550f: "16 CFR 255.0(f) (difficult to miss, easy to understand)",
  ftc101: 'FTC "Disclosures 101 for Social Media Influencers"',
  asa: 'ASA/CAP "Influencers\' guide to making clear that ads are ads" (2023)',
  deal: "the deal's terms",
};

/** Lower case, punctuation to spaces, one space: so "Brindle Clamp Co." finds "brindle clamp co". */
export function normalize(text: string): string {
  return ` ${text
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[^a-z0-9]+/g, " ")
    .trim()} `;
}

function contains(text: string, phrase: string): boolean {
  const p = normalize(phrase);
  return p.trim().length > 0 && normalize(text).includes(p);
}

/** Clear disclosure wording (FTC: "Ad", "Sponsored", "Thanks to [brand] for the free product"; ASA/CAP: "Ad" up front). */
const CLEAR = [
  /\bad\b/,
  /\badvert\b/,
  /\badvertisement\b/,
  /\badvertising\b/,
  /\bsponsored\b/,
  /\bsponsorship\b/,
  /\bpaid (partnership|promotion|placement|ad)\b/,
  /\b(sent|gave|given|lent|loaned|provided) (it |this |them |these )?(to )?(me|us|the channel)\b/,
  /\b(lent|loaned|given|provided) (to|by)\b/,
  /\bfor (the )?free\b|\bfree (product|tool|sample|of charge)\b/,
  /\bthanks to .+ for (the )?(free|loan)/,
];
/** Vague labels that do not disclose on their own (ASA/CAP). */
const VAGUE = [/\bgift(ed)?\b/, /\bcollab\b/, /\bspon\b/];

export function disclosureIn(text: string): { clear: boolean; vague: boolean } {
  const t = normalize(text);
  return { clear: CLEAR.some((r) => r.test(t)), vague: VAGUE.some((r) => r.test(t)) };
}

export function runChecks(input: CheckInput): CheckReport {
  const { rate } = input;
  const tc = (f: number) => formatTimecode(f, rate);
  const seconds = (frames: number) => (frames * rate.den) / rate.num;
  const framesOf = (s: number) => Math.round((s * rate.num) / rate.den);
  const ev = (s: CheckSegment, extra: Partial<Evidence> = {}): Evidence => ({ segmentId: s.id, start: tc(s.start), end: tc(s.end), ...extra });
  const toolById = new Map(input.tools.map((t) => [t.id, t]));
  const spoken = input.segments.filter((s) => SPOKEN.includes(s.kind));
  const onScreen = input.segments.filter((s) => s.kind === "on_screen_text");
  const results: CheckResult[] = [];

  const mentionsOf = (deal: CheckDeal) => mentionSegments(deal, input.segments, input.tools);

  for (const d of input.deliverables) {
    const deal = input.deals.find((x) => x.id === d.dealId);
    if (!deal) continue;
    const mentions = mentionsOf(deal);
    const first = mentions[0] ?? null;
    const mentionSeconds = mentions.reduce((a, s) => a + seconds(s.end - s.start), 0);
    const base = { deliverableId: d.id, dealId: deal.id, kind: d.kind } as const;
    const noMention = { ...base, pass: false, source: SRC.deal, message: `${deal.sponsorName} is never mentioned in a spoken segment.`, evidence: [] as Evidence[] };
    switch (d.kind) {
      case "mention_min_seconds":
      case "mention_max_seconds": {
        const limit = d.seconds ?? 0;
        if (!mentions.length) {
          results.push(d.kind === "mention_max_seconds" ? { ...base, pass: true, source: SRC.deal, message: `No spoken mention of ${deal.sponsorName}, so none runs long.`, evidence: [] } : noMention);
          break;
        }
        const pass = d.kind === "mention_min_seconds" ? mentionSeconds >= limit : mentionSeconds <= limit;
        results.push({
          ...base,
          pass,
          source: SRC.deal,
          message: `The spoken mention runs ${mentionSeconds.toFixed(1)} s; the deal asks for ${d.kind === "mention_min_seconds" ? "at least" : "at most"} ${limit} s.`,
          evidence: mentions.map((s) => ev(s)),
        });
        break;
      }
      case "mention_before": {
        const limit = d.seconds ?? 0;
        if (!first) {
          results.push(noMention);
          break;
        }
        const pass = first.start < framesOf(limit);
        results.push({ ...base, pass, source: SRC.deal, message: `The first mention starts at ${tc(first.start)}; the deal asks for it before ${tc(framesOf(limit))}.`, evidence: [ev(first)] });
        break;
      }
      case "talking_points": {
        const phrases = d.phrases ?? [];
        const evidence = phrases.map((p) => {
          const where = mentions.find((s) => contains(s.text, p));
          return where ? ev(where, { phrase: p, found: true }) : { phrase: p, found: false };
        });
        const missing = evidence.filter((e) => !e.found).map((e) => `“${e.phrase}”`);
        results.push({ ...base, pass: missing.length === 0 && mentions.length > 0, source: SRC.deal, message: !mentions.length ? noMention.message : missing.length ? `Missing from the read: ${missing.join(", ")}.` : "Every talking point is in the read.", evidence });
        break;
      }
      case "spoken_disclosure": {
        if (!first) {
          results.push({ ...noMention, source: SRC.ftc101 });
          break;
        }
        const before = spoken.filter((s) => s.start <= first.start || s.id === first.id);
        const said = before.find((s) => disclosureIn(s.text).clear);
        const vague = !said && before.find((s) => disclosureIn(s.text).vague);
        results.push({
          ...base,
          pass: Boolean(said),
          source: `${SRC.ftc101}; ${SRC.cfr2550f}`,
          message: said ? `Said at ${tc(said.start)}, at or before the first mention (${tc(first.start)}).` : vague ? `Only a vague label before the first mention at ${tc(first.start)} ("gift", "collab" and "spon" do not disclose; say "Ad", "Sponsored" or who paid or lent it).` : `No clear disclosure is said at or before the first mention at ${tc(first.start)}.`,
          evidence: said ? [ev(said, { note: "disclosure" }), ev(first, { note: "first mention" })] : [ev(first, { note: "first mention" }), ...(vague ? [ev(vague, { note: "vague label" })] : [])],
        });
        break;
      }
      case "onscreen_disclosure": {
        const within = framesOf(d.seconds ?? ONSCREEN_START_SECONDS);
        const shown = onScreen.find((s) => s.start <= within && disclosureIn(s.text).clear);
        const late = !shown && onScreen.find((s) => disclosureIn(s.text).clear);
        results.push({
          ...base,
          pass: Boolean(shown),
          source: `${SRC.asa}; ${SRC.ftc101}`,
          message: shown ? `Shown on screen at ${tc(shown.start)}.` : late ? `Shown only at ${tc(late.start)}, after the start (${tc(within)}); show it up front.` : `No on-screen disclosure ("Ad", "Sponsored") in the first ${Math.round(seconds(within))} s.`,
          evidence: shown ? [ev(shown)] : late ? [ev(late, { note: "too late" })] : [],
        });
        break;
      }
      case "description_link": {
        const url = d.url ?? "";
        const hasUrl = url ? input.description.includes(url) : false;
        const written = disclosureIn(input.description).clear;
        results.push({
          ...base,
          pass: hasUrl && written,
          source: `${SRC.ftc101} (the description is in addition to, not instead of, the video)`,
          message: hasUrl && written ? "The description has the link and a written disclosure." : [!hasUrl ? `the link ${url || "(none set)"} is not in the description` : "", !written ? "the description has no written disclosure" : ""].filter(Boolean).join("; ").replace(/^./, (c) => c.toUpperCase()) + ".",
          evidence: [{ phrase: url, found: hasUrl }, { phrase: "written disclosure", found: written }],
        });
        break;
      }
      case "tool_credit": {
        for (const toolId of deal.toolIds) {
          const tool = toolById.get(toolId);
          if (!tool) continue;
          const uses = appearances(input, toolId);
          const uncovered = uses.filter((u) => !onScreen.some((s) => s.start < u.end && u.start < s.end && (contains(s.text, tool.name) || contains(s.text, deal.sponsorName))));
          results.push({
            ...base,
            toolId,
            pass: uses.length > 0 && uncovered.length === 0,
            source: SRC.deal,
            message: !uses.length ? `${tool.name} does not appear on the timeline yet (no segment or B-roll of a step that uses it).` : uncovered.length ? `${tool.name} is in use without an on-screen credit at ${uncovered.map((u) => `${tc(u.start)}–${tc(u.end)}`).join(", ")}.` : `${tool.name} is credited on screen every time it is in use.`,
            evidence: uses.map((u) => ({ start: tc(u.start), end: tc(u.end), found: !uncovered.includes(u), note: tool.name })),
          });
        }
        break;
      }
    }
  }

  // Any gifted, loaned or paid tool used in the episode needs a disclosure in the video, deal or no deal (16 CFR 255.5).
  const usedTools = new Set(input.steps.flatMap((s) => s.toolIds));
  for (const tool of input.tools) {
    if (tool.acquisition === "bought" || !usedTools.has(tool.id)) continue;
    const names = [tool.name, tool.sponsorName ?? ""].filter(Boolean);
    const inVideo = [...spoken, ...onScreen].filter((s) => names.some((n) => contains(s.text, n)));
    const disclosed = inVideo.find((s) => disclosureIn(s.text).clear) ?? null;
    const anyDisclosure = [...spoken, ...onScreen].find((s) => disclosureIn(s.text).clear && names.some((n) => contains(s.text, n)));
    const ok = Boolean(disclosed || anyDisclosure);
    results.push({
      deliverableId: null,
      dealId: input.deals.find((d) => d.toolIds.includes(tool.id))?.id ?? null,
      toolId: tool.id,
      kind: "undisclosed_connection",
      pass: ok,
      source: SRC.cfr2555,
      message: ok
        ? `${tool.name} (${tool.acquisition === "paid_placement" ? "paid placement" : tool.acquisition}${tool.sponsorName ? `, ${tool.sponsorName}` : ""}) is disclosed in the video at ${tc((disclosed ?? anyDisclosure)!.start)}.`
        : `${tool.name} is ${tool.acquisition === "paid_placement" ? "a paid placement" : tool.acquisition}${tool.sponsorName ? ` by ${tool.sponsorName}` : ""} and used in this build, but the video never says so. Say and show it ("${tool.sponsorName ?? "The maker"} lent us this ${tool.name}", "Ad").`,
      evidence: ok ? [ev((disclosed ?? anyDisclosure)!)] : inVideo.map((s) => ev(s, { note: "mentioned without a disclosure" })),
    });
  }

  const credits: ToolCredit[] = input.tools
    .filter((t) => t.acquisition !== "bought" && usedTools.has(t.id))
    .map((t) => {
      const uses = appearances(input, t.id);
      const how = t.acquisition === "gifted" ? "given to the channel" : t.acquisition === "loaned" ? "lent to the channel" : "paid placement";
      return {
        toolId: t.id,
        name: t.name,
        sponsorName: t.sponsorName,
        acquisition: t.acquisition,
        appearances: uses.map((u) => ({ start: tc(u.start), end: tc(u.end) })),
        descriptionLine: `${t.name}${t.sponsorName ? ` from ${t.sponsorName}` : ""}: ${how}${uses[0] ? ` (first seen at ${tc(uses[0].start)})` : ""}.`,
        onScreen: `${t.name}${t.sponsorName ? ` · ${t.sponsorName}` : ""} · ${t.acquisition === "paid_placement" ? "Ad" : t.acquisition === "loaned" ? "Loaned to us" : "Given to us"}`,
      };
    });

  const undisclosed = results.some((r) => r.kind === "undisclosed_connection" && !r.pass);
  const state: CheckReport["state"] = results.length === 0 ? "none" : undisclosed ? "blocked" : results.every((r) => r.pass) ? "met" : "open";
  return { results, credits, state };
}

/** A deal's spoken mentions: segments naming the sponsor, and sponsor reads naming one of the deal's tools. */
export function mentionSegments(deal: CheckDeal, segments: CheckSegment[], tools: CheckInput["tools"]): CheckSegment[] {
  const names = [deal.sponsorName, ...deal.toolIds.map((t) => tools.find((x) => x.id === t)?.name ?? "")].filter(Boolean);
  return segments.filter((s) => SPOKEN.includes(s.kind) && (contains(s.text, deal.sponsorName) || (s.kind === "sponsor_read" && names.some((n) => contains(s.text, n)))));
}

/** Where a tool is on the timeline: segments of steps that use it, and B-roll of those steps' shots, merged. */
export function appearances(input: Pick<CheckInput, "segments" | "steps" | "broll">, toolId: string): { start: number; end: number }[] {
  const steps = new Set(input.steps.filter((s) => s.toolIds.includes(toolId)).map((s) => s.id));
  const ranges = [...input.segments.filter((s) => s.stepId && steps.has(s.stepId)).map((s) => ({ start: s.start, end: s.end })), ...input.broll.filter((b) => b.stepId && steps.has(b.stepId)).map((b) => ({ start: b.start, end: b.end }))].sort((a, b) => a.start - b.start);
  const out: { start: number; end: number }[] = [];
  for (const r of ranges) {
    const last = out.at(-1);
    if (last && r.start <= last.end) last.end = Math.max(last.end, r.end);
    else out.push({ ...r });
  }
  return out;
}
