import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { publishUpdateSchema } from "@/lib/schemas/publish";
import { updatePublishPackage } from "@/lib/server/services/publish";
import { publishViewFor } from "@/lib/server/views/publish";

/** The package with its composed description, the platform's limits and the publish checklist. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => json(await publishViewFor(episode)));

/** Title, summary, closing text, which sections the description carries, and the thumbnail's "Ad" label. */
export const PATCH = channelRoute({ load: "episode", action: "publish.edit", body: publishUpdateSchema, what: "publish package" }, async ({ episode, user, body }) => {
  await updatePublishPackage({ episode, userId: user.id, patch: body });
  return json(await publishViewFor(episode));
});
