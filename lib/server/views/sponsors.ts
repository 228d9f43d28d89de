import "server-only";
/** Sponsors, deals and the episode's sponsor checks as the API shows them. */
import { eq } from "drizzle-orm";
import { DELIVERABLE_LABELS, runChecks, type CheckInput, type DeliverableKind } from "../../sponsor-checks";
import { allowsDropFrame } from "../../frame-rate";
import { rateOf } from "../../timecode";
import type { DealDto, SponsorChecksDto, SponsorDto } from "../../schemas/sponsors";
import { scriptViewFor } from "./script";
import { db } from "../../../db/client";
import { publishPackages, type Deal, type Episode, type Sponsor } from "../../../db/schema";
import { dealLinks, listContactsBySponsors, listDealsByEpisode, listSponsorsByChannel } from "../../../db/queries/sponsors";
import { listStepsByEpisode } from "../../../db/queries/build";
import { listToolsByChannel } from "../../../db/queries/tools";
import { listRangesByEpisode } from "../../../db/queries/coverage";
import { listClipsByEpisode } from "../../../db/queries/footage";
import { listShotsByEpisode } from "../../../db/queries/shots";

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

/** Everything the checks read for one episode, fresh. */
export async function checkInputFor(episode: Episode): Promise<{ input: CheckInput; sponsorNames: Map<string, string> }> {
  const [view, steps, tools, sponsors, ranges, clips, shots, pkg, deals] = await Promise.all([
    scriptViewFor(episode),
    listStepsByEpisode({ episodeId: episode.id }),
    listToolsByChannel({ channelId: episode.channelId }),
    listSponsorsByChannel({ channelId: episode.channelId, archived: true }),
    listRangesByEpisode({ episodeId: episode.id }),
    listClipsByEpisode({ episodeId: episode.id }),
    listShotsByEpisode({ episodeId: episode.id }),
    db().select({ description: publishPackages.description }).from(publishPackages).where(eq(publishPackages.episodeId, episode.id)).limit(1),
    listDealsByEpisode({ episodeId: episode.id }),
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
    description: pkg[0]?.description ?? "",
    deals: deals.map((d) => ({ id: d.id, sponsorId: d.sponsorId, sponsorName: sponsorName.get(d.sponsorId) ?? "", kind: d.kind, toolIds: links.tools.filter((t) => t.dealId === d.id).map((t) => t.toolId) })),
    deliverables: links.deliverables.map((x) => ({ id: x.id, dealId: x.dealId, kind: x.kind, seconds: x.seconds, phrases: x.phrases, url: x.url })),
  };
  return { input, sponsorNames: sponsorName };
}

export async function sponsorChecksFor(episode: Episode): Promise<SponsorChecksDto> {
  const { input } = await checkInputFor(episode);
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
