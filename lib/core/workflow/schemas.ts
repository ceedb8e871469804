// Zod schemas for the workflow's names, for route handlers, actions and the database layer.
import { z } from "zod";
import { MOVES } from "./moves";
import { PIECE_STAGES } from "./pieces";
import { ROLES } from "./roles";
import { COMMISSION_STATES } from "./states";

export const commissionStateSchema = z.enum(COMMISSION_STATES);
export const roleSchema = z.enum(ROLES);
export const moveSchema = z.enum(MOVES);
export const pieceStageSchema = z.enum(PIECE_STAGES);

export const moveContextSchema = z.object({
  quoteAccepted: z.boolean().optional(),
  depositPaid: z.boolean().optional(),
  pieces: z.array(z.object({ stage: pieceStageSchema })).optional(),
  pausedFrom: commissionStateSchema.nullable().optional(),
});
