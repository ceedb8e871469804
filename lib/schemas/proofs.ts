// Proofs: sending one, approving it, asking for changes with comments pinned to stitches.
import { z } from "zod";
import { safeString } from "./common";

export const sendProofSchema = z.object({
  commissionId: z.string().uuid(),
  note: safeString().trim().max(1000, "Keep the note to 1000 characters.").default(""),
});

export const approveProofSchema = z.object({
  proofId: z.string().uuid(),
  /** the hash of the proof the client looked at; a different one means the page is stale */
  contentHash: z.string().regex(/^[0-9a-f]{64}$/, "Reload the proof and try again."),
  checked: z.literal("on", { error: "Tick the box to say you have checked the charts, colours and lettering." }),
});

export const pinnedCommentSchema = z.object({
  chartIndex: z.number().int().min(0).max(11),
  /** trade numbering: row from the bottom, stitch from the right, both from 1 */
  row: z.number().int().min(1).max(400),
  stitch: z.number().int().min(1).max(400),
  body: safeString().trim().min(1, "Write what you would like changed here.").max(500, "Keep each comment to 500 characters."),
});
export type PinnedComment = z.infer<typeof pinnedCommentSchema>;

export const requestChangesSchema = z
  .object({
    proofId: z.string().uuid(),
    contentHash: z.string().regex(/^[0-9a-f]{64}$/, "Reload the proof and try again."),
    note: safeString().trim().max(2000, "Keep the note to 2000 characters.").default(""),
    comments: z
      .string()
      .default("[]")
      .transform((s, ctx) => {
        try {
          return JSON.parse(s) as unknown;
        } catch {
          ctx.addIssue({ code: "custom", message: "The pinned comments could not be read; reload and try again." });
          return z.NEVER;
        }
      })
      .pipe(z.array(pinnedCommentSchema).max(40, "Pin at most 40 comments to one proof.")),
  })
  .refine((v) => v.note.length > 0 || v.comments.length > 0, { path: ["note"], message: "Say what you would like changed, or pin a comment to a stitch." });
export type RequestChangesInput = z.output<typeof requestChangesSchema>;
