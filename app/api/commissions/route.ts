import { route } from "@/lib/server/route";
import { listCommissionsFor } from "@/lib/server/queries/commissions";

export const dynamic = "force-dynamic";

/** GET /api/commissions: the commissions the signed-in person may see. */
export const GET = route({}, async ({ actor }) => ({ commissions: await listCommissionsFor(actor) }));
