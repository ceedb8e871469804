"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createPiecesSchema, moveCommissionPiecesSchema, movePieceSchema } from "@/lib/schemas/production";
import { formAction } from "@/lib/server/action";
import { createPieces, markCommissionReady, moveCommissionPieces, movePiece, startProduction } from "@/lib/server/production";

export const movePieceAction = formAction(
  movePieceSchema,
  async (input, actor) => {
    const piece = await movePiece(actor, input.pieceId, input.toStage);
    revalidatePath("/studio/board");
    return { stage: piece.stage as string };
  },
  { message: "Moved." },
);

export const moveCommissionPiecesAction = formAction(
  moveCommissionPiecesSchema,
  async (input, actor) => {
    const r = await moveCommissionPieces(actor, input.commissionId, input.toStage);
    revalidatePath("/studio/board");
    revalidatePath(`/studio/commissions/${input.commissionId}`);
    return r;
  },
  { message: "Moved together." },
);

export const setUpPiecesAction = formAction(
  createPiecesSchema.extend({ start: z.enum(["yes", "no"]).default("no") }),
  async (input, actor) => {
    if (input.start === "yes") await startProduction(actor, input.commissionId, input.layout);
    else await createPieces(actor, input.commissionId, input.layout);
    revalidatePath("/studio/board");
    revalidatePath(`/studio/commissions/${input.commissionId}`);
    return { ok: true };
  },
  { message: "Pieces set up." },
);

export const markReadyAction = formAction(
  z.object({ commissionId: z.string().uuid() }),
  async (input, actor) => {
    await markCommissionReady(actor, input.commissionId);
    revalidatePath("/studio/board");
    revalidatePath(`/studio/commissions/${input.commissionId}`);
    return { ok: true };
  },
  { message: "Marked ready; the balance can now be collected." },
);
