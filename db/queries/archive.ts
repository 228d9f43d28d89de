import "server-only";
/**
 * Raw reads and writes for a whole-channel export and import. They run on a
 * dedicated client (cursors need one connection) that the caller has put in
 * a transaction; nothing here opens or ends one.
 *
 * Rows travel as PostgreSQL's own JSON of the row (to_jsonb) and come back
 * through json_populate_recordset, so every type (timestamps with their
 * microseconds, numerics with their scale, arrays, jsonb) survives exactly.
 */
import type pg from "pg";

/** Tables of one channel, parents before children, with the rows that belong to it ($1 is the channel id). */
export const ARCHIVE_TABLES: { table: string; scope: string; order: string }[] = (() => {
  const byChannel = (table: string, order = "id") => ({ table, scope: "channel_id = $1", order });
  const byEpisode = (table: string, order = "id") => ({ table, scope: "episode_id in (select id from episodes where channel_id = $1)", order });
  const byStep = (table: string, order: string) => ({ table, scope: "step_id in (select s.id from build_steps s join episodes e on e.id = s.episode_id where e.channel_id = $1)", order });
  const byDay = (table: string, order = "id") => ({ table, scope: "shoot_day_id in (select id from shoot_days where channel_id = $1)", order });
  const byDeal = (table: string, order = "id") => ({ table, scope: "deal_id in (select id from deals where channel_id = $1)", order });
  return [
    { table: "channels", scope: "id = $1", order: "id" },
    byChannel("memberships", "user_id"),
    byChannel("sponsors"),
    { table: "sponsor_contacts", scope: "sponsor_id in (select id from sponsors where channel_id = $1)", order: "id" },
    byChannel("tools"),
    byChannel("episodes"),
    byChannel("shoot_days"),
    byEpisode("build_steps"),
    byStep("step_dependencies", "step_id, depends_on_step_id"),
    byStep("step_tools", "step_id, tool_id"),
    byEpisode("materials"),
    byEpisode("script_segments"),
    byEpisode("script_revisions"),
    byChannel("days_away", "user_id, day"),
    byDay("shoot_day_crew", "shoot_day_id, user_id"),
    byDay("shoot_day_helpers"),
    byEpisode("scheduled_steps", "step_id"),
    byDay("call_sheet_sends"),
    byEpisode("gaps"),
    byEpisode("shots"),
    byChannel("clips"),
    byEpisode("coverage_ranges"),
    byEpisode("shoot_log_notes"),
    byChannel("deals"),
    byDeal("deal_episodes", "deal_id, episode_id"),
    byDeal("deal_tools", "deal_id, tool_id"),
    byDeal("deliverables"),
    byDeal("guest_links"),
    byDeal("review_comments"),
    byDeal("invoices"),
    byEpisode("publish_packages"),
    byEpisode("publish_overrides"),
    byChannel("audit_entries"),
  ];
})();

/** Columns that are secrets of this installation: never written to an export. */
export const SECRET_COLUMNS: Record<string, string[]> = { channels: ["calendar_token_hash"], guest_links: ["token_hash"] };

export interface ColumnInfo {
  name: string;
  type: string;
  /** Numbered by the database (GENERATED ALWAYS): a new number on import. */
  identity: boolean;
}

/** Column names and types of the archived tables, from the catalogue. */
export async function archiveColumns(client: pg.ClientBase): Promise<Map<string, ColumnInfo[]>> {
  const { rows } = await client.query<{ table_name: string; column_name: string; data_type: string; is_identity: string }>(
    "select table_name, column_name, data_type, is_identity from information_schema.columns where table_schema = 'public' and table_name = any($1) order by table_name, ordinal_position",
    [ARCHIVE_TABLES.map((t) => t.table)],
  );
  const out = new Map<string, ColumnInfo[]>();
  for (const r of rows) out.set(r.table_name, [...(out.get(r.table_name) ?? []), { name: r.column_name, type: r.data_type, identity: r.is_identity === "YES" }]);
  return out;
}

/** Opens a cursor over one table's rows of the channel, as JSON text, secrets left out. */
export async function openTableCursor(client: pg.ClientBase, name: string, t: (typeof ARCHIVE_TABLES)[number], channelId: string) {
  const drop = (SECRET_COLUMNS[t.table] ?? []).map((c) => ` - '${c}'`).join("");
  await client.query(`declare ${name} no scroll cursor for select (to_jsonb(t)${drop})::text as j from ${t.table} t where ${t.scope} order by ${t.order}`, [channelId]);
}

