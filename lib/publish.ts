/**
 * The publish package, pure: the video description composed from the
 * episode's data, the limits it must meet, and the checklist that gates the
 * move to "published".
 *
 * Limits are the large video platform's published API reference
 * (developers.google.com/youtube/v3/docs/videos, snippet.title and
 * snippet.description; .../docs/thumbnails/set for the thumbnail): a title of
 * at most 100 characters, a description of at most 5,000 bytes, neither
 * containing "<" or ">"; a thumbnail image of at most 2 MB, JPEG or PNG.
 */

export const TITLE_MAX_CHARS = 100;
export const DESCRIPTION_MAX_BYTES = 5000;
export const THUMBNAIL_MAX_BYTES = 2 * 1024 * 1024;
export const THUMBNAIL_TYPES = ["image/jpeg", "image/png"] as const;
export type ThumbnailType = (typeof THUMBNAIL_TYPES)[number];

/** Deal kinds that are advertising, so the "Ad" label must be seen before a viewer clicks (ASA/CAP influencers' guide, 3rd ed. 2023: title or thumbnail for video). */
export const UP_FRONT_LABEL_KINDS = ["paid_integration", "affiliate"] as const;

export interface DescriptionSections {
  chapters: boolean;
  credits: boolean;
  materials: boolean;
  safety: boolean;
}

export interface DescriptionParts {
  /** One line per deal or connection, always first: 16 CFR 255.0(f) asks for a disclosure that is difficult to miss. */
  disclosures: string[];
  summary: string;
  chapters: string;
  credits: string[];
  materials: string[];
  safety: string | null;
  closing: string;
  sections: DescriptionSections;
}

/** The description as it will be pasted: blocks separated by a blank line, empty blocks left out. */
export function composeDescription(p: DescriptionParts): string {
  const blocks: string[] = [];
  if (p.disclosures.length) blocks.push(p.disclosures.join("\n"));
  if (p.summary.trim()) blocks.push(p.summary.trim());
  if (p.sections.chapters && p.chapters.trim()) blocks.push(`Chapters\n${p.chapters.trim()}`);
  if (p.sections.credits && p.credits.length) blocks.push(`Tools in this build\n${p.credits.join("\n")}`);
  if (p.sections.materials && p.materials.length) blocks.push(`Materials\n${p.materials.join("\n")}`);
  if (p.sections.safety && p.safety) blocks.push(p.safety);
  if (p.closing.trim()) blocks.push(p.closing.trim());
  return blocks.join("\n\n");
}

/** UTF-8 length, which is what the description limit counts. */
export function utf8Bytes(text: string): number {
  return new TextEncoder().encode(text).length;
}

/** Characters as a person counts them (code points, so an emoji is one). */
export function charCount(text: string): number {
  return [...text].length;
}

export interface FieldProblem {
  field: "title" | "description" | "chapters" | "thumbnail";
  message: string;
}

export interface TextReport {
  titleChars: number;
  descriptionBytes: number;
  descriptionChars: number;
  problems: FieldProblem[];
}

/** Title and description against the platform's limits. */
export function checkTexts(title: string, description: string): TextReport {
  const problems: FieldProblem[] = [];
  const titleChars = charCount(title);
  const descriptionBytes = utf8Bytes(description);
  if (!title.trim()) problems.push({ field: "title", message: "the title is empty" });
  if (titleChars > TITLE_MAX_CHARS) problems.push({ field: "title", message: `the title has ${titleChars} characters; the limit is ${TITLE_MAX_CHARS}` });
  if (/[<>]/.test(title)) problems.push({ field: "title", message: 'the title may not contain "<" or ">"' });
  if (descriptionBytes > DESCRIPTION_MAX_BYTES) problems.push({ field: "description", message: `the description is ${descriptionBytes} bytes; the limit is ${DESCRIPTION_MAX_BYTES}` });
  if (/[<>]/.test(description)) problems.push({ field: "description", message: 'the description may not contain "<" or ">"' });
  return { titleChars, descriptionBytes, descriptionChars: charCount(description), problems };
}

