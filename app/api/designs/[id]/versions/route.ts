import { z } from "zod";
import { designIdSchema, saveDesignVersionSchema } from "@/lib/schemas/designs";
import { listDesignVersions, saveDesignVersion } from "@/lib/server/designs";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: designIdSchema });

/** GET /api/designs/:id/versions — every kept version, newest first. */
export const GET = route({ params }, async ({ actor, params: p }) => ({ versions: await listDesignVersions(actor, p.id) }));

/**
 * POST /api/designs/:id/versions { parentVersionId, charts, note? } — saves a new version.
 * 201 when it became the head; 409 `version_conflict` when another save got there first (this
 * one is kept as a sibling: both ids are in the answer); 409 `design_locked` once approved.
 */
export const POST = route({ params, body: saveDesignVersionSchema }, async ({ actor, params: p, body }) => {
  const outcome = await saveDesignVersion(actor, p.id, body);
  const version = { id: outcome.version.id, number: outcome.version.number, parentVersionId: outcome.version.parentVersionId, contentHash: outcome.version.contentHash, createdAt: outcome.version.createdAt };
  if (outcome.kind === "saved") return Response.json({ version, unchanged: outcome.unchanged }, { status: outcome.unchanged ? 200 : 201 });
  return Response.json(
    {
      error: {
        code: "version_conflict",
        message: `Another tab saved a newer version${outcome.headNumber ? ` (version ${outcome.headNumber})` : ""}. Yours is kept as version ${outcome.version.number}.`,
      },
      version,
      savedVersionId: outcome.version.id,
      headVersionId: outcome.headVersionId,
      headNumber: outcome.headNumber,
    },
    { status: 409 },
  );
});
