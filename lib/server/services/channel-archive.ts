import "server-only";
/**
 * A whole channel out as one zip, and back in as a new channel.
 *
 * The zip, in this order:
 *   header.json            format, version, which channel, when
 *   users.ndjson           every user the rows point at (id, e-mail, name)
 *   records/NN-table.ndjson  one JSON row per line, parents before children
 *   objects.ndjson         the stored objects the rows name (key, size, type);
 *                          the bytes stay in storage
 *   manifest.json          rows and SHA-256 of every entry above, signed
 *                          with HMAC-SHA256 by this installation's key
 *
 * Both ways stream: the export reads each table through a cursor in one
 * read-only snapshot and writes it into the zip as it goes; the import reads
 * the zip entry by entry and inserts in batches, all in one transaction that
 * commits only when the manifest at the end verifies (so a tampered or cut
 * off file writes nothing). Ids are re-made with UUID v5 in a namespace of
 * the import, so no table of old-to-new ids is held in memory. Stored objects
 * are copied store to store under the new channel's keys.
 */
import crypto from "node:crypto";
import { Readable } from "node:stream";
import { StringDecoder } from "node:string_decoder";
import { ZipArchive } from "archiver";
import unzipper from "unzipper";
import { v5 as uuidv5 } from "uuid";
import { getTableConfig, PgTable } from "drizzle-orm/pg-core";
import * as schema from "../../../db/schema";
import { pool } from "../../../db/client";
import {
  ARCHIVE_TABLES,
  SECRET_COLUMNS,
  addToObjectList,
  archiveColumns,
  channelReferencesKeys,
  createObjectList,
  ensureOwner,
  keepStamps,
  openObjectListCursor,
  closeCursor,
  fetchFromCursor,
  insertJsonRows,
  openTableCursor,
  referencedUsers,
  usersByEmail,
  type ColumnInfo,
} from "../../../db/queries/archive";
import { copyObject, deleteObject, headObject } from "../../../storage/s3";
import { channelKeyPrefix } from "../../../storage/keys";
import { env } from "../../env";
import { requireChannel } from "../access/access";
import { AppError } from "../http/errors";

export const ARCHIVE_FORMAT = "jigboard-channel-export";
export const ARCHIVE_VERSION = 1;
const BATCH = 500;

/** Columns that hold a storage key. */
export const KEY_COLUMNS: Record<string, string[]> = { clips: ["storage_key"], tools: ["photo_key"], build_steps: ["failure_photo_key"], publish_packages: ["thumbnail_key"] };

/** Columns that point at a user, from the schema's foreign keys. */
export const USER_COLUMNS: { table: string; column: string }[] = Object.values(schema).flatMap((t) => {
  if (!(t instanceof PgTable)) return [];
  const c = getTableConfig(t);
  if (!ARCHIVE_TABLES.some((a) => a.table === c.name)) return [];
  return c.foreignKeys.flatMap((fk) => {
    const ref = fk.reference();
    return getTableConfig(ref.foreignTable).name === "users" ? ref.columns.map((col) => ({ table: c.name, column: col.name })) : [];
  });
});
/** Rows that cannot exist without their user: dropped when the user is not on this installation. */
const NEEDS_USER: Record<string, string> = { memberships: "user_id", days_away: "user_id", shoot_day_crew: "user_id" };

function signingKey(): Buffer {
  const e = env();
  return crypto.createHash("sha256").update(`jigboard export signing\n${e.EXPORT_SIGNING_SECRET ?? e.NEXTAUTH_SECRET}`).digest();
}

export function signManifest(body: unknown): string {
  return crypto.createHmac("sha256", signingKey()).update(JSON.stringify(body)).digest("hex");
}

const fileName = (i: number, table: string) => `records/${String(i).padStart(2, "0")}-${table}.ndjson`;

/* ───────────── export ───────────── */

/**
 * The channel as a zip stream. The caller must hold channel.export on it.
 * The snapshot's connection is released when the stream ends or fails.
 */
