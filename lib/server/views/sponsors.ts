import "server-only";
/** Sponsors, deals and the episode's sponsor checks as the API shows them. */
import crypto from "node:crypto";
import { DELIVERABLE_LABELS, mentionSegments, runChecks, type CheckInput, type DeliverableKind } from "../../sponsor-checks";
import { allowsDropFrame } from "../../frame-rate";
import { formatTimecode, rateOf } from "../../timecode";
import type { DealDto, DealReviewDto, GuestReviewDto, REVIEW_STATES, SponsorChecksDto, SponsorDto } from "../../schemas/sponsors";
import { scriptViewFor } from "./script";
import { db } from "../../../db/client";
import type { Deal, Episode, GuestLink, Sponsor } from "../../../db/schema";
import { dealLinks, listContactsBySponsors, listDealsByEpisode, listGuestLinks, listReviewComments, listSponsorsByChannel } from "../../../db/queries/sponsors";
import { getEpisodeById } from "../../../db/queries/episodes";
import { presignGet } from "../../../storage/presign";
import { listStepsByEpisode } from "../../../db/queries/build";
import { listToolsByChannel } from "../../../db/queries/tools";
import { listRangesByEpisode } from "../../../db/queries/coverage";
import { listClipsByEpisode } from "../../../db/queries/footage";
import { listShotsByEpisode } from "../../../db/queries/shots";
import { getPublishPackage } from "../../../db/queries/publish";
import { listMaterialsByEpisode } from "../../../db/queries/materials";
import { composeDescription, disclosureLines, materialLines, safetyLine, type DescriptionParts } from "../../publish";
import { CAUTIONS, DEFER, stepHazards } from "../../safety";
import { totalsByMaterial } from "../../materials";
import { toMaterialInput } from "./materials";
import type { PublishPackage } from "../../../db/schema";

export async function sponsorDtos(rows: Sponsor[]): Promise<SponsorDto[]> {
  const contacts = await listContactsBySponsors(db(), rows.map((r) => r.id));
  return rows.map((s) => ({
    id: s.id,
    name: s.name,
    website: s.website,
    notes: s.notes,
    contacts: contacts.filter((c) => c.sponsorId === s.id).map((c) => ({ id: c.id, name: c.name, email: c.email })),
    archivedAt: s.archivedAt ? s.archivedAt.toISOString() : null,
  }));
}

/** Deals with their links; the fee only for roles that may see it. */
export async function dealDtos(rows: Deal[], canSeeFees: boolean): Promise<DealDto[]> {
  if (!rows.length) return [];
  const [links, sponsors] = await Promise.all([dealLinks(db(), rows.map((d) => d.id)), listSponsorsByChannel({ channelId: rows[0]!.channelId, archived: true })]);
  return rows.map((d) => ({
    id: d.id,
    sponsorId: d.sponsorId,
    sponsorName: sponsors.find((s) => s.id === d.sponsorId)?.name ?? "",
    title: d.title,
    kind: d.kind,
    feeMinor: canSeeFees ? d.feeMinor : null,
    currency: d.currency,
    signedOn: d.signedOn,
    scriptDue: d.scriptDue,
    reviewDue: d.reviewDue,
    publishFrom: d.publishFrom,
    publishTo: d.publishTo,
    returnBy: d.returnBy,
    status: d.status,
    notes: d.notes,
    episodeIds: links.episodes.filter((e) => e.dealId === d.id).map((e) => e.episodeId),
    toolIds: links.tools.filter((t) => t.dealId === d.id).map((t) => t.toolId),
    deliverables: links.deliverables.filter((x) => x.dealId === d.id).map((x) => ({ id: x.id, dealId: x.dealId, kind: x.kind, seconds: x.seconds, phrases: x.phrases, url: x.url })),
  }));
}

/** The channel's tools and sponsors: read once when many episodes are checked (the board). */
export async function channelShelf(channelId: string) {
  const [tools, sponsors] = await Promise.all([listToolsByChannel({ channelId }), listSponsorsByChannel({ channelId, archived: true })]);
  return { tools, sponsors };
}

/** The package's own fields, or what a new package starts with. */
export function packageOrDefault(pkg: PublishPackage | null, episode: Episode) {
  return {
    title: pkg?.title ?? "",
    summary: pkg?.summary ?? episode.summary,
    closing: pkg?.closing ?? "",
    sections: pkg?.sections ?? { chapters: true, credits: true, materials: true, safety: true },
    thumbnailKey: pkg?.thumbnailKey ?? null,
    thumbnailAdLabel: pkg?.thumbnailAdLabel ?? false,
    scriptFinalFingerprint: pkg?.scriptFinalFingerprint ?? null,
    scriptFinalAt: pkg?.scriptFinalAt ?? null,
  };
}

/** Segment ids and versions, hashed: what "the script as marked final" means. */
export function scriptFingerprint(segments: { id: string; version: number }[]): string {
  return crypto.createHash("sha256").update(segments.map((s) => `${s.id}:${s.version}`).join(",")).digest("hex");
}

