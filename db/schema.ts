/**
 * Jigboard's whole data model, designed once for every capability:
 * channels and people, the episode board, build plans, timed scripts,
 * shots/footage/coverage, shoot days, sponsors and the publish package.
 *
 * Conventions: snake_case columns, uuid keys, every row a channel owns carries
 * channel_id directly or through its episode; script-timeline positions are
 * integer frames at the episode's rate; wall-clock times are timestamptz;
 * money is integer minor units with an ISO 4217 code.
 */
import { sql } from "drizzle-orm";
import {
  bigint,
  type AnyPgColumn,
  boolean,
  check,
  date,
  index,
  integer,
  jsonb,
  numeric,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import type { Role } from "../lib/roles";
import type { Stage } from "../lib/stages";
import type { FrameRateId } from "../lib/frame-rate";
import type { ToolKind } from "../lib/safety";
import type { Acquisition, StepStatus } from "../lib/schemas/build";
import type { PricingUnit } from "../lib/materials";
import type { SegmentKind } from "../lib/script-timing";
import type { ShotKind, ShotStatus } from "../lib/schemas/footage";
import type { CoverageKind } from "../lib/shot-kinds";
import type { DealKind, DeliverableKind } from "../lib/sponsor-checks";

const id = () => uuid("id").primaryKey().defaultRandom();
const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp("updated_at", { withTimezone: true }).notNull().defaultNow();

/* ───────────── people and channels ───────────── */

export const users = pgTable(
  "users",
  {
    id: id(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    /** Presenter's reading rate for script timing (words per minute). */
    // The same number as DEFAULT_WPM in lib/script-timing.ts (db/ takes no values from lib/).
    readingRateWpm: integer("reading_rate_wpm").notNull().default(150),
    /** Bumped on a password change or "sign out everywhere": sessions signed with an older value end. */
    sessionVersion: integer("session_version").notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_key").on(t.email), check("users_email_lower", sql`${t.email} = lower(${t.email})`)],
);

export const channels = pgTable("channels", {
  id: id(),
  name: text("name").notNull(),
  /** Unit system for the cut list: "imperial" (inches) or "metric" (millimetres). */
  units: text("units").$type<"imperial" | "metric">().notNull().default("imperial"),
  currency: text("currency").notNull().default("USD"),
  /** Voice-over stretches without B-roll longer than this are gaps (ms). */
  brollGapMs: integer("broll_gap_ms").notNull().default(2000),
  /** To-camera stretches longer than this without a cutaway are gaps (ms). */
  toCameraMaxMs: integer("to_camera_max_ms").notNull().default(20000),
  /** IANA time zone of the workshop: shoot-day hours and calendar times are read in it. */
  timeZone: text("time_zone").notNull().default("UTC"),
  /** SHA-256 of the calendar feed's secret token (the token itself is shown once, when made). */
  calendarTokenHash: text("calendar_token_hash"),
  createdAt: createdAt(),
  archivedAt: timestamp("archived_at", { withTimezone: true }),
});

export const memberships = pgTable(
  "memberships",
  {
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    roles: text("roles").array().$type<Role[]>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.channelId, t.userId] }), index("memberships_user_idx").on(t.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    roles: text("roles").array().$type<Role[]>().notNull(),
    tokenHash: text("token_hash").notNull(),
    invitedBy: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_token_key").on(t.tokenHash), index("invitations_channel_idx").on(t.channelId)],
);

export const passwordResets = pgTable(
  "password_resets",
  {
    id: id(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("password_resets_token_key").on(t.tokenHash), index("password_resets_user_idx").on(t.userId)],
);

/** Failed and successful sign-in attempts, keyed "account:<email>" or "address:<ip>". */
export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    key: text("key").notNull(),
    succeeded: boolean("succeeded").notNull(),
    attemptedAt: timestamp("attempted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_attempts_key_time_idx").on(t.key, t.attemptedAt)],
);

/* ───────────── episodes (the board) ───────────── */

export const episodes = pgTable(
  "episodes",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    summary: text("summary").notNull().default(""),
    stage: text("stage").$type<Stage>().notNull(),
    position: integer("position").notNull(),
    targetRuntimeSeconds: integer("target_runtime_seconds"),
    publishDate: date("publish_date"),
    frameRate: text("frame_rate").$type<FrameRateId>().notNull().default("29.97"),
    dropFrame: boolean("drop_frame").notNull().default(false),
    /** Whose reading rate times the script. */
    presenterId: uuid("presenter_id").references(() => users.id, { onDelete: "set null" }),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
  },
  (t) => [
    index("episodes_channel_stage_pos_idx").on(t.channelId, t.stage, t.position),
    index("episodes_channel_publish_idx").on(t.channelId, t.publishDate),
    index("episodes_presenter_idx").on(t.presenterId),
    check("episodes_drop_frame_rate", sql`not ${t.dropFrame} or ${t.frameRate} in ('29.97','59.94')`),
  ],
);

