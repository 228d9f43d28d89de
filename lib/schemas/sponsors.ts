import { z } from "zod";
import { DEAL_KINDS, DELIVERABLE_KINDS } from "../sponsor-checks";
import { dateSchema } from "./shoot";

export const DEAL_STATUSES = ["proposed", "signed", "in_review", "approved", "delivered", "invoiced", "paid", "cancelled"] as const;
export type DealStatus = (typeof DEAL_STATUSES)[number];
export const DEAL_STATUS_LABELS: Record<DealStatus, string> = { proposed: "Proposed", signed: "Signed", in_review: "In review", approved: "Approved", delivered: "Delivered", invoiced: "Invoiced", paid: "Paid", cancelled: "Cancelled" };

const ids = z.array(z.uuid({ message: "must be a valid id" })).max(50).refine((a) => new Set(a).size === a.length, "list each once");

export const sponsorCreateSchema = z
  .object({
    name: z.string().trim().min(1, "give the sponsor a name").max(120),
    website: z.string().trim().max(300).default(""),
    notes: z.string().max(4000).default(""),
    contacts: z.array(z.object({ name: z.string().trim().min(1, "give the contact's name").max(120), email: z.email({ message: "must be an e-mail address" }) }).strict()).max(10).default([]),
  })
  .strict()
  .meta({ id: "SponsorCreate" });
export type SponsorCreate = z.output<typeof sponsorCreateSchema>;
export const sponsorUpdateSchema = z
  .object({ name: z.string().trim().min(1).max(120), website: z.string().trim().max(300), notes: z.string().max(4000), contacts: sponsorCreateSchema.shape.contacts.unwrap() })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "SponsorUpdate" });

const dealFields = {
  sponsorId: z.uuid({ message: "must be a sponsor of this channel" }),
  title: z.string().trim().min(1, "give the deal a title").max(200),
  kind: z.enum(DEAL_KINDS),
  feeMinor: z.number().int("whole minor units (cents)").min(0, "cannot be negative").max(100_000_000),
  currency: z.string().regex(/^[A-Z]{3}$/, "use a 3-letter currency code such as USD"),
  signedOn: dateSchema.nullable(),
  scriptDue: dateSchema.nullable(),
  reviewDue: dateSchema.nullable(),
  publishFrom: dateSchema.nullable(),
  publishTo: dateSchema.nullable(),
  returnBy: dateSchema.nullable(),
  status: z.enum(DEAL_STATUSES),
  notes: z.string().max(4000),
  episodeIds: ids,
  toolIds: ids,
};
const windowOk = (v: { publishFrom?: string | null; publishTo?: string | null }) => !v.publishFrom || !v.publishTo || v.publishFrom <= v.publishTo;
const windowIssue = { message: "the publish window must end on or after its start", path: ["publishTo"] };

export const dealCreateSchema = z
  .object({
    ...dealFields,
    kind: dealFields.kind.default("paid_integration"),
    feeMinor: dealFields.feeMinor.default(0),
    currency: dealFields.currency.default("USD"),
    signedOn: dealFields.signedOn.default(null),
    scriptDue: dealFields.scriptDue.default(null),
    reviewDue: dealFields.reviewDue.default(null),
    publishFrom: dealFields.publishFrom.default(null),
    publishTo: dealFields.publishTo.default(null),
    returnBy: dealFields.returnBy.default(null),
    status: dealFields.status.default("proposed"),
    notes: dealFields.notes.default(""),
    episodeIds: dealFields.episodeIds.default([]),
    toolIds: dealFields.toolIds.default([]),
  })
  .strict()
  .refine(windowOk, windowIssue)
  .meta({ id: "DealCreate" });
export type DealCreate = z.output<typeof dealCreateSchema>;

export const dealUpdateSchema = z
  .object(dealFields)
  .omit({ sponsorId: true })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .refine(windowOk, windowIssue)
  .meta({ id: "DealUpdate" });
export type DealUpdate = z.output<typeof dealUpdateSchema>;

export const deliverableCreateSchema = z
  .object({
    kind: z.enum(DELIVERABLE_KINDS),
    seconds: z.number().int("whole seconds").min(0).max(6 * 3600).nullable().default(null),
    phrases: z.array(z.string().trim().min(1, "a talking point cannot be empty").max(200)).max(20).default([]),
    url: z.url({ message: "must be a full link (https://…)" }).nullable().default(null),
  })
  .strict()
  .superRefine((v, ctx) => {
    if ((v.kind === "mention_min_seconds" || v.kind === "mention_max_seconds" || v.kind === "mention_before") && v.seconds == null) ctx.addIssue({ code: "custom", path: ["seconds"], message: "say how many seconds" });
    if (v.kind === "talking_points" && v.phrases.length === 0) ctx.addIssue({ code: "custom", path: ["phrases"], message: "list at least one talking point" });
    if (v.kind === "description_link" && !v.url) ctx.addIssue({ code: "custom", path: ["url"], message: "give the link the description must carry" });
  })
  .meta({ id: "DeliverableCreate" });
export type DeliverableCreate = z.output<typeof deliverableCreateSchema>;

// ---- Responses

export const sponsorSchema = z
  .object({ id: z.string(), name: z.string(), website: z.string(), notes: z.string(), contacts: z.array(z.object({ id: z.string(), name: z.string(), email: z.string() })), archivedAt: z.string().nullable() })
  .meta({ id: "Sponsor" });
export type SponsorDto = z.infer<typeof sponsorSchema>;

