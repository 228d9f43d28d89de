import { publicRoute } from "@/lib/server/route-builder";
import { openApiDocument } from "@/lib/openapi";

export const dynamic = "force-static";

/** Public: the API's own description. */
export const GET = publicRoute({}, async () => Response.json(openApiDocument()));
