import "server-only";
/**
 * The one way to write a route handler. A declaration says what the path's
 * id names, which action the caller's role must allow, and which schemas the
 * body and query follow; the builder then runs, in this order:
 *
 *   cross-site check (403) → session (401) → load the record through the
 *   caller's channel (404 across channels) → role check (403) → content type,
 *   query and body (400 naming the field) → the handler.
 *
 * Every built handler carries its declaration as `.spec`, so tests can list
 * every route with its action and generate the route × role matrix.
 */
import type { z } from "zod";
import { can, type Action } from "../../permissions";
import { assertCan, requireChannel, type ChannelAccess } from "../access/access";
import { assertContentType, parseBody, parseId, parseQuery, route, sessionUser } from "./api";
import { AppError } from "./errors";
import type { SessionUser } from "../access/session";
import { loadClip, loadEpisode, loadMaterial, loadSegment, loadShot, loadStep, loadTool } from "../access/loaders";
import { getGapById, getRangeById } from "../../../db/queries/coverage";
import { getRevisionById } from "../../../db/queries/script";
import { getShootDayById } from "../../../db/queries/shoot-days";
import { getNoteById } from "../../../db/queries/shoot-log";
import { getDealById, getDeliverableById, getGuestLinkById, getLiveGuestLinkByHash, getSponsorById } from "../../../db/queries/sponsors";
import { hashToken } from "../infra/tokens";
import type { Deal, GuestLink } from "../../../db/schema";

async function channelOf(userId: string, rawId: string | undefined) {
  const channelId = parseId(rawId, "channel");
  const access = await requireChannel(userId, channelId, "channel.read");
  return { access, channelId };
}

/** A loader for a row that carries its channel id: missing, or another channel's, is "not found". */
function byChannelRow<R extends { channelId: string }, O>(code: string, what: string, get: (q: { id: string }) => Promise<R | null>, pick: (row: R) => O) {
  return async (userId: string, raw: string | undefined) => {
    const row = await get({ id: parseId(raw, what) });
    if (!row) throw new AppError(`not_found:${code}`, `No such ${what}.`);
    const access = await requireChannel(userId, row.channelId, "channel.read", what);
    return { access, channelId: row.channelId, ...pick(row) };
  };
}

/** Each loader resolves the path's id through the caller's memberships; another channel's record is "not found". */
export const LOADERS = {
  channel: { param: "channelId", load: channelOf },
  episode: {
    param: "episodeId",
    load: async (userId: string, raw: string | undefined) => {
      const { episode, access } = await loadEpisode(userId, raw);
      return { access, channelId: episode.channelId, episode };
    },
  },
  step: {
    param: "stepId",
    load: async (userId: string, raw: string | undefined) => {
      const { step, channelId, access } = await loadStep(userId, raw);
      return { access, channelId, step };
    },
  },
  material: {
    param: "materialId",
    load: async (userId: string, raw: string | undefined) => {
      const { material, episode, access } = await loadMaterial(userId, raw);
      return { access, channelId: episode.channelId, material, episode };
    },
  },
  tool: {
    param: "toolId",
    load: async (userId: string, raw: string | undefined) => {
      const { tool, access } = await loadTool(userId, raw);
      return { access, channelId: tool.channelId, tool };
    },
  },
  segment: {
    param: "segmentId",
    load: async (userId: string, raw: string | undefined) => {
      const { segment, channelId, access } = await loadSegment(userId, raw);
      return { access, channelId, segment };
    },
  },
  clip: {
    param: "clipId",
    load: async (userId: string, raw: string | undefined) => {
      const { clip, access, episode } = await loadClip(userId, raw);
      return { access, channelId: clip.channelId, clip, episode };
    },
  },
  shot: {
    param: "shotId",
    load: async (userId: string, raw: string | undefined) => {
      const { shot, access } = await loadShot(userId, raw);
      return { access, channelId: access.channelId, shot };
    },
  },
  gap: { param: "gapId", load: byChannelRow("gap", "gap", getGapById, (r) => ({ gap: r.gap })) },
  range: { param: "rangeId", load: byChannelRow("coverage range", "coverage range", getRangeById, (r) => ({ range: r.range })) },
  revision: { param: "revisionId", load: byChannelRow("revision", "revision", getRevisionById, (r) => ({ revision: r.revision })) },
  shootDay: { param: "shootDayId", load: byChannelRow("shoot-day", "shoot day", getShootDayById, (r) => ({ shootDay: r })) },
  sponsor: { param: "sponsorId", load: byChannelRow("sponsor", "sponsor", getSponsorById, (r) => ({ sponsor: r })) },
  deal: { param: "dealId", load: byChannelRow("deal", "deal", getDealById, (r) => ({ deal: r })) },
  reviewLink: { param: "reviewLinkId", load: byChannelRow("review-link", "review link", getGuestLinkById, (r) => ({ link: r.link })) },
  deliverable: { param: "deliverableId", load: byChannelRow("deliverable", "deliverable", getDeliverableById, (r) => ({ deliverable: r.deliverable })) },
  note: { param: "noteId", load: byChannelRow("note", "shoot log note", getNoteById, (r) => ({ note: r.note })) },
} as const;

export type LoadKind = keyof typeof LOADERS;
type Loaded<L extends LoadKind> = Awaited<ReturnType<(typeof LOADERS)[L]["load"]>>;
type Out<S> = S extends z.ZodType ? z.output<S> : undefined;