/**
 * Everything the checks read for one episode, fresh; the script view comes
 * back too for callers that need its versions. The description the checks
 * read is the one the publish package composes from the data.
 */
export async function checkInputFor(episode: Episode, shelf?: Awaited<ReturnType<typeof channelShelf>>) {
  const [view, steps, { tools, sponsors }, ranges, clips, shots, pkgRow, deals, materials] = await Promise.all([
    scriptViewFor(episode),
    listStepsByEpisode({ episodeId: episode.id }),
    shelf ?? channelShelf(episode.channelId),
    listRangesByEpisode({ episodeId: episode.id }),
    listClipsByEpisode({ episodeId: episode.id }),
    listShotsByEpisode({ episodeId: episode.id }),
    getPublishPackage({ episodeId: episode.id }),
    listDealsByEpisode({ episodeId: episode.id }),
    listMaterialsByEpisode({ episodeId: episode.id }),
  ]);
  const links = await dealLinks(db(), deals.map((d) => d.id));
  const sponsorName = new Map(sponsors.map((s) => [s.id, s.name]));
  const stepOfClip = new Map(clips.map((c) => [c.id, shots.find((s) => s.id === c.shotId)?.stepId ?? null]));
  const input: CheckInput = {
    rate: rateOf(episode.frameRate, episode.dropFrame && allowsDropFrame(episode.frameRate)),
    segments: view.segments.map((s) => ({ id: s.id, kind: s.kind, text: s.text, stepId: s.stepId, start: s.timing.start, end: s.timing.end })),
    steps: steps.map((s) => ({ id: s.id, title: s.title, toolIds: s.toolIds })),
    tools: tools.map((t) => ({ id: t.id, name: t.name, acquisition: t.acquisition, sponsorId: t.sponsorId, sponsorName: t.sponsorId ? (sponsorName.get(t.sponsorId) ?? null) : null })),
    broll: ranges.map((r) => ({ start: r.startFrame, end: r.endFrame, stepId: r.clipId ? (stepOfClip.get(r.clipId) ?? null) : null })),
    description: "",
    deals: deals.map((d) => ({ id: d.id, sponsorId: d.sponsorId, sponsorName: sponsorName.get(d.sponsorId) ?? "", kind: d.kind, toolIds: links.tools.filter((t) => t.dealId === d.id).map((t) => t.toolId) })),
    deliverables: links.deliverables.map((x) => ({ id: x.id, dealId: x.dealId, kind: x.kind, seconds: x.seconds, phrases: x.phrases, url: x.url })),
  };
  const pkg = packageOrDefault(pkgRow, episode);
  // Credits come from a first pass of the checks; the description does not change them.
  const credits = runChecks(input).credits;
  const toolName = new Map(tools.map((t) => [t.id, t.name]));
  const usedToolIds = [...new Set(steps.flatMap((s) => s.toolIds))];
  const kindOf = new Map(tools.map((t) => [t.id, t.kind]));
  const hazards = [...new Set(steps.flatMap((s) => stepHazards(s.hazards, s.toolIds.map((id) => kindOf.get(id) ?? "other"))))];
  const parts: DescriptionParts = {
    disclosures: disclosureLines(
      input.deals.map((d) => ({
        kind: d.kind,
        sponsorName: d.sponsorName,
        toolNames: d.toolIds.map((id) => toolName.get(id) ?? "").filter(Boolean),
        urls: input.deliverables.filter((x) => x.dealId === d.id && x.kind === "description_link" && x.url).map((x) => x.url!),
      })),
    ),
    summary: pkg.summary,
    chapters: view.chapters.text,
    credits: usedToolIds.flatMap((id) => {
      const credit = credits.find((c) => c.toolId === id);
      const name = toolName.get(id);
      return credit ? [credit.descriptionLine] : name ? [name] : [];
    }),
    materials: materialLines(totalsByMaterial(materials.map(toMaterialInput)).byMaterial),
    safety: safetyLine(hazards.map((h) => CAUTIONS[h].title), DEFER),
    closing: pkg.closing,
    sections: pkg.sections,
  };
  input.description = composeDescription(parts);
  return { input, view, parts, pkg, shots, deals, ranges };
}

export async function sponsorChecksFor(episode: Episode, shelf?: Awaited<ReturnType<typeof channelShelf>>): Promise<SponsorChecksDto> {
  const { input } = await checkInputFor(episode, shelf);
  const report = runChecks(input);
  const dealSponsor = new Map(input.deals.map((d) => [d.id, d.sponsorName]));
  return {
    state: report.state,
    credits: report.credits,
    results: report.results.map((r) => ({
      ...r,
      label: r.kind === "undisclosed_connection" ? "Material connection disclosed in the video" : DELIVERABLE_LABELS[r.kind as DeliverableKind],
      sponsorName: r.dealId ? (dealSponsor.get(r.dealId) ?? null) : (input.tools.find((t) => t.id === r.toolId)?.sponsorName ?? null),
    })),
  };
}