export async function exportChannel(channelId: string): Promise<Readable> {
  const client = await pool().connect();
  await client.query("begin isolation level repeatable read read only");
  let released = false;
  const release = async (ok: boolean) => {
    if (released) return;
    released = true;
    await client.query(ok ? "commit" : "rollback").catch(() => undefined);
    client.release();
  };
  try {
    const users = await referencedUsers(client, channelId, USER_COLUMNS);
    const files: Record<string, { rows: number; sha256: string }> = {};
    const zip = new ZipArchive({ zlib: { level: 6 } });
    // Each entry's rows and hash are known when its generator ends; the manifest waits for all of them.
    const written: Promise<void>[] = [];

    const entry = (name: string, lines: () => AsyncGenerator<string>) => {
      let finished: () => void = () => undefined;
      // archiver may start reading every appended stream at once; each entry waits for the one before, so one cursor runs at a time.
      const before = written.at(-1);
      written.push(new Promise<void>((r) => (finished = r)));
      const gen = async function* () {
        await before;
        const h = crypto.createHash("sha256");
        let rows = 0;
        for await (const line of lines()) {
          const buf = Buffer.from(`${line}\n`, "utf8");
          h.update(buf);
          rows++;
          yield buf;
        }
        files[name] = { rows, sha256: h.digest("hex") };
        finished();
      };
      zip.append(Readable.from(gen(), { objectMode: false }), { name, date: new Date(0) });
    };

    const exportedAt = new Date().toISOString();
    const header = { format: ARCHIVE_FORMAT, version: ARCHIVE_VERSION, sourceChannelId: channelId, exportedAt };
    entry("header.json", async function* () {
      yield JSON.stringify(header);
    });
    entry("users.ndjson", async function* () {
      for (const u of users) yield JSON.stringify(u);
    });
    for (const [i, t] of ARCHIVE_TABLES.entries()) {
      entry(fileName(i, t.table), async function* () {
        const cursor = `jb_export_${i}`;
        await openTableCursor(client, cursor, t, channelId);
        for (;;) {
          const rows = await fetchFromCursor(client, cursor, BATCH);
          if (!rows.length) break;
          yield* rows;
        }
        await closeCursor(client, cursor);
      });
    }
    entry(
      "objects.ndjson",
      async function* () {
        for (const [table, columns] of Object.entries(KEY_COLUMNS)) {
          const t = ARCHIVE_TABLES.find((x) => x.table === table)!;
          const cursor = `jb_keys_${table}`;
          await openTableCursor(client, cursor, t, channelId);
          for (;;) {
            const rows = await fetchFromCursor(client, cursor, BATCH);
            if (!rows.length) break;
            for (const raw of rows) {
              const row = JSON.parse(raw) as Record<string, unknown>;
              for (const c of columns) {
                const key = row[c];
                if (typeof key !== "string" || !key) continue;
                const head = await headObject(key);
                yield JSON.stringify(head ? { key, size: head.size ?? 0, contentType: head.contentType ?? null } : { key, missing: true });
              }
            }
          }
          await closeCursor(client, cursor);
        }
      },
    );
    // The manifest is made last, when every entry before it has been written and hashed.
    zip.append(
      Readable.from(
        (async function* () {
          await Promise.all(written);
          // Sorted by name, whatever order the entries finished in.
          const body = { ...header, files: Object.fromEntries(Object.keys(files).sort().map((k) => [k, files[k]!])) };
          yield Buffer.from(JSON.stringify({ body, signature: signManifest(body) }));
        })(),
      ),
      { name: "manifest.json", date: new Date(0) },
    );
    zip.on("end", () => void release(true));
    zip.on("error", () => void release(false));
    zip.on("close", () => void release(false));
    void zip.finalize().catch(() => release(false));
    return zip;
  } catch (e) {
    await release(false);
    throw e;
  }
}

/* ───────────── import ───────────── */

export interface RemapContext {
  oldChannelId: string;
  newChannelId: string;
  namespace: string;
  users: Map<string, string | null>;
  name: string;
}

export function remapKey(key: string, ctx: Pick<RemapContext, "oldChannelId" | "newChannelId">): string {
  const from = channelKeyPrefix(ctx.oldChannelId);
  return key.startsWith(from) ? channelKeyPrefix(ctx.newChannelId) + key.slice(from.length) : `${channelKeyPrefix(ctx.newChannelId)}imported/${key}`;
}

const sets = new Map<string, { userCols: Set<string>; keyCols: Set<string> }>();
/** Which columns of a table hold users and storage keys, worked out once per table, not per row. */
function columnSets(table: string) {
  let v = sets.get(table);
  if (!v) sets.set(table, (v = { userCols: new Set(USER_COLUMNS.filter((u) => u.table === table).map((u) => u.column)), keyCols: new Set(KEY_COLUMNS[table] ?? []) }));
  return v;
}

/** One exported row as it goes into the new channel; null when it cannot (its user is not here). */
export function remapRow(table: string, row: Record<string, unknown>, columns: ColumnInfo[], ctx: RemapContext): Record<string, unknown> | null {
  const out: Record<string, unknown> = {};
  const { userCols, keyCols } = columnSets(table);
  for (const c of columns) {
    const v = row[c.name];
    if (v === undefined) continue;
    if (v === null) {
      out[c.name] = null;
      continue;
    }
    if (userCols.has(c.name)) out[c.name] = ctx.users.get(String(v)) ?? null;
    else if (c.type === "uuid") out[c.name] = uuidv5(String(v), ctx.namespace);
    else if (keyCols.has(c.name)) out[c.name] = remapKey(String(v), ctx);
    else out[c.name] = v;
  }
  if (table === "channels") out.name = ctx.name;
  const need = NEEDS_USER[table];
  if (need && out[need] === null) return null;
  return out;
}

