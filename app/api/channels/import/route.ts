import { Readable } from "node:stream";
import { userRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { importQuerySchema } from "@/lib/schemas/publish";
import { importChannel } from "@/lib/server/services/channel-archive";

/**
 * A channel export (the zip, as the body) becomes a new channel owned by the
 * caller, who must own the exported channel. Streamed; nothing is written
 * unless the whole file arrives and its signed manifest verifies.
 */
export const POST = userRoute({ query: importQuerySchema, accepts: ["application/zip"] }, async ({ req, user, query }) => {
  if (!req.body) throw new AppError("validation:import", "Send the export zip as the body.", { fields: { file: ["send the export zip as the body"] } });
  const result = await importChannel({ userId: user.id, body: Readable.fromWeb(req.body as import("node:stream/web").ReadableStream), name: query.name });
  return json({ channelId: result.channelId, rows: result.rows, objects: result.objects }, 201);
});