/* ───────────── build plan ───────────── */

export const tools = pgTable(
  "tools",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** hand_tool | power_tool | finish | heat | clamp | measuring | other */
    kind: text("kind").$type<ToolKind>().notNull().default("other"),
    /** bought | gifted | loaned | paid_placement */
    acquisition: text("acquisition").$type<Acquisition>().notNull().default("bought"),
    sponsorId: uuid("sponsor_id").references(() => sponsors.id, { onDelete: "set null" }),
    caution: text("caution").notNull().default(""),
    photoKey: text("photo_key"),
    createdAt: createdAt(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
  },
  (t) => [index("tools_channel_idx").on(t.channelId), index("tools_sponsor_idx").on(t.sponsorId)],
);

export const buildSteps = pgTable(
  "build_steps",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    title: text("title").notNull(),
    notes: text("notes").notNull().default(""),
    activeMinutes: integer("active_minutes").notNull().default(0),
    waitMinutes: integer("wait_minutes").notNull().default(0),
    waitReason: text("wait_reason").notNull().default(""),
    crewNeeded: integer("crew_needed").notNull().default(1),
    coverageKinds: text("coverage_kinds").array().$type<CoverageKind[]>().notNull().default(sql`'{}'::text[]`),
    /** Hazards flagged on the step itself (power_tool, finish, fire); tools add their own. */
    hazards: text("hazards").array().notNull().default(sql`'{}'::text[]`),
    /** planned | in_progress | done | failed | skipped */
    status: text("status").$type<StepStatus>().notNull().default("planned"),
    failureNote: text("failure_note"),
    failurePhotoKey: text("failure_photo_key"),
    remedyOfStepId: uuid("remedy_of_step_id"),
    /** Must the camera be there? Unfilmed steps (sanding off camera) may run between shoot days. */
    mustFilm: boolean("must_film").notNull().default(true),
    /** The shoot day the producer fixed this step to, if any. */
    pinnedShootDayId: uuid("pinned_shoot_day_id").references((): AnyPgColumn => shootDays.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("build_steps_episode_idx").on(t.episodeId, t.position), index("build_steps_remedy_idx").on(t.remedyOfStepId), index("build_steps_pinned_day_idx").on(t.pinnedShootDayId)],
);

export const stepDependencies = pgTable(
  "step_dependencies",
  {
    stepId: uuid("step_id").notNull().references(() => buildSteps.id, { onDelete: "cascade" }),
    dependsOnStepId: uuid("depends_on_step_id").notNull().references(() => buildSteps.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.stepId, t.dependsOnStepId] }), index("step_dependencies_dep_idx").on(t.dependsOnStepId)],
);

export const stepTools = pgTable(
  "step_tools",
  {
    stepId: uuid("step_id").notNull().references(() => buildSteps.id, { onDelete: "cascade" }),
    toolId: uuid("tool_id").notNull().references(() => tools.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.stepId, t.toolId] }), index("step_tools_tool_idx").on(t.toolId)],
);

