import { publicRoute } from "@/lib/server/http/route-builder";
import { openApiDocument } from "@/lib/openapi";

export const dynamic = "force-static";

/** Public: the API's own description. */
export const GET = publicRoute({}, async () => Response.json(openApiDocument()));
