/**
 * The OpenAPI 3.1 document, generated from the same zod schemas the routes
 * parse with (zod's own JSON Schema output). Add a route here when you add a
 * handler; tests/unit/openapi.test.ts checks that every handler is listed.
 */
import { z } from "zod";
import { errorResponseSchema, okSchema } from "./schemas/common";
import { episodeCreateSchema, episodeListQuerySchema, episodeSchema, episodeUpdateSchema } from "./schemas/episode";
import { channelSchema, channelSettingsSchema, channelUpdateSchema, invitationAcceptSchema, invitationCreateSchema, invitationSchema, mailSchema, memberRolesSchema, memberSchema, resetConfirmSchema, resetRequestSchema } from "./schemas/account";
import { ROLES } from "./roles";
import { liveQuerySchema, noteCreateSchema, noteSchema, noteToScriptSchema, presenceSchema } from "./schemas/shoot-log";
import { importQuerySchema, overviewSchema, publishSchema, publishUpdateSchema, scriptFinalSchema, thumbnailSetSchema, thumbnailUploadSchema } from "./schemas/publish";
import { invoiceSchema, invoicesSchema, dealReviewSchema, guestReviewSchema, reviewDecisionSchema, reviewLinkCreateSchema, reviewReplySchema, dealCreateSchema, dealSchema, dealUpdateSchema, deliverableCreateSchema, deliverableSchema, sponsorChecksSchema, sponsorCreateSchema, sponsorSchema, sponsorUpdateSchema } from "./schemas/sponsors";
import { callSheetSchema, callSheetSendSchema, daysAwayListSchema, daysAwaySchema, scheduleSchema, shootDayCreateSchema, shootDayListQuerySchema, shootDaySchema, shootDayUpdateSchema } from "./schemas/shoot";
import { cutListSchema, materialCreateSchema, materialSchema, materialUpdateSchema, photoUploadSchema, planSchema, stepCreateSchema, stepFailureSchema, stepOrderSchema, stepUpdateSchema, toolCreateSchema, toolSchema, toolUpdateSchema } from "./schemas/build";
import { chaptersSchema, exportQuerySchema, rateSchema, readingRateSchema, scriptSchema, segmentCreateSchema, segmentJoinSchema, segmentOrderSchema, segmentSaveSchema, segmentSchema, segmentSplitSchema, segmentTimingSchema, timingQuerySchema, totalsSchema } from "./schemas/script";
import { clipSchema, clipUpdateSchema, coverageRangeSchema, coverageSchema, gapCreateSchema, gapUpdateSchema, partsRequestSchema, pickupCreateSchema, shotBulkSchema, shotCreateSchema, shotSchema, shotUpdateSchema, uploadCreateSchema } from "./schemas/footage";

type Method = "get" | "post" | "patch" | "put" | "delete";
interface RouteDoc {
  method: Method;
  path: string;
  summary: string;
  auth?: boolean;
  body?: z.ZodType;
  query?: z.ZodObject;
  /** The body is raw text of this media type instead of JSON. */
  textBody?: string;
  response: z.ZodType;
  status?: number;
  errors: number[];
  /** Answers with an ETag and takes If-None-Match (304 when the client's copy is current). */
  conditional?: boolean;
}