export const materials = pgTable(
  "materials",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    stepId: uuid("step_id").references(() => buildSteps.id, { onDelete: "set null" }),
    position: integer("position").notNull().default(0),
    partName: text("part_name").notNull(),
    material: text("material").notNull().default(""),
    /** Dimensions in the row's unit ("in" or "mm"), exact decimals. */
    unit: text("unit").$type<"in" | "mm">().notNull().default("in"),
    thickness: numeric("thickness", { precision: 12, scale: 4 }).notNull(),
    width: numeric("width", { precision: 12, scale: 4 }).notNull(),
    length: numeric("length", { precision: 12, scale: 4 }).notNull(),
    quantity: integer("quantity").notNull().default(1),
    sizing: text("sizing").$type<"nominal" | "actual">().notNull().default("actual"),
    /** board_foot | linear_foot | linear_metre | sheet | each */
    pricingUnit: text("pricing_unit").$type<PricingUnit>().notNull().default("board_foot"),
    unitPriceMinor: integer("unit_price_minor").notNull().default(0),
    currency: text("currency").notNull().default("USD"),
    wastePercent: numeric("waste_percent", { precision: 5, scale: 2 }).notNull().default("0"),
    supplierNote: text("supplier_note").notNull().default(""),
  },
  (t) => [index("materials_episode_idx").on(t.episodeId), index("materials_step_idx").on(t.stepId)],
);

/* ───────────── timed script ───────────── */

export const scriptSegments = pgTable(
  "script_segments",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    /** to_camera | voice_over | sponsor_read | on_screen_text */
    kind: text("kind").$type<SegmentKind>().notNull(),
    text: text("text").notNull().default(""),
    stepId: uuid("step_id").references(() => buildSteps.id, { onDelete: "set null" }),
    pinnedStartFrame: integer("pinned_start_frame"),
    explicitDurationFrames: integer("explicit_duration_frames"),
    editorNotes: text("editor_notes").notNull().default(""),
    chapterStart: boolean("chapter_start").notNull().default(false),
    chapterTitle: text("chapter_title"),
    /** Optimistic concurrency: every save names the version it was based on. */
    version: integer("version").notNull().default(1),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: updatedAt(),
  },
  (t) => [index("script_segments_episode_idx").on(t.episodeId, t.position), index("script_segments_step_idx").on(t.stepId)],
);

export const scriptRevisions = pgTable(
  "script_revisions",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    segmentId: uuid("segment_id"),
    userId: uuid("user_id").references(() => users.id, { onDelete: "set null" }),
    before: jsonb("before"),
    after: jsonb("after"),
    createdAt: createdAt(),
  },
  (t) => [index("script_revisions_episode_idx").on(t.episodeId, t.createdAt)],
);

/* ───────────── shots, footage, coverage ───────────── */

export const SHOOT_DAY_STATUS_LIST = ["planned", "confirmed", "shot", "cancelled"] as const;

