import "server-only";
/** The publish package as the API shows it: the composed description, its limits and the checklist. */
import { runChecks } from "../../sponsor-checks";
import { DELIVERABLE_LABELS, type DeliverableKind } from "../../sponsor-checks";
import { DESCRIPTION_MAX_BYTES, THUMBNAIL_MAX_BYTES, TITLE_MAX_CHARS, checkTexts, needsUpFrontLabel, publishChecklist, titleCarriesAdLabel } from "../../publish";
import type { PublishDto } from "../../schemas/publish";
import type { Episode } from "../../../db/schema";
import { listPublishOverrides } from "../../../db/queries/publish";
import { presignGet } from "../../../storage/presign";
import { checkInputFor, dealReviewFor, scriptFingerprint } from "./sponsors";
import { coverageOf } from "./coverage";
import { getChannelById } from "../../../db/queries/channels";
import { listGapsByEpisode } from "../../../db/queries/coverage";

/** Everything the checklist reads, computed fresh. */
export async function publishViewFor(episode: Episode): Promise<PublishDto> {
  const [{ input, view, parts, pkg, shots, deals, ranges }, channel, stored, overrides] = await Promise.all([
    checkInputFor(episode),
    getChannelById({ id: episode.channelId }),
    listGapsByEpisode({ episodeId: episode.id }),
    listPublishOverrides({ episodeId: episode.id }),
  ]);
  // Coverage from the script view and ranges the checks already read.
  const coverage = coverageOf(episode, channel!, view, ranges, stored, new Map(shots.filter((s) => s.gapId).map((s) => [s.gapId!, s.id])));
  const report = runChecks(input);
  const live = deals.filter((d) => d.status !== "cancelled");
  const reviews = await Promise.all(live.map(async (d) => ({ deal: d, review: await dealReviewFor(d) })));
  const dealSponsor = new Map(input.deals.map((d) => [d.id, d.sponsorName]));
  const texts = checkTexts(pkg.title, input.description);
  const adLabel = { needed: needsUpFrontLabel(live.map((d) => d.kind)), inTitle: titleCarriesAdLabel(pkg.title), onThumbnail: Boolean(pkg.thumbnailKey) && pkg.thumbnailAdLabel };
  const current = scriptFingerprint(view.segments);
  const chapterProblems = [...view.chapters.problems, ...view.chapters.chapters.flatMap((c) => c.problems.map((p) => `${c.line}: ${p}`))];
  const checklist = publishChecklist({
    script: { segments: view.segments.length, markedFinal: Boolean(pkg.scriptFinalFingerprint), changedSince: Boolean(pkg.scriptFinalFingerprint) && pkg.scriptFinalFingerprint !== current },
    shots: { total: shots.length, open: shots.filter((s) => s.status === "planned").length },
    openGaps: coverage.openGaps,
    sponsorChecks: report.results.map((r) => ({
      pass: r.pass,
      label: r.kind === "undisclosed_connection" ? "material connection not disclosed in the video" : DELIVERABLE_LABELS[r.kind as DeliverableKind].toLowerCase(),
      sponsorName: r.dealId ? (dealSponsor.get(r.dealId) ?? null) : null,
    })),
    approvals: reviews.map(({ deal, review }) => ({ dealTitle: deal.title, sponsorName: dealSponsor.get(deal.id) ?? "", state: review.state })),
    texts,
    chaptersValid: view.chapters.valid,
    chapterProblems,
    thumbnail: Boolean(pkg.thumbnailKey),
    adLabel,
  });
  return {
    stage: episode.stage,
    package: {
      title: pkg.title,
      summary: pkg.summary,
      closing: pkg.closing,
      sections: pkg.sections,
      thumbnailUrl: pkg.thumbnailKey ? await presignGet(pkg.thumbnailKey) : null,
      thumbnailAdLabel: pkg.thumbnailAdLabel,
      scriptFinalAt: pkg.scriptFinalAt ? pkg.scriptFinalAt.toISOString() : null,
    },
    parts: { disclosures: parts.disclosures, chapters: parts.chapters, credits: parts.credits, materials: parts.materials, safety: parts.safety },
    description: input.description,
    texts,
    chapters: { valid: view.chapters.valid, problems: view.chapters.problems, lines: view.chapters.chapters.map((c) => ({ line: c.line, problems: c.problems })) },
    adLabel,
    checklist,
    overrides: overrides.map((o) => ({ id: o.override.id, userName: o.userName, reason: o.override.reason, failing: o.override.failing, createdAt: o.override.createdAt.toISOString() })),
    limits: { titleMaxChars: TITLE_MAX_CHARS, descriptionMaxBytes: DESCRIPTION_MAX_BYTES, thumbnailMaxBytes: THUMBNAIL_MAX_BYTES },
  };
}