const conflictNote = "409 answers error.current with the stored segment";
export const ROUTES: RouteDoc[] = [
  { method: "get", path: "/api/health", summary: "Database and storage status", auth: false, response: z.object({ ok: z.boolean(), database: z.object({ ok: z.boolean() }), storage: z.object({ ok: z.boolean() }) }), errors: [503] },
  { method: "get", path: "/api/channels", summary: "Channels I belong to, with my roles", response: z.object({ channels: z.array(channelSchema) }), errors: [401] },
  { method: "get", path: "/api/channels/{channelId}", summary: "A channel's settings", response: z.object({ channel: channelSettingsSchema }), errors: [401, 404] },
  { method: "patch", path: "/api/channels/{channelId}", summary: "Change the channel's name, units, currency and B-roll gap thresholds (owner)", body: channelUpdateSchema, response: z.object({ channel: channelSettingsSchema }), errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/channels/{channelId}/episodes", summary: "Episodes on the board (filters: stage, publish month, archived)", query: episodeListQuerySchema, response: z.object({ episodes: z.array(episodeSchema) }), errors: [400, 401, 404] },
  { method: "post", path: "/api/channels/{channelId}/episodes", summary: "Create an episode at the end of its stage", body: episodeCreateSchema, response: z.object({ episode: episodeSchema }), status: 201, errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}", summary: "One episode", response: z.object({ episode: episodeSchema }), errors: [401, 404] },
  { method: "patch", path: "/api/episodes/{episodeId}", summary: "Edit fields and/or move (stage, position) in one transaction; a move to published is refused (409, error.current.checklist) while the publish checklist fails, unless an owner sends publishOverride", body: episodeUpdateSchema, response: z.object({ episode: episodeSchema }), errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/episodes/{episodeId}", summary: "Archive an episode", response: z.object({ episode: episodeSchema }), errors: [401, 403, 404, 409] },
  { method: "post", path: "/api/episodes/{episodeId}/restore", summary: "Bring an archived episode back to the board", response: z.object({ episode: episodeSchema }), errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/channels/{channelId}/members", summary: "Members and their roles", response: z.object({ members: z.array(memberSchema) }), errors: [401, 404] },
  { method: "patch", path: "/api/channels/{channelId}/members/{userId}", summary: "Change a member's roles (owner)", body: memberRolesSchema, response: z.object({ userId: z.string(), roles: z.array(z.enum(ROLES)) }), errors: [400, 401, 403, 404, 409] },
  { method: "delete", path: "/api/channels/{channelId}/members/{userId}", summary: "Remove a member from the channel (owner; never the last owner); their live streams end", response: z.object({ userId: z.string(), removed: z.boolean() }), errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/channels/{channelId}/invitations", summary: "Open invitations (owner)", response: z.object({ invitations: z.array(invitationSchema) }), errors: [401, 403, 404] },
  { method: "post", path: "/api/channels/{channelId}/invitations", summary: "Invite an e-mail address with roles (owner); sends the link by e-mail", body: invitationCreateSchema, response: z.object({ invitation: invitationSchema }), status: 201, errors: [400, 401, 403, 404] },
  { method: "delete", path: "/api/channels/{channelId}/invitations/{invitationId}", summary: "Revoke an open invitation (owner)", response: okSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/invitations/accept", summary: "Accept an invitation: set name and password, join the channel", auth: false, body: invitationAcceptSchema, response: z.object({ email: z.string(), channelId: z.string() }), status: 201, errors: [400, 404, 422] },
  { method: "post", path: "/api/password-reset", summary: "Send a password-reset link (same answer whether or not the account exists)", auth: false, body: resetRequestSchema, response: okSchema, status: 202, errors: [400] },
  { method: "post", path: "/api/password-reset/confirm", summary: "Set a new password with a reset token", auth: false, body: resetConfirmSchema, response: okSchema, errors: [400, 404] },
  { method: "get", path: "/api/mailbox", summary: "Dev mailbox: messages the local SMTP fake received (owner; dev only)", query: z.object({ channelId: z.string() }), response: z.object({ messages: z.array(mailSchema) }), errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/steps", summary: "The build plan: steps, links, cautions, timing and critical path, tools used", response: planSchema, errors: [401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/steps", summary: "Add a build step at the end of the plan (presenter, owner)", body: stepCreateSchema, response: z.object({ step: z.object({ id: z.string(), title: z.string(), position: z.number() }) }), status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "put", path: "/api/episodes/{episodeId}/steps/order", summary: "Set the order of all steps at once", body: stepOrderSchema, response: okSchema, errors: [400, 401, 403, 404, 409] },
  { method: "patch", path: "/api/steps/{stepId}", summary: "Edit a step; producers may change only active time, wait and crew; dependency loops are refused", body: stepUpdateSchema, response: z.object({ step: z.object({ id: z.string() }) }), errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/steps/{stepId}", summary: "Delete a step", response: okSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/steps/{stepId}/failure", summary: "Mark a step failed with what went wrong and an optional uploaded photo", body: stepFailureSchema, response: z.object({ step: z.object({ id: z.string(), status: z.literal("failed") }) }), errors: [400, 401, 403, 404, 422] },
  { method: "post", path: "/api/steps/{stepId}/remedies", summary: "Add a remedy step after a failed step", body: stepCreateSchema, response: z.object({ step: z.object({ id: z.string(), title: z.string(), remedyOfStepId: z.string() }) }), status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/episodes/{episodeId}/photos", summary: "Sign a direct upload of one photo to storage", body: photoUploadSchema, response: z.object({ key: z.string(), uploadUrl: z.string(), headers: z.record(z.string(), z.string()) }), status: 201, errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/materials", summary: "The cut list with board feet, volume, sheets and cost", response: cutListSchema, errors: [401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/materials", summary: "Add a cut-list row (sizes accept 3/4 and 1-1/2)", body: materialCreateSchema, response: z.object({ material: materialSchema }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "patch", path: "/api/materials/{materialId}", summary: "Edit a cut-list row", body: materialUpdateSchema, response: z.object({ material: materialSchema }), errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/materials/{materialId}", summary: "Delete a cut-list row", response: okSchema, errors: [401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/materials/csv", summary: "Export the cut list as CSV (text/csv)", response: z.string(), errors: [401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/materials/csv", summary: "Import cut-list rows from CSV text; all rows or none, errors by line and field", textBody: "text/csv", response: z.object({ imported: z.number() }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "post", path: "/api/channels/{channelId}/photos", summary: "Sign a direct upload of a tool photo", body: photoUploadSchema, response: z.object({ key: z.string(), uploadUrl: z.string(), headers: z.record(z.string(), z.string()) }), status: 201, errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/channels/{channelId}/tools", summary: "The channel's tool shelf", response: z.object({ tools: z.array(toolSchema) }), errors: [401, 404] },
  { method: "post", path: "/api/channels/{channelId}/tools", summary: "Add a tool to the shelf", body: toolCreateSchema, response: z.object({ tool: toolSchema }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "patch", path: "/api/tools/{toolId}", summary: "Edit a tool", body: toolUpdateSchema, response: z.object({ tool: toolSchema }), errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/tools/{toolId}", summary: "Take a tool off the shelf (archive)", response: okSchema, errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/episodes/{episodeId}/script", summary: "The timed script: segments, timecodes at the episode's rate, totals, chapters", response: scriptSchema, errors: [401, 404], conditional: true },
  { method: "post", path: "/api/episodes/{episodeId}/script", summary: "Add a segment (after afterId, or at the end)", body: segmentCreateSchema, response: z.object({ segment: segmentSchema }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "put", path: "/api/episodes/{episodeId}/script/order", summary: "Set the order of all segments", body: segmentOrderSchema, response: okSchema, errors: [400, 401, 403, 404, 409] },
  { method: "get", path: "/api/episodes/{episodeId}/script/timing", summary: "Computed timing at a chosen frame rate (query rate, dropFrame)", query: timingQuerySchema, response: z.object({ rate: rateSchema, wordsPerMinute: z.number(), totals: totalsSchema, chapters: chaptersSchema, segments: z.array(segmentTimingSchema.extend({ id: z.string(), kind: z.string(), stepId: z.string().nullable() })) }), errors: [400, 401, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/script/export", summary: "Export the script as plain text or JSON (query format)", query: exportQuerySchema, response: z.string(), errors: [400, 401, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/script/revisions", summary: "Revision history of the script (who, when, before and after)", response: z.object({ revisions: z.array(z.object({ id: z.string(), segmentId: z.string().nullable(), before: z.unknown(), after: z.unknown(), createdAt: z.string(), userName: z.string().nullable() })) }), errors: [401, 404] },
  { method: "post", path: "/api/script-revisions/{revisionId}/restore", summary: "Restore a segment as it was at a revision", response: z.object({ segment: segmentSchema }), errors: [401, 403, 404, 409] },
  { method: "patch", path: "/api/segments/{segmentId}", summary: `Save a segment based on a version; a stale version writes nothing (${conflictNote}). Editors may change only notes and chapter flags.`, body: segmentSaveSchema, response: z.object({ segment: segmentSchema }), errors: [400, 401, 403, 404, 409, 422] },
  { method: "delete", path: "/api/segments/{segmentId}", summary: "Delete a segment (kept in the revision history)", response: okSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/segments/{segmentId}/split", summary: `Split a segment at the cursor (${conflictNote})`, body: segmentSplitSchema, response: z.object({ first: segmentSchema, second: segmentSchema }), status: 201, errors: [400, 401, 403, 404, 409] },
  { method: "post", path: "/api/segments/{segmentId}/join", summary: `Join the next segment onto this one (${conflictNote})`, body: segmentJoinSchema, response: z.object({ segment: segmentSchema }), errors: [400, 401, 403, 404, 409] },
  { method: "get", path: "/api/me", summary: "Me, with my reading rate", response: z.object({ user: z.object({ id: z.string(), email: z.string(), name: z.string(), readingRateWpm: z.number() }) }), errors: [401] },
  { method: "patch", path: "/api/me", summary: "Set my reading rate (100-220 words a minute)", body: readingRateSchema, response: z.object({ user: z.object({ id: z.string(), readingRateWpm: z.number() }) }), errors: [400, 401] },
  { method: "delete", path: "/api/me/sessions", summary: "Sign out everywhere: end every session of my account", response: z.object({ ok: z.boolean() }), errors: [401] },
  { method: "get", path: "/api/episodes/{episodeId}/shots", summary: "The shot list", response: z.object({ shots: z.array(shotSchema) }), errors: [401, 404], conditional: true },
  { method: "post", path: "/api/episodes/{episodeId}/shots", summary: "Add a shot (presenter, producer, editor, owner)", body: shotCreateSchema, response: z.object({ shot: shotSchema }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "post", path: "/api/episodes/{episodeId}/shots/bulk", summary: "Set one status on many shots (all or none)", body: shotBulkSchema, response: z.object({ updated: z.number() }), errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/shots/csv", summary: "Export the shot list as CSV", response: z.string(), errors: [401, 404] },
  { method: "patch", path: "/api/shots/{shotId}", summary: "Edit a shot", body: shotUpdateSchema, response: z.object({ shot: shotSchema }), errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/shots/{shotId}", summary: "Delete a shot", response: okSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/steps/{stepId}/planned-shots", summary: "Create the shots a build step's planned coverage asks for", response: z.object({ shots: z.array(shotSchema), skipped: z.number() }), status: 201, errors: [401, 403, 404, 422] },
  { method: "post", path: "/api/episodes/{episodeId}/uploads", summary: "Start a multipart footage upload (type and size checked first; the key is generated)", body: uploadCreateSchema(64 * 1024 ** 3), response: z.object({ clip: clipSchema, partSize: z.number(), partCount: z.number() }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/clips/{clipId}/parts", summary: "Parts already stored (to resume)", response: z.object({ partSize: z.number(), partCount: z.number(), parts: z.array(z.object({ partNumber: z.number(), size: z.number() })) }), errors: [401, 403, 404, 409] },
  { method: "post", path: "/api/clips/{clipId}/parts", summary: "Presigned PUT URLs for parts (15 minutes)", body: partsRequestSchema, response: z.object({ urls: z.array(z.object({ partNumber: z.number(), url: z.string() })), expiresAt: z.string() }), errors: [400, 401, 403, 404, 409] },
  { method: "post", path: "/api/clips/{clipId}/complete", summary: "Finish an upload: every part checked, then metadata read from the stored object", response: z.object({ clip: clipSchema }), errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/clips/{clipId}", summary: "A clip with a playback URL (5 minutes)", response: z.object({ clip: clipSchema, playbackUrl: z.string().nullable() }), errors: [401, 404] },
  { method: "patch", path: "/api/clips/{clipId}", summary: "Link a clip to a shot (marks it captured) or set in/out points", body: clipUpdateSchema, response: z.object({ clip: clipSchema }), errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/clips/{clipId}", summary: "Delete a clip and its stored object (or abort its upload)", response: okSchema, errors: [401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/clips", summary: "The episode's footage", response: z.object({ clips: z.array(clipSchema) }), errors: [401, 404] },
  { method: "post", path: "/api/channels/{channelId}/uploads/cleanup", summary: "Abort uploads abandoned for more than a day (owner)", response: z.object({ abortedUploads: z.number(), removedClips: z.number() }), errors: [401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/coverage", summary: "B-roll coverage: segments, ranges, gaps, voice-over coverage", response: coverageSchema, errors: [401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/coverage-ranges", summary: "Lay a clip or a marked range on the script timeline", body: coverageRangeSchema, response: z.object({ range: z.object({ id: z.string(), clipId: z.string().nullable(), startFrame: z.number(), endFrame: z.number() }) }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/coverage-ranges/{rangeId}", summary: "Remove a range from the timeline", response: okSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/gaps", summary: "Mark a gap by hand, or keep a computed one with a status", body: gapCreateSchema, response: z.object({ gap: z.object({ id: z.string(), status: z.string(), source: z.string(), startFrame: z.number(), endFrame: z.number() }) }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "patch", path: "/api/gaps/{gapId}", summary: "Resolve, dismiss or reopen a gap", body: gapUpdateSchema, response: z.object({ gap: z.object({ id: z.string(), status: z.string(), note: z.string() }) }), errors: [400, 401, 403, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/pickups", summary: "Turn a gap into a pickup shot linked to the gap and its segment", body: pickupCreateSchema, response: z.object({ shot: shotSchema, gapId: z.string() }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/channels/{channelId}/shoot-days", summary: "Shoot days (from/to dates) with crew, helpers and who is away", query: shootDayListQuerySchema, response: z.object({ shootDays: z.array(shootDaySchema) }), errors: [400, 401, 404] },
  { method: "post", path: "/api/channels/{channelId}/shoot-days", summary: "Add a shoot day (producer, owner); hours are read in the channel's time zone", body: shootDayCreateSchema, response: z.object({ shootDay: shootDaySchema }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/shoot-days/{shootDayId}", summary: "One shoot day", response: z.object({ shootDay: shootDaySchema }), errors: [401, 404] },
  { method: "patch", path: "/api/shoot-days/{shootDayId}", summary: "Edit, move to another date, change crew, or cancel (status)", body: shootDayUpdateSchema, response: z.object({ shootDay: shootDaySchema }), errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/shoot-days/{shootDayId}", summary: "Delete a shoot day", response: okSchema, errors: [401, 403, 404] },
  { method: "get", path: "/api/shoot-days/{shootDayId}/call-sheet", summary: "The call sheet: running order, shots, crew call times, cautions, sends", response: callSheetSchema, errors: [401, 404] },
  { method: "post", path: "/api/shoot-days/{shootDayId}/call-sheet", summary: "Queue the call sheet by e-mail to the crew, with the day as an .ics attachment", body: callSheetSendSchema, response: z.object({ send: z.object({ id: z.string(), recipients: z.array(z.string()), status: z.string(), queuedAt: z.string() }) }), status: 202, errors: [400, 401, 403, 404, 409, 422] },
  { method: "get", path: "/api/shoot-days/{shootDayId}/ics", summary: "One shoot day as iCalendar (text/calendar)", response: z.string(), errors: [401, 404] },
  { method: "get", path: "/api/channels/{channelId}/days-away", summary: "Everyone's days away", query: shootDayListQuerySchema, response: daysAwayListSchema, errors: [400, 401, 404] },
  { method: "put", path: "/api/channels/{channelId}/days-away", summary: "Add or remove my own days away", body: daysAwaySchema, response: daysAwayListSchema, errors: [400, 401, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/schedule", summary: "The schedule the plan, shoot days and days away give now, with what would move against the saved one", response: scheduleSchema, errors: [401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/schedule", summary: "Plan again and save (producer, owner); answers what moved", response: scheduleSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/channels/{channelId}/calendar-feed", summary: "Make a new secret calendar feed URL (owner); the old one stops working", response: z.object({ url: z.string() }), status: 201, errors: [401, 403, 404] },
  { method: "get", path: "/api/calendar/{token}", summary: "The channel's shoot days as an iCalendar subscription feed (text/calendar); the token is the key", auth: false, response: z.string(), errors: [404] },
  { method: "get", path: "/api/channels/{channelId}/sponsors", summary: "The channel's sponsors", response: z.object({ sponsors: z.array(sponsorSchema) }), errors: [401, 404] },
  { method: "post", path: "/api/channels/{channelId}/sponsors", summary: "Add a sponsor (owner, sponsor liaison)", body: sponsorCreateSchema, response: z.object({ sponsor: sponsorSchema }), status: 201, errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/sponsors/{sponsorId}", summary: "One sponsor", response: z.object({ sponsor: sponsorSchema }), errors: [401, 404] },
  { method: "patch", path: "/api/sponsors/{sponsorId}", summary: "Edit a sponsor and its contacts", body: sponsorUpdateSchema, response: z.object({ sponsor: sponsorSchema }), errors: [400, 401, 403, 404] },
  { method: "delete", path: "/api/sponsors/{sponsorId}", summary: "Archive a sponsor", response: okSchema, errors: [401, 403, 404] },
  { method: "get", path: "/api/channels/{channelId}/deals", summary: "Deals (fees only for owner and sponsor liaison)", response: z.object({ deals: z.array(dealSchema) }), errors: [401, 404] },
  { method: "post", path: "/api/channels/{channelId}/deals", summary: "Add a deal with its episodes and tools", body: dealCreateSchema, response: z.object({ deal: dealSchema }), status: 201, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/deals/{dealId}", summary: "One deal with its deliverables", response: z.object({ deal: dealSchema }), errors: [401, 404] },
  { method: "patch", path: "/api/deals/{dealId}", summary: "Edit a deal", body: dealUpdateSchema, response: z.object({ deal: dealSchema }), errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/deals/{dealId}", summary: "Archive a deal", response: okSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/deals/{dealId}/deliverables", summary: "Add a checkable deliverable", body: deliverableCreateSchema, response: z.object({ deliverable: deliverableSchema }), status: 201, errors: [400, 401, 403, 404] },
  { method: "delete", path: "/api/deliverables/{deliverableId}", summary: "Remove a deliverable", response: okSchema, errors: [401, 403, 404] },
  { method: "get", path: "/api/episodes/{episodeId}/sponsor-checks", summary: "Every deliverable and material connection checked against the script, plan and B-roll, with timecodes; tool credits", response: sponsorChecksSchema, errors: [401, 404] },
  { method: "post", path: "/api/deals/{dealId}/review-links", summary: "Mail a sponsor's contact an expiring review link for this deal only", body: reviewLinkCreateSchema, response: z.object({ link: z.object({ id: z.string(), contactEmail: z.string(), expiresAt: z.string() }) }), status: 201, errors: [400, 401, 403, 404] },
  { method: "delete", path: "/api/review-links/{reviewLinkId}", summary: "Withdraw a review link", response: okSchema, errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/deals/{dealId}/review", summary: "The review thread, its state and the links sent", response: dealReviewSchema, errors: [401, 404] },
  { method: "post", path: "/api/deals/{dealId}/review", summary: "Reply in the review thread (liaison, presenter, owner)", body: reviewReplySchema, response: dealReviewSchema, status: 201, errors: [400, 401, 403, 404] },
  { method: "get", path: "/api/review/{token}", summary: "Guest: the deal's segments, checks and clips through a review link (no session; the token is the key)", auth: false, response: guestReviewSchema, errors: [404] },
  { method: "post", path: "/api/review/{token}/decision", summary: "Guest: approve, or request changes with a comment", auth: false, body: reviewDecisionSchema, response: guestReviewSchema, status: 201, errors: [400, 404] },
  { method: "post", path: "/api/deals/{dealId}/invoice", summary: "Issue the deal's invoice through the payments service (liaison, owner)", response: z.object({ invoice: invoiceSchema }), status: 201, errors: [401, 403, 404, 422, 502] },
  { method: "get", path: "/api/channels/{channelId}/invoices", summary: "Invoices with totals per sponsor and per month (liaison, owner)", response: invoicesSchema, errors: [401, 403, 404] },
  { method: "post", path: "/api/payments/webhook", summary: "Payments service webhook: signature verified on the raw body; idempotent", auth: false, response: z.object({ received: z.boolean(), outcome: z.string() }), errors: [400] },
  { method: "get", path: "/api/episodes/{episodeId}/publish", summary: "The publish package: composed description, limits, chapters and the publish checklist", response: publishSchema, errors: [401, 404] },
  { method: "patch", path: "/api/episodes/{episodeId}/publish", summary: "Edit the title, summary, closing text, sections and the thumbnail's Ad label", body: publishUpdateSchema, response: publishSchema, errors: [400, 401, 403, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/publish/thumbnail-upload", summary: "Sign a direct upload of the thumbnail (JPEG or PNG, at most 2 MB)", body: thumbnailUploadSchema, response: z.object({ key: z.string(), uploadUrl: z.string(), headers: z.record(z.string(), z.string()) }), status: 201, errors: [400, 401, 403, 404] },
  { method: "put", path: "/api/episodes/{episodeId}/publish/thumbnail", summary: "Set the thumbnail to an uploaded image", body: thumbnailSetSchema, response: publishSchema, errors: [400, 401, 403, 404, 422] },
  { method: "delete", path: "/api/episodes/{episodeId}/publish/thumbnail", summary: "Remove the thumbnail", response: publishSchema, errors: [401, 403, 404] },
  { method: "put", path: "/api/episodes/{episodeId}/publish/script-final", summary: "Mark the script final as it stands, or take the mark away", body: scriptFinalSchema, response: publishSchema, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/channels/{channelId}/overview", summary: "The channel at a glance: pipeline by stage, shoot days and sponsor dates ahead, publish dates, open gaps, runtime against target", response: overviewSchema, errors: [401, 404] },
  { method: "get", path: "/api/channels/{channelId}/export", summary: "Owner: the whole channel as a streamed, signed zip (records as JSON lines, the stored objects' manifest; the bytes stay in storage)", response: z.string().meta({ description: "application/zip" }), errors: [401, 403, 404] },
  { method: "post", path: "/api/channels/import", summary: "Import an export as a new channel (body: the zip as application/zip; caller must own the exported channel). Nothing is written unless the whole file verifies.", query: importQuerySchema, textBody: "application/zip", response: z.object({ channelId: z.string(), rows: z.number(), objects: z.number() }), status: 201, errors: [400, 401, 404, 422, 502] },
  { method: "get", path: "/api/episodes/{episodeId}/shoot-log", summary: "The shoot log, newest first", response: z.object({ notes: z.array(noteSchema) }), errors: [401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/shoot-log", summary: "Add a note under the id the device made (201; the same id again answers 200 with the stored note)", body: noteCreateSchema, response: z.object({ note: noteSchema, created: z.boolean() }), status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/shoot-log-notes/{noteId}/to-script", summary: "Make the note a voice-over segment in the script, keeping the link", body: noteToScriptSchema, response: z.object({ note: noteSchema, segment: segmentSchema }), status: 201, errors: [400, 401, 403, 404, 409, 422] },
  { method: "post", path: "/api/shoot-log-notes/{noteId}/to-pickup", summary: "Make the note a pickup shot on the shot list, keeping the link", response: z.object({ note: noteSchema, shot: shotSchema }), status: 201, errors: [401, 403, 404, 409] },
  { method: "get", path: "/api/channels/{channelId}/live", summary: "Server-sent events: which records changed, as they commit on any instance (event change, with id; presence; revoked when the caller leaves the channel). Send Last-Event-ID (or ?lastEventId=) to get what was missed.", query: liveQuerySchema, response: z.string().meta({ description: "text/event-stream" }), errors: [400, 401, 404] },
  { method: "post", path: "/api/episodes/{episodeId}/presence", summary: "Say which segment I am editing (announced live, not stored)", body: presenceSchema, response: okSchema, errors: [400, 401, 403, 404, 422] },
  { method: "get", path: "/api/openapi.json", summary: "This document", auth: false, response: z.object({}).passthrough(), errors: [] },
  { method: "post", path: "/api/auth/callback/credentials", summary: "Sign in with e-mail and password (next-auth form post; throttled per account and address)", auth: false, response: z.object({ url: z.string() }), errors: [429] },
];

const STATUS_TEXT: Record<number, string> = { 400: "Bad input", 401: "Not signed in", 403: "Role does not allow this", 404: "Not found (or another channel's)", 409: "Conflict", 422: "Cannot be processed", 429: "Too many attempts", 503: "Unavailable" };

const components: Record<string, unknown> = {};

/** zod's JSON Schema output, with named schemas (.meta({ id })) lifted into components. */
function schemaOf(s: z.ZodType, io: "input" | "output") {
  const out = z.toJSONSchema(s, { io, unrepresentable: "any" }) as Record<string, unknown>;
  delete out.$schema;
  const defs = (out.$defs ?? {}) as Record<string, unknown>;
  delete out.$defs;
  const rewrite = <T>(v: T): T => JSON.parse(JSON.stringify(v).replaceAll('"#/$defs/', '"#/components/schemas/'));
  for (const [name, def] of Object.entries(defs)) {
    // Input and output shapes differ where defaults apply; name them apart.
    const key = io === "input" && components[name] && JSON.stringify(components[name]) !== JSON.stringify(rewrite(def)) ? `${name}Input` : name;
    components[key] = rewrite(def);
  }
  return rewrite(out);
}

export function openApiDocument() {
  schemaOf(errorResponseSchema, "output");
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of ROUTES) {
    const params = [...r.path.matchAll(/\{(\w+)\}/g)].map((m) => ({ name: m[1], in: "path", required: true, schema: { type: "string", format: "uuid" } }));
    const queryParams = r.query
      ? Object.entries(r.query.shape).map(([name, s]) => ({ name, in: "query", required: !(s as z.ZodType).safeParse(undefined).success, schema: schemaOf(s as z.ZodType, "input") }))
      : [];
    const etag = { ETag: { description: "The revision of this view; send it back as If-None-Match", schema: { type: "string" } } };
    const responses: Record<string, unknown> = {
      [String(r.status ?? 200)]: { description: "OK", ...(r.conditional ? { headers: etag } : {}), content: { "application/json": { schema: schemaOf(r.response, "output") } } },
      ...(r.conditional ? { "304": { description: "Not Modified: the copy named by If-None-Match is current", headers: etag } } : {}),
    };
    for (const code of r.errors) {
      responses[String(code)] = { description: STATUS_TEXT[code] ?? "Error", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } };
    }
    (paths[r.path] ??= {})[r.method] = {
      summary: r.summary,
      ...(r.auth === false ? { security: [] } : {}),
      parameters: [...params, ...queryParams, ...(r.conditional ? [{ name: "If-None-Match", in: "header", required: false, schema: { type: "string" } }] : [])],
      ...(r.textBody ? { requestBody: { required: true, content: { [r.textBody]: { schema: { type: "string" } } } } } : {}),
      ...(r.body ? { requestBody: { required: true, content: { "application/json": { schema: schemaOf(r.body, "input") } } } } : {}),
      responses,
    };
  }
  return {
    openapi: "3.1.0",
    info: { title: "Jigboard API", version: "0.1.0", description: "Errors always answer { error: { code, message, fields? } }." },
    servers: [{ url: "/" }],
    components: {
      schemas: { ...components },
      securitySchemes: { session: { type: "apiKey", in: "cookie", name: "next-auth.session-token" } },
    },
    security: [{ session: [] }],
    paths,
  };
}