export const shootDays = pgTable(
  "shoot_days",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    episodeId: uuid("episode_id").references(() => episodes.id, { onDelete: "set null" }),
    /** The calendar date in the channel's time zone. */
    day: date("day").notNull(),
    timeZone: text("time_zone").notNull().default("UTC"),
    /** Call and wrap as instants (computed from the date, the hours and the zone, so daylight-saving days are right). */
    callAt: timestamp("call_at", { withTimezone: true }).notNull(),
    wrapAt: timestamp("wrap_at", { withTimezone: true }).notNull(),
    location: text("location").notNull().default(""),
    equipmentNotes: text("equipment_notes").notNull().default(""),
    safetyNotes: text("safety_notes").notNull().default(""),
    weatherNote: text("weather_note").notNull().default(""),
    contacts: text("contacts").notNull().default(""),
    notes: text("notes").notNull().default(""),
    status: text("status").$type<(typeof SHOOT_DAY_STATUS_LIST)[number]>().notNull().default("planned"),
    callSheetSentAt: timestamp("call_sheet_sent_at", { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("shoot_days_channel_day_idx").on(t.channelId, t.day), index("shoot_days_episode_idx").on(t.episodeId)],
);

/** Channel members on a shoot day, each with an optional own call time. */
export const shootDayCrew = pgTable(
  "shoot_day_crew",
  {
    shootDayId: uuid("shoot_day_id").notNull().references(() => shootDays.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    duty: text("duty").notNull().default(""),
    callAt: timestamp("call_at", { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.shootDayId, t.userId] }), index("shoot_day_crew_user_idx").on(t.userId)],
);

/** Named helpers from outside the channel (a friend on camera two, say). */
export const shootDayHelpers = pgTable(
  "shoot_day_helpers",
  {
    id: id(),
    shootDayId: uuid("shoot_day_id").notNull().references(() => shootDays.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    duty: text("duty").notNull().default(""),
    email: text("email"),
    callAt: timestamp("call_at", { withTimezone: true }),
  },
  (t) => [index("shoot_day_helpers_day_idx").on(t.shootDayId)],
);

/** Dates a member cannot work, per channel. */
export const daysAway = pgTable(
  "days_away",
  {
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    day: date("day").notNull(),
    note: text("note").notNull().default(""),
  },
  (t) => [primaryKey({ columns: [t.channelId, t.userId, t.day] }), index("days_away_channel_day_idx").on(t.channelId, t.day)],
);

/** The saved schedule of an episode: where each step sits (a shoot day, or off camera between days). */
export const scheduledSteps = pgTable(
  "scheduled_steps",
  {
    stepId: uuid("step_id").primaryKey().references(() => buildSteps.id, { onDelete: "cascade" }),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    shootDayId: uuid("shoot_day_id").references(() => shootDays.id, { onDelete: "set null" }),
    startsAt: timestamp("starts_at", { withTimezone: true }).notNull(),
    endsAt: timestamp("ends_at", { withTimezone: true }).notNull(),
    plannedAt: timestamp("planned_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("scheduled_steps_episode_idx").on(t.episodeId), index("scheduled_steps_day_idx").on(t.shootDayId)],
);

/** Every call sheet sent: to whom, and whether the mail went out (sent through the job queue). */
export const callSheetSends = pgTable(
  "call_sheet_sends",
  {
    id: id(),
    shootDayId: uuid("shoot_day_id").notNull().references(() => shootDays.id, { onDelete: "cascade" }),
    sentBy: uuid("sent_by").references(() => users.id, { onDelete: "set null" }),
    recipients: text("recipients").array().notNull(),
    status: text("status").$type<"queued" | "sent" | "failed">().notNull().default("queued"),
    error: text("error"),
    queuedAt: timestamp("queued_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [index("call_sheet_sends_day_idx").on(t.shootDayId, t.queuedAt)],
);

export const gaps = pgTable(
  "gaps",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    segmentId: uuid("segment_id").references(() => scriptSegments.id, { onDelete: "set null" }),
    startFrame: integer("start_frame").notNull(),
    endFrame: integer("end_frame").notNull(),
    /** computed | marked */
    source: text("source").$type<"computed" | "marked">().notNull(),
    /** open | resolved | dismissed */
    status: text("status").$type<"open" | "resolved" | "dismissed">().notNull().default("open"),
    /** voice_over | to_camera for computed gaps; marked gaps say nothing. */
    reason: text("reason").$type<"voice_over" | "to_camera">(),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [
    index("gaps_episode_idx").on(t.episodeId, t.status),
    index("gaps_segment_idx").on(t.segmentId),
    check("gaps_range", sql`${t.endFrame} > ${t.startFrame}`),
  ],
);

export const shots = pgTable(
  "shots",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    stepId: uuid("step_id").references(() => buildSteps.id, { onDelete: "set null" }),
    segmentId: uuid("segment_id").references(() => scriptSegments.id, { onDelete: "set null" }),
    shootDayId: uuid("shoot_day_id").references(() => shootDays.id, { onDelete: "set null" }),
    gapId: uuid("gap_id").references(() => gaps.id, { onDelete: "set null" }),
    position: integer("position").notNull().default(0),
    kind: text("kind").$type<ShotKind>().notNull(),
    description: text("description").notNull().default(""),
    framing: text("framing").notNull().default(""),
    cameraNotes: text("camera_notes").notNull().default(""),
    priority: integer("priority").notNull().default(2),
    /** planned | captured | selected | rejected */
    status: text("status").$type<ShotStatus>().notNull().default("planned"),
    createdAt: createdAt(),
  },
  (t) => [
    index("shots_episode_idx").on(t.episodeId, t.status),
    index("shots_step_idx").on(t.stepId),
    index("shots_segment_idx").on(t.segmentId),
    index("shots_day_idx").on(t.shootDayId),
    index("shots_gap_idx").on(t.gapId),
  ],
);

export const clips = pgTable(
  "clips",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    shotId: uuid("shot_id").references(() => shots.id, { onDelete: "set null" }),
    storageKey: text("storage_key").notNull(),
    uploadId: text("upload_id"),
    /** uploading | stored */
    state: text("state").$type<"uploading" | "stored">().notNull().default("uploading"),
    originalName: text("original_name").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    partSize: bigint("part_size", { mode: "number" }),
    contentType: text("content_type").notNull(),
    durationMs: integer("duration_ms"),
    frameRate: text("frame_rate"),
    width: integer("width"),
    height: integer("height"),
    startTimecode: text("start_timecode"),
    checksum: text("checksum"),
    inFrame: integer("in_frame"),
    outFrame: integer("out_frame"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("clips_storage_key").on(t.storageKey),
    index("clips_episode_idx").on(t.episodeId),
    index("clips_shot_idx").on(t.shotId),
    index("clips_channel_state_idx").on(t.channelId, t.state),
  ],
);

export const coverageRanges = pgTable(
  "coverage_ranges",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    clipId: uuid("clip_id").references(() => clips.id, { onDelete: "cascade" }),
    /** Where in the clip the range begins (frames at the episode's rate). */
    clipInFrame: integer("clip_in_frame").notNull().default(0),
    startFrame: integer("start_frame").notNull(),
    endFrame: integer("end_frame").notNull(),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("coverage_ranges_episode_idx").on(t.episodeId), index("coverage_ranges_clip_idx").on(t.clipId), check("coverage_range", sql`${t.endFrame} > ${t.startFrame}`)],
);

export const shootLogNotes = pgTable(
  "shoot_log_notes",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    shootDayId: uuid("shoot_day_id").references(() => shootDays.id, { onDelete: "set null" }),
    stepId: uuid("step_id").references(() => buildSteps.id, { onDelete: "set null" }),
    segmentId: uuid("segment_id").references(() => scriptSegments.id, { onDelete: "set null" }),
    /** The clip being recorded when the note was taken. */
    clipId: uuid("clip_id").references(() => clips.id, { onDelete: "set null" }),
    /** The pickup shot made from the note. */
    shotId: uuid("shot_id").references(() => shots.id, { onDelete: "set null" }),
    authorId: uuid("author_id").references(() => users.id, { onDelete: "set null" }),
    /** When the note was written on the device (it may arrive later, from an offline queue). */
    notedAt: timestamp("noted_at", { withTimezone: true }).notNull().defaultNow(),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
    text: text("text").notNull(),
  },
  (t) => [index("shoot_log_notes_episode_idx").on(t.episodeId, t.notedAt)],
);

/* ───────────── sponsors ───────────── */

export const sponsors = pgTable(
  "sponsors",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    website: text("website").notNull().default(""),
    notes: text("notes").notNull().default(""),
    /** The main contact (more in sponsor_contacts). */
    contactName: text("contact_name").notNull().default(""),
    contactEmail: text("contact_email").notNull().default(""),
    createdAt: createdAt(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
  },
  (t) => [index("sponsors_channel_idx").on(t.channelId)],
);

export const sponsorContacts = pgTable(
  "sponsor_contacts",
  {
    id: id(),
    sponsorId: uuid("sponsor_id").notNull().references(() => sponsors.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    email: text("email").notNull(),
  },
  (t) => [index("sponsor_contacts_sponsor_idx").on(t.sponsorId)],
);

export const DEAL_STATUS_LIST = ["proposed", "signed", "in_review", "approved", "delivered", "invoiced", "paid", "cancelled"] as const;

export const deals = pgTable(
  "deals",
  {
    id: id(),
    channelId: uuid("channel_id").notNull().references(() => channels.id, { onDelete: "cascade" }),
    sponsorId: uuid("sponsor_id").notNull().references(() => sponsors.id, { onDelete: "cascade" }),
    /** The first episode of the deal; all of them in deal_episodes. */
    episodeId: uuid("episode_id").references(() => episodes.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    kind: text("kind").$type<DealKind>().notNull().default("paid_integration"),
    feeMinor: integer("fee_minor").notNull().default(0),
    currency: text("currency").notNull().default("USD"),
    signedOn: date("signed_on"),
    scriptDue: date("script_due"),
    reviewDue: date("review_due"),
    publishFrom: date("publish_from"),
    publishTo: date("publish_to"),
    /** For a loaned tool: when it goes back. */
    returnBy: date("return_by"),
    status: text("status").$type<(typeof DEAL_STATUS_LIST)[number]>().notNull().default("proposed"),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
  },
  (t) => [index("deals_channel_idx").on(t.channelId), index("deals_sponsor_idx").on(t.sponsorId), index("deals_episode_idx").on(t.episodeId)],
);

export const dealEpisodes = pgTable(
  "deal_episodes",
  {
    dealId: uuid("deal_id").notNull().references(() => deals.id, { onDelete: "cascade" }),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.dealId, t.episodeId] }), index("deal_episodes_episode_idx").on(t.episodeId)],
);

export const dealTools = pgTable(
  "deal_tools",
  {
    dealId: uuid("deal_id").notNull().references(() => deals.id, { onDelete: "cascade" }),
    toolId: uuid("tool_id").notNull().references(() => tools.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.dealId, t.toolId] }), index("deal_tools_tool_idx").on(t.toolId)],
);