/** The deal's mention segments in every episode of the deal, with the fingerprint of their versions. */
export async function dealScript(deal: Deal) {
  const links = await dealLinks(db(), [deal.id]);
  const episodeIds = links.episodes.map((e) => e.episodeId);
  const out: { episode: Episode; input: CheckInput; mentions: CheckInput["segments"]; versions: string[] }[] = [];
  for (const id of episodeIds) {
    const episode = await getEpisodeById({ id });
    if (!episode) continue;
    const { input, view } = await checkInputFor(episode);
    const d = input.deals.find((x) => x.id === deal.id);
    if (!d) continue;
    const mentions = mentionSegments(d, input.segments, input.tools);
    out.push({ episode, input, mentions, versions: mentions.map((m) => `${m.id}:${view.segments.find((s) => s.id === m.id)?.version ?? 0}`) });
  }
  const fingerprint = crypto.createHash("sha256").update(out.flatMap((o) => o.versions).sort().join(",")).digest("hex");
  return { parts: out, fingerprint };
}

/** Where the review stands: the last decision, reopened when the script changed after it. */
export function reviewState(comments: { comment: { decision: string | null; scriptFingerprint: string } }[], links: number, fingerprint: string): (typeof REVIEW_STATES)[number] {
  const last = [...comments].reverse().find((c) => c.comment.decision);
  if (!last) return links ? "waiting" : "not_sent";
  if (last.comment.scriptFingerprint !== fingerprint) return "reopened";
  return last.comment.decision as "approved" | "changes_requested";
}

function threadOf(rows: Awaited<ReturnType<typeof listReviewComments>>, sponsorName: string, fingerprint: string) {
  return rows.map((r) => ({
    id: r.comment.id,
    from: r.comment.userId ? (r.userName ?? "team") : `${sponsorName} (review link)`,
    decision: r.comment.decision ?? null,
    body: r.comment.body,
    createdAt: r.comment.createdAt.toISOString(),
    current: r.comment.scriptFingerprint === fingerprint,
  }));
}

/** A sponsor contact's view through a review link: this deal's segments, checks and clips, nothing else of the channel. */
export async function guestReviewFor(deal: Deal, link: GuestLink): Promise<GuestReviewDto> {
  const [{ parts, fingerprint }, comments, links, sponsors] = await Promise.all([dealScript(deal), listReviewComments({ dealId: deal.id }), listGuestLinks({ dealId: deal.id }), listSponsorsByChannel({ channelId: deal.channelId, archived: true })]);
  const sponsorName = sponsors.find((s) => s.id === deal.sponsorId)?.name ?? "";
  const episodes = await Promise.all(
    parts.map(async ({ episode, input, mentions }) => {
      const tc = (f: number) => formatTimecode(f, input.rate);
      const report = runChecks({ ...input, deals: input.deals.filter((d) => d.id === deal.id), deliverables: input.deliverables.filter((d) => d.dealId === deal.id) });
      const dealToolIds = input.deals.find((d) => d.id === deal.id)?.toolIds ?? [];
      const stepIds = new Set(input.steps.filter((s) => s.toolIds.some((t) => dealToolIds.includes(t))).map((s) => s.id));
      const [clips, shots] = await Promise.all([listClipsByEpisode({ episodeId: episode.id }), listShotsByEpisode({ episodeId: episode.id })]);
      const relevant = clips.filter((c) => c.state === "stored" && c.shotId && stepIds.has(shots.find((s) => s.id === c.shotId)?.stepId ?? ""));
      return {
        title: episode.title,
        segments: mentions.map((m) => ({ id: m.id, kind: m.kind, text: m.text, start: tc(m.start), end: tc(m.end), seconds: Math.round(((m.end - m.start) * input.rate.den * 10) / input.rate.num) / 10 })),
        checks: report.results.filter((r) => r.dealId === deal.id && r.deliverableId).map((r) => ({ label: DELIVERABLE_LABELS[r.kind as DeliverableKind], pass: r.pass, message: r.message })),
        clips: await Promise.all(relevant.map(async (c) => ({ id: c.id, name: c.originalName, url: await presignGet(c.storageKey, 10 * 60) }))),
      };
    }),
  );
  return { sponsorName, dealTitle: deal.title, episodes, state: reviewState(comments, links.length, fingerprint), thread: threadOf(comments, sponsorName, fingerprint), expiresAt: link.expiresAt.toISOString() };
}

export async function dealReviewFor(deal: Deal): Promise<DealReviewDto> {
  const [{ fingerprint }, comments, links, sponsors] = await Promise.all([dealScript(deal), listReviewComments({ dealId: deal.id }), listGuestLinks({ dealId: deal.id }), listSponsorsByChannel({ channelId: deal.channelId, archived: true })]);
  const sponsorName = sponsors.find((s) => s.id === deal.sponsorId)?.name ?? "";
  return {
    state: reviewState(comments, links.length, fingerprint),
    thread: threadOf(comments, sponsorName, fingerprint),
    links: links.map((l) => ({ id: l.id, contactEmail: l.contactEmail, expiresAt: l.expiresAt.toISOString(), revokedAt: l.revokedAt ? l.revokedAt.toISOString() : null, createdAt: l.createdAt.toISOString() })),
  };
}