const refuse = (why: string) => new AppError("unprocessable:import", `This file cannot be imported: ${why}. Nothing was written.`, { fields: { file: [why] } });

interface Seen {
  rows: number;
  sha256: string;
}

/** Reads one zip entry line by line, hashing its bytes as they pass; a damaged entry throws. */
async function* linesOf(entry: AsyncIterable<Buffer>, seen: Seen): AsyncGenerator<string> {
  const h = crypto.createHash("sha256");
  const decoder = new StringDecoder("utf8");
  let rest = "";
  for await (const chunk of entry) {
    h.update(chunk);
    const text = rest + decoder.write(chunk);
    const lines = text.split("\n");
    rest = lines.pop()!;
    for (const line of lines) {
      if (!line) continue;
      seen.rows++;
      yield line;
    }
  }
  rest += decoder.end();
  if (rest) {
    seen.rows++;
    yield rest;
  }
  seen.sha256 = h.digest("hex");
}

/**
 * Imports an export as a new channel owned by the caller, who must be an
 * owner of the channel it was exported from. Returns the new channel's id.
 */
export async function importChannel({ userId, body, name }: { userId: string; body: Readable; name?: string }): Promise<{ channelId: string; namespace: string; rows: number; objects: number }> {
  const namespace = crypto.randomUUID();
  const client = await pool().connect();
  const copied: string[] = [];
  try {
    await client.query("begin");
    await createObjectList(client);
    await keepStamps(client);
    const columns = await archiveColumns(client);
    const seen = new Map<string, Seen>();
    let header: { format: string; version: number; sourceChannelId: string; exportedAt: string } | null = null;
    let manifest: { body: { format: string; version: number; sourceChannelId: string; exportedAt: string; files: Record<string, Seen> }; signature: string } | null = null;
    let ctx: RemapContext | null = null;
    let tableIndex = -1;
    let totalRows = 0;

    const parser = body.pipe(unzipper.Parse({ forceStream: true }));
    // A file cut off ends the parser with an error while an entry is open; that entry must fail too, or reading it waits for ever.
    let current: unzipper.Entry | null = null;
    let failed: Error | null = null;
    parser.on("error", (e: Error) => {
      failed = e;
      current?.destroy(e);
    });
    body.on("error", (e) => parser.destroy(e));
    for await (const raw of parser) {
      const entry = raw as unzipper.Entry;
      // Errors surface through the reads below; a listener keeps a late one (after the read stopped) from escaping.
      entry.on("error", () => undefined);
      current = entry;
      if (failed) throw failed;
      const path = entry.path;
      if (manifest) throw refuse(`"${path}" comes after the manifest`);
      if (seen.has(path)) throw refuse(`"${path}" appears twice`);
      const s: Seen = { rows: 0, sha256: "" };
      seen.set(path, s);
      if (path === "manifest.json") {
        let text = "";
        for await (const chunk of entry) text += (chunk as Buffer).toString("utf8");
        try {
          manifest = JSON.parse(text);
        } catch {
          throw refuse("the manifest is not readable");
        }
        continue;
      }
      if (path === "header.json") {
        if (seen.size !== 1) throw refuse("the header is not the first entry");
        for await (const line of linesOf(entry, s)) header = JSON.parse(line);
        if (!header || header.format !== ARCHIVE_FORMAT) throw refuse("it is not a channel export");
        if (header.version !== ARCHIVE_VERSION) throw refuse(`it is format version ${header.version}; this installation reads version ${ARCHIVE_VERSION}`);
        // The caller must own the channel the export came from (404 when they are not in it).
        await requireChannel(userId, header.sourceChannelId, "channel.export");
        continue;
      }
      if (!header) throw refuse("the header is missing");
      if (path === "users.ndjson") {
        const list: { id: string; email: string }[] = [];
        for await (const line of linesOf(entry, s)) list.push(JSON.parse(line));
        const here = await usersByEmail(client, list.map((u) => u.email));
        const users = new Map(list.map((u) => [u.id, here.get(u.email.toLowerCase()) ?? null]));
        ctx = { oldChannelId: header.sourceChannelId, newChannelId: uuidv5(header.sourceChannelId, namespace), namespace, users, name: "" };
        continue;
      }
      if (!ctx) throw refuse("the list of users is missing");
      const m = /^records\/(\d{2})-([a-z_]+)\.ndjson$/.exec(path);
      if (m) {
        const i = Number(m[1]);
        const t = ARCHIVE_TABLES[i];
        if (!t || t.table !== m[2] || i !== tableIndex + 1) throw refuse(`"${path}" is not the table expected next`);
        tableIndex = i;
        const cols = columns.get(t.table)!;
        const insertCols = cols.filter((c) => !c.identity).map((c) => c.name);
        let batch: object[] = [];
        for await (const line of linesOf(entry, s)) {
          const row = JSON.parse(line) as Record<string, unknown>;
          if (t.table === "channels") ctx.name = (name ?? `${String(row.name)} (copy)`).slice(0, 120);
          const out = remapRow(t.table, row, cols, ctx);
          if (!out) continue;
          for (const secret of SECRET_COLUMNS[t.table] ?? []) if (t.table === "guest_links") out[secret] = crypto.randomBytes(32).toString("hex");
          batch.push(out);
          if (batch.length >= BATCH) {
            await insertJsonRows(client, t.table, insertCols, batch);
            totalRows += batch.length;
            batch = [];
          }
        }
        await insertJsonRows(client, t.table, insertCols, batch);
        totalRows += batch.length;
        continue;
      }
      if (path === "objects.ndjson") {
        if (tableIndex !== ARCHIVE_TABLES.length - 1) throw refuse("some tables are missing");
        let batch: { key: string; size: number }[] = [];
        const flush = async () => {
          // Each key must be one the exported channel's own rows name (resolved through its records, not by its prefix).
          const known = await channelReferencesKeys(client, header!.sourceChannelId, batch.map((b) => b.key));
          const stranger = batch.find((b) => !known.has(b.key));
          if (stranger) throw refuse(`a stored object is not the exported channel's (${stranger.key})`);
          await addToObjectList(client, batch);
          batch = [];
        };
        for await (const line of linesOf(entry, s)) {
          const o = JSON.parse(line) as { key: string; size?: number; missing?: boolean };
          if (o.missing) continue;
          batch.push({ key: o.key, size: o.size ?? 0 });
          if (batch.length >= BATCH) await flush();
        }
        if (batch.length) await flush();
        continue;
      }
      throw refuse(`it holds an entry this format does not have ("${path}")`);
    }

    // Everything read: the manifest must vouch for exactly what arrived.
    if (!manifest || !header || !ctx) throw refuse("it ends before the manifest (the file is cut off)");
    if (manifest.signature !== signManifest(manifest.body)) throw refuse("its manifest was changed, or it was signed by another installation");
    if (manifest.body.sourceChannelId !== header.sourceChannelId || manifest.body.exportedAt !== header.exportedAt) throw refuse("the header does not match the manifest");
    const expected = Object.keys(manifest.body.files).sort();
    const got = [...seen.keys()].filter((k) => k !== "manifest.json").sort();
    if (JSON.stringify(expected) !== JSON.stringify(got)) throw refuse("entries are missing or added");
    for (const [file, want] of Object.entries(manifest.body.files)) {
      const have = seen.get(file)!;
      if (have.sha256 !== want.sha256 || have.rows !== want.rows) throw refuse(`"${file}" was changed after export`);
    }

    // The importer owns the new channel, whatever the export said.
    await ensureOwner(client, ctx.newChannelId, userId);

    // Objects store to store, after every check; a failure undoes the copies and the rows.
    await openObjectListCursor(client, "jb_objects");
    let objects = 0;
    for (;;) {
      const keys = await fetchFromCursor(client, "jb_objects", 100, "key");
      if (!keys.length) break;
      for (const key of keys) {
        const to = remapKey(key, ctx);
        try {
          await copyObject(key, to);
        } catch {
          throw new AppError("unavailable:storage", `Storage did not copy ${key}; nothing was imported. Try again.`);
        }
        copied.push(to);
        objects++;
      }
    }
    await closeCursor(client, "jb_objects");
    await client.query("commit");
    return { channelId: ctx.newChannelId, namespace, rows: totalRows, objects };
  } catch (e) {
    await client.query("rollback").catch(() => undefined);
    await Promise.all(copied.map((k) => deleteObject(k).catch(() => undefined)));
    if (e instanceof AppError) throw e;
    const msg = e instanceof Error ? e.message : String(e);
    // A zip cut off mid-entry, or a byte changed inside a compressed entry.
    if (/unexpected end|invalid|incorrect|FILE_ENDED|aborted|Z_BUF_ERROR|Z_DATA_ERROR|premature|signature/i.test(msg) || (e as { code?: string }).code?.startsWith?.("Z_")) throw refuse("the zip is damaged or cut off");
    if ((e as { code?: string }).code && /^2|^4/.test((e as { code: string }).code)) throw refuse(`a record does not fit (${msg})`);
    if (e instanceof SyntaxError) throw refuse("a record is not readable JSON");
    throw e;
  } finally {
    client.release();
  }
}