/** "Ad", "Advert" or "Advertisement" as a word of the title (ASA/CAP's accepted label; "gift" or "spon" are not enough). */
export function titleCarriesAdLabel(title: string): boolean {
  return /(^|[^\p{L}\p{N}])(ad|advert|advertisement)(?![\p{L}\p{N}])/iu.test(title);
}

export function needsUpFrontLabel(dealKinds: readonly string[]): boolean {
  return dealKinds.some((k) => (UP_FRONT_LABEL_KINDS as readonly string[]).includes(k));
}

/* ───────────── checklist ───────────── */

export const CHECKLIST_KEYS = ["script_final", "shots_done", "gaps_closed", "sponsor_checks", "sponsor_approvals", "description_valid", "title_thumbnail"] as const;
export type ChecklistKey = (typeof CHECKLIST_KEYS)[number];

/** Where each item is put right, as an episode tab. */
export const CHECKLIST_FIX: Record<ChecklistKey, string> = {
  script_final: "script",
  shots_done: "shots",
  gaps_closed: "coverage",
  sponsor_checks: "sponsors",
  sponsor_approvals: "sponsors",
  description_valid: "publish",
  title_thumbnail: "publish",
};

export interface ChecklistInput {
  script: { segments: number; markedFinal: boolean; changedSince: boolean };
  shots: { total: number; open: number };
  openGaps: number;
  sponsorChecks: { pass: boolean; label: string; sponsorName: string | null }[];
  approvals: { dealTitle: string; sponsorName: string; state: string }[];
  texts: TextReport;
  chaptersValid: boolean;
  chapterProblems: string[];
  thumbnail: boolean;
  adLabel: { needed: boolean; inTitle: boolean; onThumbnail: boolean };
}