export interface RouteSpec<L extends LoadKind, B extends z.ZodType | undefined, Q extends z.ZodType | undefined> {
  /** What the path's id names; its loader runs before anything else is read. */
  load: L;
  /**
   * What the caller's role must allow (403 otherwise). A list means any one of
   * them, for routes whose exact action depends on the body, which the handler
   * then checks as well.
   */
  action: Action | readonly Action[];
  /** The body's schema, or a function making it when it depends on settings read per request. */
  body?: B | (() => B);
  query?: Q;
  /** Names the body in error messages ("Check the shot: …"). */
  what?: string;
  /** Content types the body may come as; JSON by default. */
  accepts?: readonly string[];
}

export type ChannelCtx<L extends LoadKind, B, Q> = Loaded<L> & {
  req: Request;
  params: Record<string, string>;
  user: SessionUser;
  access: ChannelAccess;
  channelId: string;
  body: Out<B>;
  query: Out<Q>;
};

export type BuiltSpec =
  | { kind: "channel"; load: LoadKind; param: string; action: Action | readonly Action[]; body?: z.ZodType; query?: z.ZodType }
  | { kind: "user"; body?: z.ZodType; query?: z.ZodType }
  | { kind: "public"; body?: z.ZodType; query?: z.ZodType }
  | { kind: "guest"; body?: z.ZodType; query?: z.ZodType };
type Handler = ((req: Request, ctx: { params: Promise<any> }) => Promise<Response>) & { spec: BuiltSpec };

/** A route on one channel's record. */
export function channelRoute<L extends LoadKind, B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined>(
  spec: RouteSpec<L, B, Q>,
  handler: (ctx: ChannelCtx<L, B, Q>) => Promise<Response>,
): Handler {
  const { param, load } = LOADERS[spec.load];
  const fn = route<Record<string, string>>(
    async (req, params) => {
      const user = await sessionUser(req);
      const loaded = (await load(user.id, params[param])) as Loaded<L>;
      const actions = (typeof spec.action === "string" ? [spec.action] : spec.action) as readonly Action[];
      if (!actions.some((a) => can(loaded.access.roles, a))) assertCan(loaded.access, actions[0]!);
      assertContentType(req, spec.accepts);
      const query = (spec.query ? parseQuery(req, spec.query) : undefined) as Out<Q>;
      const schema = typeof spec.body === "function" ? (spec.body as () => B)() : spec.body;
      const body = (schema ? await parseBody(req, schema, spec.what) : undefined) as Out<B>;
      return handler({ ...loaded, req, params, user, body, query } as ChannelCtx<L, B, Q>);
    },
  );
  const body = typeof spec.body === "function" ? undefined : spec.body;
  return Object.assign(fn, { spec: { kind: "channel" as const, load: spec.load, param, action: spec.action, body, query: spec.query } });
}

/** A route about the signed-in person themselves (their channels, their reading rate). */
export function userRoute<B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined>(
  spec: { body?: B; query?: Q; what?: string; accepts?: readonly string[] },
  handler: (ctx: { req: Request; user: SessionUser; body: Out<B>; query: Out<Q>; params: Record<string, string> }) => Promise<Response>,
): Handler {
  const fn = route<Record<string, string>>(async (req, params) => {
    const user = await sessionUser(req);
    assertContentType(req, spec.accepts);
    const query = (spec.query ? parseQuery(req, spec.query) : undefined) as Out<Q>;
    const body = (spec.body ? await parseBody(req, spec.body, spec.what) : undefined) as Out<B>;
    return handler({ req, user, body, query, params });
  });
  return Object.assign(fn, { spec: { kind: "user" as const, body: spec.body, query: spec.query } });
}

/** A route anyone may call (sign-in helpers, invitations, health); it must say why in its comment. */
export function publicRoute<B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined>(
  spec: { body?: B; query?: Q; what?: string; accepts?: readonly string[] },
  handler: (ctx: { req: Request; body: Out<B>; query: Out<Q>; params: Record<string, string> }) => Promise<Response>,
): Handler {
  const fn = route<Record<string, string>>(
    async (req, params) => {
      assertContentType(req, spec.accepts);
      const query = (spec.query ? parseQuery(req, spec.query) : undefined) as Out<Q>;
      const body = (spec.body ? await parseBody(req, spec.body, spec.what) : undefined) as Out<B>;
      return handler({ req, body, query, params });
    },
  );
  return Object.assign(fn, { spec: { kind: "public" as const, body: spec.body, query: spec.query } });
}

const GUEST_TOKEN = /^[A-Za-z0-9_-]{32,64}$/;

/**
 * A route for a sponsor's contact holding a review link: no session; the
 * link's secret token in the path is the key, and it reaches exactly one
 * deal. An unknown, expired or revoked link is "not found".
 */
export function guestRoute<B extends z.ZodType | undefined = undefined>(
  spec: { body?: B; what?: string },
  handler: (ctx: { req: Request; link: GuestLink; deal: Deal; body: Out<B>; params: Record<string, string> }) => Promise<Response>,
): Handler {
  const fn = route<Record<string, string>>(async (req, params) => {
    const token = params.token ?? "";
    const found = GUEST_TOKEN.test(token) ? await getLiveGuestLinkByHash({ hash: hashToken(token) }) : null;
    if (!found) throw new AppError("not_found:review-link", "This review link has expired or was withdrawn. Ask the channel for a new one.");
    assertContentType(req);
    const body = (spec.body ? await parseBody(req, spec.body, spec.what) : undefined) as Out<B>;
    return handler({ req, link: found.link, deal: found.deal, body, params });
  });
  return Object.assign(fn, { spec: { kind: "guest" as const, body: spec.body } });
}
