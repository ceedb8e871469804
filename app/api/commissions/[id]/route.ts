import { z } from "zod";
import { route } from "@/lib/server/route";
import { getCommissionFor } from "@/lib/server/queries/commissions";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });

export const GET = route({ params }, async ({ actor, params: p }) => ({ commission: await getCommissionFor(actor, p.id) }));