export interface ChecklistItem {
  key: ChecklistKey;
  label: string;
  pass: boolean;
  detail: string;
  tab: string;
  /** An action the publish page offers right on the item. */
  action: "mark_final" | null;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function publishChecklist(i: ChecklistInput): { items: ChecklistItem[]; pass: boolean; failing: ChecklistKey[] } {
  const item = (key: ChecklistKey, label: string, pass: boolean, detail: string): ChecklistItem => ({ key, label, pass, detail, tab: CHECKLIST_FIX[key], action: key === "script_final" && !pass && i.script.segments > 0 ? "mark_final" : null });
  const failingChecks = i.sponsorChecks.filter((c) => !c.pass);
  const unapproved = i.approvals.filter((a) => a.state !== "approved");
  const descProblems = [...i.texts.problems.filter((p) => p.field === "description").map((p) => p.message), ...(i.chaptersValid ? [] : i.chapterProblems.length ? i.chapterProblems : ["the chapters are not valid"])];
  const titleProblems = i.texts.problems.filter((p) => p.field === "title").map((p) => p.message);
  if (!i.thumbnail) titleProblems.push("no thumbnail uploaded");
  if (i.adLabel.needed && !i.adLabel.inTitle && !i.adLabel.onThumbnail) titleProblems.push('a paid or affiliate deal needs "Ad" in the title or on the thumbnail');
  const items = [
    item(
      "script_final",
      "Script marked final",
      i.script.segments > 0 && i.script.markedFinal && !i.script.changedSince,
      i.script.segments === 0 ? "the script has no segments" : !i.script.markedFinal ? "not marked final yet" : i.script.changedSince ? "edited after it was marked final; mark it final again" : "final, unchanged since",
    ),
    item("shots_done", "Every planned shot captured or marked not needed", i.shots.open === 0, i.shots.open === 0 ? `${plural(i.shots.total, "shot")} settled` : `${plural(i.shots.open, "shot")} still planned`),
    item("gaps_closed", "No open B-roll gaps", i.openGaps === 0, i.openGaps === 0 ? "no open gaps" : `${plural(i.openGaps, "open gap")}`),
    item(
      "sponsor_checks",
      "Every sponsor deliverable passing",
      failingChecks.length === 0,
      failingChecks.length === 0 ? (i.sponsorChecks.length ? `${plural(i.sponsorChecks.length, "check")} passing` : "no sponsor checks for this episode") : failingChecks.map((c) => (c.sponsorName ? `${c.sponsorName}: ${c.label}` : c.label)).join("; "),
    ),
    item(
      "sponsor_approvals",
      "Sponsor sign-off in",
      unapproved.length === 0,
      unapproved.length === 0 ? (i.approvals.length ? "every sponsor approved the current script" : "no deals need sign-off") : unapproved.map((a) => `${a.sponsorName} (${a.dealTitle}): ${a.state.replace(/_/g, " ")}`).join("; "),
    ),
    item("description_valid", "Description and chapters valid", descProblems.length === 0, descProblems.length === 0 ? `${i.texts.descriptionBytes} of ${DESCRIPTION_MAX_BYTES} bytes, chapters valid` : descProblems.join("; ")),
    item("title_thumbnail", "Title and thumbnail ready", titleProblems.length === 0, titleProblems.length === 0 ? `${i.texts.titleChars} of ${TITLE_MAX_CHARS} characters${i.adLabel.needed ? ', "Ad" label up front' : ""}` : titleProblems.join("; ")),
  ];
  const failing = items.filter((x) => !x.pass).map((x) => x.key);
  return { items, pass: failing.length === 0, failing };
}

/* ───────────── generated sections ───────────── */

export interface DisclosureDeal {
  kind: string;
  sponsorName: string;
  toolNames: string[];
  urls: string[];
}

const list = (names: string[]) => (names.length <= 1 ? (names[0] ?? "") : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`);

/**
 * One plain line per deal, in the words the guides accept: "Ad" for paid
 * and affiliate work (ASA/CAP, FTC "Disclosures 101": "Ad", "Sponsored"),
 * "Thanks to [brand] for the free [product]" for a gift (FTC "Disclosures
 * 101"), and a loan said as a loan (CMA "Hidden ads", 2022: loans need
 * disclosure too). Links the deal asks for follow their line.
 */
export function disclosureLines(deals: DisclosureDeal[]): string[] {
  return deals.map((d) => {
    const tools = d.toolNames.length ? list(d.toolNames) : "tools";
    const line =
      d.kind === "paid_integration"
        ? `Ad: this video is sponsored by ${d.sponsorName}.`
        : d.kind === "affiliate"
          ? `Ad: links to ${d.sponsorName} below are affiliate links; we earn a commission on purchases made through them.`
          : d.kind === "gifted_tool"
            ? `Thanks to ${d.sponsorName} for the free ${tools}.`
            : `${d.sponsorName} loaned us the ${tools} for this build; we are giving ${d.toolNames.length === 1 ? "it" : "them"} back.`;
    return [line, ...d.urls.map((u) => `${d.sponsorName}: ${u}`)].join("\n");
  });
}

/** "Walnut: 12.4 board feet", "Birch plywood 18 mm: 2 sheets", one line per material. */
export function materialLines(totals: { material: string; boardFeet: number; sheetsToBuy: number }[]): string[] {
  return totals.map((t) => {
    const bits: string[] = [];
    if (t.boardFeet > 0) bits.push(`${(Math.round(t.boardFeet * 10) / 10).toFixed(1)} board feet`);
    if (t.sheetsToBuy > 0) bits.push(`${t.sheetsToBuy} ${t.sheetsToBuy === 1 ? "sheet" : "sheets"}`);
    return bits.length ? `${t.material}: ${bits.join(", ")}` : t.material;
  });
}

/** The usual caution when the build uses power tools, finishes or heat; it defers to the manufacturer's instructions. */
export function safetyLine(hazardTitles: string[], defer: string): string | null {
  if (!hazardTitles.length) return null;
  return `Work safely. This build uses ${list(hazardTitles.map((t) => t.toLowerCase()))}: wear the protection each needs. ${defer}`;
}