export const deliverableSchema = z
  .object({ id: z.string(), dealId: z.string(), kind: z.enum(DELIVERABLE_KINDS), seconds: z.number().nullable(), phrases: z.array(z.string()), url: z.string().nullable() })
  .meta({ id: "Deliverable" });

export const dealSchema = z
  .object({
    id: z.string(),
    sponsorId: z.string(),
    sponsorName: z.string(),
    title: z.string(),
    kind: z.enum(DEAL_KINDS),
    /** Only for the owner and the sponsor liaison; null for everyone else. */
    feeMinor: z.number().nullable(),
    currency: z.string(),
    signedOn: z.string().nullable(),
    scriptDue: z.string().nullable(),
    reviewDue: z.string().nullable(),
    publishFrom: z.string().nullable(),
    publishTo: z.string().nullable(),
    returnBy: z.string().nullable(),
    status: z.enum(DEAL_STATUSES),
    notes: z.string(),
    episodeIds: z.array(z.string()),
    toolIds: z.array(z.string()),
    deliverables: z.array(deliverableSchema),
  })
  .meta({ id: "Deal" });
export type DealDto = z.infer<typeof dealSchema>;

const evidenceSchema = z.object({ segmentId: z.string().optional(), start: z.string().optional(), end: z.string().optional(), phrase: z.string().optional(), found: z.boolean().optional(), note: z.string().optional() });
export const sponsorChecksSchema = z
  .object({
    state: z.enum(["none", "met", "open", "blocked"]),
    results: z.array(
      z.object({
        deliverableId: z.string().nullable(),
        dealId: z.string().nullable(),
        toolId: z.string().optional(),
        kind: z.string(),
        label: z.string(),
        sponsorName: z.string().nullable(),
        pass: z.boolean(),
        message: z.string(),
        source: z.string(),
        evidence: z.array(evidenceSchema),
      }),
    ),
    credits: z.array(z.object({ toolId: z.string(), name: z.string(), sponsorName: z.string().nullable(), acquisition: z.string(), appearances: z.array(z.object({ start: z.string(), end: z.string() })), descriptionLine: z.string(), onScreen: z.string() })),
  })
  .meta({ id: "SponsorChecks" });
export type SponsorChecksDto = z.infer<typeof sponsorChecksSchema>;

// ---- Sponsor review

export const reviewLinkCreateSchema = z
  .object({
    contactEmail: z.email({ message: "must be an e-mail address" }),
    days: z.number().int("whole days").min(1, "at least 1 day").max(30, "at most 30 days").default(14),
  })
  .strict()
  .meta({ id: "ReviewLinkCreate" });

export const reviewDecisionSchema = z
  .object({
    decision: z.enum(["approved", "changes_requested"]),
    comment: z.string().trim().max(4000).default(""),
  })
  .strict()
  .refine((v) => v.decision === "approved" || v.comment.length > 0, { message: "say what should change", path: ["comment"] })
  .meta({ id: "ReviewDecision" });

export const reviewReplySchema = z.object({ body: z.string().trim().min(1, "write a reply").max(4000) }).strict().meta({ id: "ReviewReply" });

export const REVIEW_STATES = ["not_sent", "waiting", "approved", "changes_requested", "reopened"] as const;

const commentSchema = z.object({ id: z.string(), from: z.string(), decision: z.enum(["approved", "changes_requested"]).nullable(), body: z.string(), createdAt: z.string(), current: z.boolean() });

/** What a sponsor's contact sees: this deal only. */
export const guestReviewSchema = z
  .object({
    sponsorName: z.string(),
    dealTitle: z.string(),
    episodes: z.array(
      z.object({
        title: z.string(),
        segments: z.array(z.object({ id: z.string(), kind: z.string(), text: z.string(), start: z.string(), end: z.string(), seconds: z.number() })),
        checks: z.array(z.object({ label: z.string(), pass: z.boolean(), message: z.string() })),
        clips: z.array(z.object({ id: z.string(), name: z.string(), url: z.string() })),
      }),
    ),
    state: z.enum(REVIEW_STATES),
    thread: z.array(commentSchema),
    expiresAt: z.string(),
  })
  .meta({ id: "GuestReview" });
export type GuestReviewDto = z.infer<typeof guestReviewSchema>;

/** What the team sees of a deal's review. */
export const dealReviewSchema = z
  .object({
    state: z.enum(REVIEW_STATES),
    thread: z.array(commentSchema),
    links: z.array(z.object({ id: z.string(), contactEmail: z.string(), expiresAt: z.string(), revokedAt: z.string().nullable(), createdAt: z.string() })),
  })
  .meta({ id: "DealReview" });
export type DealReviewDto = z.infer<typeof dealReviewSchema>;

// ---- Invoices

export const invoiceSchema = z
  .object({ id: z.string(), dealId: z.string(), dealTitle: z.string().optional(), sponsorName: z.string().optional(), amountMinor: z.number(), currency: z.string(), status: z.enum(["draft", "open", "paid", "void"]), hostedUrl: z.string().nullable(), issuedAt: z.string().nullable(), paidAt: z.string().nullable() })
  .meta({ id: "Invoice" });
const totalSchema = z.object({ currency: z.string(), invoicedMinor: z.number(), paidMinor: z.number() });
export const invoicesSchema = z
  .object({ invoices: z.array(invoiceSchema), totals: z.object({ bySponsor: z.array(totalSchema.extend({ sponsorName: z.string() })), byMonth: z.array(totalSchema.extend({ month: z.string() })) }) })
  .meta({ id: "Invoices" });
export type InvoicesDto = z.infer<typeof invoicesSchema>;
