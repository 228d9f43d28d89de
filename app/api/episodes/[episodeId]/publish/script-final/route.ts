import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { scriptFinalSchema } from "@/lib/schemas/publish";
import { markScriptFinal } from "@/lib/server/services/publish";
import { publishViewFor } from "@/lib/server/views/publish";

/** Marks the script final as it stands (any later edit undoes it), or takes the mark away. */
export const PUT = channelRoute({ load: "episode", action: "script.write", body: scriptFinalSchema, what: "script mark" }, async ({ episode, user, body }) => {
  await markScriptFinal({ episode, userId: user.id, final: body.final });
  return json(await publishViewFor(episode));
});