/** One checkable promise of a deal (see lib/sponsor-checks.ts for the kinds). */
export const deliverables = pgTable(
  "deliverables",
  {
    id: id(),
    dealId: uuid("deal_id").notNull().references(() => deals.id, { onDelete: "cascade" }),
    kind: text("kind").$type<DeliverableKind>().notNull(),
    seconds: integer("seconds"),
    phrases: text("phrases").array().notNull().default(sql`'{}'::text[]`),
    url: text("url"),
    position: integer("position").notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [index("deliverables_deal_idx").on(t.dealId)],
);

export const guestLinks = pgTable(
  "guest_links",
  {
    id: id(),
    dealId: uuid("deal_id").notNull().references(() => deals.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    contactEmail: text("contact_email").notNull().default(""),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("guest_links_token_key").on(t.tokenHash), index("guest_links_deal_idx").on(t.dealId)],
);

/** The review thread of a deal: the sponsor's decisions and comments, and the team's replies. */
export const reviewComments = pgTable(
  "review_comments",
  {
    id: id(),
    dealId: uuid("deal_id").notNull().references(() => deals.id, { onDelete: "cascade" }),
    guestLinkId: uuid("guest_link_id").references(() => guestLinks.id, { onDelete: "set null" }),
    userId: uuid("user_id").references(() => users.id, { onDelete: "set null" }),
    decision: text("decision").$type<"approved" | "changes_requested">(),
    body: text("body").notNull().default(""),
    /** Which script the decision was about: a fingerprint of the deal's segments and their versions. */
    scriptFingerprint: text("script_fingerprint").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("review_comments_deal_idx").on(t.dealId, t.createdAt)],
);

export const invoices = pgTable(
  "invoices",
  {
    id: id(),
    dealId: uuid("deal_id").notNull().references(() => deals.id, { onDelete: "cascade" }),
    amountMinor: integer("amount_minor").notNull(),
    currency: text("currency").notNull(),
    providerId: text("provider_id"),
    providerCustomerId: text("provider_customer_id"),
    hostedUrl: text("hosted_url"),
    /** draft | open | paid | void */
    status: text("status").$type<"draft" | "open" | "paid" | "void">().notNull().default("draft"),
    issuedAt: timestamp("issued_at", { withTimezone: true }),
    paidAt: timestamp("paid_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  // Not unique: an imported copy of a channel keeps its invoices, so one provider invoice may be recorded twice.
  (t) => [index("invoices_deal_idx").on(t.dealId), index("invoices_provider_idx").on(t.providerId)],
);

/** Payment-service events already handled: the same event twice changes nothing. */
export const paymentEvents = pgTable("payment_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
});

/* ───────────── publish package ───────────── */

export const publishPackages = pgTable(
  "publish_packages",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    /** The video's title as published. */
    title: text("title").notNull().default(""),
    /** The opening paragraph of the description, written by the team. */
    summary: text("summary").notNull().default(""),
    /** Free text at the end of the description (links, thanks). */
    closing: text("closing").notNull().default(""),
    /** Which generated sections the description carries. */
    sections: jsonb("sections").$type<{ chapters: boolean; credits: boolean; materials: boolean; safety: boolean }>().notNull().default({ chapters: true, credits: true, materials: true, safety: true }),
    thumbnailKey: text("thumbnail_key"),
    thumbnailContentType: text("thumbnail_content_type"),
    /** The team confirms the thumbnail image itself carries the "Ad" label (an image cannot be read here). */
    thumbnailAdLabel: boolean("thumbnail_ad_label").notNull().default(false),
    /** The script as marked final: segment ids and versions, hashed. Any later edit makes it not final. */
    scriptFinalFingerprint: text("script_final_fingerprint"),
    scriptFinalAt: timestamp("script_final_at", { withTimezone: true }),
    scriptFinalBy: uuid("script_final_by").references(() => users.id, { onDelete: "set null" }),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("publish_packages_episode_key").on(t.episodeId)],
);

/** An owner moved an episode to published while its checklist failed: who, why, and what was failing. */
export const publishOverrides = pgTable(
  "publish_overrides",
  {
    id: id(),
    episodeId: uuid("episode_id").notNull().references(() => episodes.id, { onDelete: "cascade" }),
    userId: uuid("user_id").references(() => users.id, { onDelete: "set null" }),
    reason: text("reason").notNull(),
    failing: jsonb("failing").$type<string[]>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("publish_overrides_episode_idx").on(t.episodeId, t.createdAt)],
);

/* ───────────── live updates ───────────── */

/**
 * What changed, written by triggers in the same transaction as the change and
 * announced with NOTIFY on commit, so every app instance can tell its
 * connected browsers. Kept a day for reconnects (Last-Event-ID).
 */
export const liveEvents = pgTable(
  "live_events",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    channelId: uuid("channel_id").notNull(),
    episodeId: uuid("episode_id"),
    /** The table that changed. */
    kind: text("kind").notNull(),
    op: text("op").notNull(),
    /** Ids of the changed rows (at most 100; more says only that many changed). */
    recordIds: text("record_ids").array().notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("live_events_channel_idx").on(t.channelId, t.id)],
);

/* ───────────── mail and audit ───────────── */

/** Messages received by the local SMTP fake (the dev mailbox). */
export const mailMessages = pgTable(
  "mail_messages",
  {
    id: id(),
    fromAddress: text("from_address").notNull(),
    toAddresses: text("to_addresses").array().notNull(),
    subject: text("subject").notNull().default(""),
    textBody: text("text_body").notNull().default(""),
    htmlBody: text("html_body"),
    /** Set by the app's own headers when it sends: which channel's action sent it, what kind, about which record. */
    channelId: uuid("channel_id"),
    kind: text("kind"),
    refId: uuid("ref_id"),
    /** What was attached: name, type, size, SHA-256 and (when small) the bytes in base64. */
    attachments: jsonb("attachments").$type<{ filename: string; contentType: string; size: number; sha256: string; base64: string | null }[]>().notNull().default(sql`'[]'::jsonb`),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("mail_messages_received_idx").on(t.receivedAt), index("mail_messages_channel_idx").on(t.channelId, t.kind)],
);

/**
 * Storage keys the server issued for a direct upload, with what they are for.
 * A key a client sends back (a tool photo, a failure photo) must match one of
 * these exactly, for the same channel and purpose.
 */
export const pendingUploads = pgTable(
  "pending_uploads",
  {
    key: text("key").primaryKey(),
    channelId: uuid("channel_id")
      .notNull()
      .references(() => channels.id, { onDelete: "cascade" }),
    purpose: text("purpose").$type<"tool_photo" | "failure_photo" | "thumbnail">().notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index("pending_uploads_channel_idx").on(t.channelId, t.purpose)],
);
export type PendingUpload = typeof pendingUploads.$inferSelect;

export const auditEntries = pgTable(
  "audit_entries",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    channelId: uuid("channel_id").references(() => channels.id, { onDelete: "cascade" }),
    userId: uuid("user_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id"),
    before: jsonb("before"),
    after: jsonb("after"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_entries_channel_idx").on(t.channelId, t.at)],
);

export type User = typeof users.$inferSelect;
export type Channel = typeof channels.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type Episode = typeof episodes.$inferSelect;
export type NewEpisode = typeof episodes.$inferInsert;
export type BuildStep = typeof buildSteps.$inferSelect;
export type Tool = typeof tools.$inferSelect;
export type MaterialRow = typeof materials.$inferSelect;
export type ScriptSegment = typeof scriptSegments.$inferSelect;
export type Shot = typeof shots.$inferSelect;
export type Clip = typeof clips.$inferSelect;
export type MailMessage = typeof mailMessages.$inferSelect;
export type Gap = typeof gaps.$inferSelect;
export type CoverageRange = typeof coverageRanges.$inferSelect;
export type ShootDay = typeof shootDays.$inferSelect;
export type ShootDayHelper = typeof shootDayHelpers.$inferSelect;
export type ScheduledStep = typeof scheduledSteps.$inferSelect;
export type CallSheetSend = typeof callSheetSends.$inferSelect;
export type Sponsor = typeof sponsors.$inferSelect;
export type Deal = typeof deals.$inferSelect;
export type Deliverable = typeof deliverables.$inferSelect;
export type GuestLink = typeof guestLinks.$inferSelect;
export type PublishPackage = typeof publishPackages.$inferSelect;
export type ShootLogNote = typeof shootLogNotes.$inferSelect;

/**
 * Each episode's revision of what is derived from it, and its board figures
 * (script runtime, open gaps). Triggers make the row with the episode and
 * raise `rev` in the same transaction as any change to the episode's row,
 * segments, coverage ranges, gaps or shots, the presenter's reading rate or
 * the channel's gap thresholds. The stored figures count only while
 * `computed_rev` equals `rev`; the script and shot-list responses are cached
 * under `rev`, the board under the channel's list of (episode, rev). Revisions
 * only ever grow: never delete a row by hand (set `computed_rev` to null to
 * have figures computed again).
 */
export const episodeFigures = pgTable("episode_figures", {
  episodeId: uuid("episode_id")
    .primaryKey()
    .references(() => episodes.id, { onDelete: "cascade" }),
  rev: bigint("rev", { mode: "number" }).notNull().default(1),
  computedRev: bigint("computed_rev", { mode: "number" }),
  scriptSeconds: integer("script_seconds"),
  openGaps: integer("open_gaps"),
});
export type EpisodeFigures = typeof episodeFigures.$inferSelect;