/** The next rows of a cursor, one column of each. */
export async function fetchFromCursor(client: pg.ClientBase, name: string, n: number, column = "j"): Promise<string[]> {
  const { rows } = await client.query<Record<string, string>>(`fetch ${n} from ${name}`);
  return rows.map((r) => r[column]!);
}

export async function closeCursor(client: pg.ClientBase, name: string) {
  await client.query(`close ${name}`);
}

/** Every user a channel's rows point at (members, authors, former members), with the address that identifies them. */
export async function referencedUsers(client: pg.ClientBase, channelId: string, userColumns: { table: string; column: string }[]) {
  const scope = new Map(ARCHIVE_TABLES.map((t) => [t.table, t.scope]));
  const parts = userColumns.map((u) => `select ${u.column} as id from ${u.table} where ${scope.get(u.table)}`);
  const { rows } = await client.query<{ id: string; email: string; name: string }>(`select u.id, u.email, u.name from users u where u.id in (${parts.join(" union ")}) order by u.id`, [channelId]);
  return rows;
}

/** Users of this installation by address. */
export async function usersByEmail(client: pg.ClientBase, emails: string[]) {
  if (!emails.length) return new Map<string, string>();
  const { rows } = await client.query<{ id: string; email: string }>("select id, email from users where lower(email) = any($1)", [emails.map((e) => e.toLowerCase())]);
  return new Map(rows.map((r) => [r.email.toLowerCase(), r.id]));
}

/** Inserts rows given as JSON objects into these columns, typed by the table itself. */
export async function insertJsonRows(client: pg.ClientBase, table: string, columns: string[], rows: object[]) {
  if (!rows.length) return;
  const list = columns.map((c) => `"${c}"`).join(", ");
  await client.query(`insert into ${table} (${list}) select ${list} from json_populate_recordset(null::${table}, $1::json)`, [JSON.stringify(rows)]);
}

/** A scratch list of the stored objects to copy, gone at the end of the transaction. */
export async function createObjectList(client: pg.ClientBase) {
  await client.query("create temp table jb_import_objects (key text primary key, size bigint not null) on commit drop");
}

export async function addToObjectList(client: pg.ClientBase, objects: { key: string; size: number }[]) {
  await client.query("insert into jb_import_objects (key, size) select * from json_to_recordset($1::json) as x(key text, size bigint) on conflict do nothing", [JSON.stringify(objects)]);
}

export async function openObjectListCursor(client: pg.ClientBase, name: string) {
  await client.query(`declare ${name} no scroll cursor for select key from jb_import_objects order by key`);
}

/** The importing user owns the new channel, with whatever roles the export gave them. */
export async function ensureOwner(client: pg.ClientBase, channelId: string, userId: string) {
  await client.query(
    "insert into memberships (channel_id, user_id, roles) values ($1, $2, '{owner}') on conflict (channel_id, user_id) do update set roles = array(select distinct r from unnest(memberships.roles || '{owner}'::text[]) r)",
    [channelId, userId],
  );
}

/** True when the channel's rows reference this storage key (a clip, a tool photo, a failure photo or a thumbnail). */
export async function channelReferencesKeys(client: pg.ClientBase, channelId: string, keys: string[]): Promise<Set<string>> {
  if (!keys.length) return new Set();
  const { rows } = await client.query<{ k: string }>(
    `select storage_key as k from clips where channel_id = $1 and storage_key = any($2)
     union select photo_key from tools where channel_id = $1 and photo_key = any($2)
     union select s.failure_photo_key from build_steps s join episodes e on e.id = s.episode_id where e.channel_id = $1 and s.failure_photo_key = any($2)
     union select p.thumbnail_key from publish_packages p join episodes e on e.id = p.episode_id where e.channel_id = $1 and p.thumbnail_key = any($2)`,
    [channelId, keys],
  );
  return new Set(rows.map((r) => r.k));
}

/** For this transaction, rows keep the stamps they were exported with (the episode stamp triggers stand aside). */
export async function keepStamps(client: pg.ClientBase) {
  await client.query("select set_config('jigboard.importing', 'on', true)");
}
