import { guestRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { guestReviewFor } from "@/lib/server/views/sponsors";

/** The sponsor's view through their link: this deal's segments with timing, its checks and clips; nothing else. */
export const GET = guestRoute({}, async ({ deal, link }) => json(await guestReviewFor(deal, link)));
