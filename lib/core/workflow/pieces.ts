// Production stages of one piece (a mitten pair, a hat, a sweater) and who may move it between them.
import type { Role } from "./roles";
import { STATE_LABELS, type CommissionState } from "./states";

export const PIECE_STAGES = ["queued", "knitting", "embroidery", "blocking", "finishing", "done"] as const;
export type PieceStage = (typeof PIECE_STAGES)[number];

export const PIECE_STAGE_LABELS: Record<PieceStage, string> = {
  queued: "Queued",
  knitting: "Knitting",
  embroidery: "Embroidery",
  blocking: "Blocking",
  finishing: "Finishing",
  done: "Done",
};

export const PIECE_ROLES = ["owner", "assistant"] as const satisfies readonly Role[];

export interface PieceMoveContext {
  /** the state of the commission the piece belongs to */
  commissionState: CommissionState;
}

export type PieceMoveCode = "forbidden" | "not_in_production" | "same_stage" | "too_far_back" | "unknown";

export type PieceMoveResult =
  | { ok: true; from: PieceStage; to: PieceStage }
  | { ok: false; code: PieceMoveCode; reason: string };

export function isPieceStage(value: unknown): value is PieceStage {
  return typeof value === "string" && (PIECE_STAGES as readonly string[]).includes(value);
}

/**
 * Whether a piece may go from one stage to another.
 * Forward moves may skip stages a piece does not need (a plain piece has no embroidery).
 * Backward moves go exactly one stage, for rework, and never back to the queue once knitting began.
 */
export function canMovePiece(
  stage: PieceStage,
  toStage: PieceStage,
  role: Role,
  ctx: PieceMoveContext,
): PieceMoveResult {
  if (!isPieceStage(stage) || !isPieceStage(toStage)) {
    return { ok: false, code: "unknown", reason: `Unknown production stage "${String(isPieceStage(stage) ? toStage : stage)}".` };
  }
  if (!(PIECE_ROLES as readonly Role[]).includes(role)) {
    return {
      ok: false,
      code: "forbidden",
      reason: "Only the studio owner or an assistant can move a piece between production stages.",
    };
  }
  if (ctx.commissionState !== "in_production") {
    const label = STATE_LABELS[ctx.commissionState] ?? String(ctx.commissionState);
    return {
      ok: false,
      code: "not_in_production",
      reason: `Pieces move between stages only while the commission is in production; it is "${label}".`,
    };
  }
  const from = PIECE_STAGES.indexOf(stage);
  const to = PIECE_STAGES.indexOf(toStage);
  if (to === from) {
    return { ok: false, code: "same_stage", reason: `The piece is already at ${PIECE_STAGE_LABELS[stage]}.` };
  }
  if (to > from) return { ok: true, from: stage, to: toStage };
  if (toStage === "queued") {
    return {
      ok: false,
      code: "too_far_back",
      reason: "Knitting has started, so the piece cannot go back to the queue; move it back one stage for rework instead.",
    };
  }
  if (from - to > 1) {
    const oneBack = PIECE_STAGES[from - 1];
    return {
      ok: false,
      code: "too_far_back",
      reason: `A piece goes back only one stage for rework: from ${PIECE_STAGE_LABELS[stage]} to ${PIECE_STAGE_LABELS[oneBack]}.`,
    };
  }
  return { ok: true, from: stage, to: toStage };
}

/** The stages a piece may go to from where it is (for the board's buttons). */
export function pieceMovesFrom(stage: PieceStage, role: Role, ctx: PieceMoveContext): PieceStage[] {
  return PIECE_STAGES.filter((to) => canMovePiece(stage, to, role, ctx).ok);
}

export interface ReadyCheck {
  ready: boolean;
  /** pieces not yet done */
  notDone: number;
  total: number;
}

/** A commission is ready when it has at least one piece and every piece is done. */
export function commissionReadyWhen(pieces: ReadonlyArray<{ stage: PieceStage }>): ReadyCheck {
  const notDone = pieces.filter((p) => p.stage !== "done").length;
  return { ready: pieces.length > 0 && notDone === 0, notDone, total: pieces.length };
}

export type PiecePathResult = { ok: true; steps: PieceStage[] } | { ok: false; code: PieceMoveCode; reason: string };

/**
 * The moves that take a piece from `stage` to `toStage` one stage at a time, each allowed by
 * `canMovePiece` (so the board can move a piece several stages at once and every stage it passes
 * is recorded). Backward it is the single rework step the rules allow. The first refused step
 * refuses the whole path with its reason.
 */
export function piecePath(stage: PieceStage, toStage: PieceStage, role: Role, ctx: PieceMoveContext): PiecePathResult {
  const direct = canMovePiece(stage, toStage, role, ctx);
  if (!direct.ok) return direct;
  const from = PIECE_STAGES.indexOf(stage);
  const to = PIECE_STAGES.indexOf(toStage);
  if (to < from) return { ok: true, steps: [toStage] };
  const steps: PieceStage[] = [];
  let at = stage;
  for (let i = from + 1; i <= to; i++) {
    const next = PIECE_STAGES[i];
    const step = canMovePiece(at, next, role, ctx);
    if (!step.ok) return step;
    steps.push(next);
    at = next;
  }
  return { ok: true, steps };
}
