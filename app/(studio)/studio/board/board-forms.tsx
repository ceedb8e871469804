"use client";
import { useActionState, useId } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { PIECE_STAGE_LABELS, PIECE_STAGES, type PieceStage } from "@/lib/core/workflow/pieces";
import { markReadyAction, moveCommissionPiecesAction, movePieceAction, setUpPiecesAction } from "./actions";

export function MovePieceForm({ pieceId, pieceName, stage, moves }: { pieceId: string; pieceName: string; stage: PieceStage; moves: PieceStage[] }) {
  const [state, action, pending] = useActionState<ActionState<{ stage: string }>, FormData>(movePieceAction, idleState);
  const id = useId();
  if (moves.length === 0) return null;
  const next = moves.find((m) => PIECE_STAGES.indexOf(m) > PIECE_STAGES.indexOf(stage)) ?? moves[0];
  return (
    <form action={action} className="mt-2 flex flex-wrap items-end gap-2">
      <input type="hidden" name="pieceId" value={pieceId} />
      <div className="flex flex-col">
        <label htmlFor={id} className="text-sm font-semibold">
          Move {pieceName} to
        </label>
        <select id={id} name="toStage" defaultValue={next} className="rounded-md border border-bark/40 bg-white px-2 py-1">
          {moves.map((m) => (
            <option key={m} value={m}>
              {PIECE_STAGES.indexOf(m) < PIECE_STAGES.indexOf(stage) ? `${PIECE_STAGE_LABELS[m]} (back for rework)` : PIECE_STAGE_LABELS[m]}
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" variant="secondary" disabled={pending} className="px-3 py-1 text-sm">
        {pending ? "Moving…" : "Move"}
      </Button>
      {state.status === "error" ? (
        <div className="w-full">
          <Notice tone="error">{state.message}</Notice>
        </div>
      ) : null}
    </form>
  );
}

/** Moves every piece of a commission to one stage at once (each through the stages between). */
export function MoveCommissionPiecesForm({ commissionId, title, stages }: { commissionId: string; title: string; stages: PieceStage[] }) {
  const [state, action, pending] = useActionState<ActionState<{ moved: number; total: number }>, FormData>(moveCommissionPiecesAction, idleState);
  const id = useId();
  return (
    <form action={action} className="flex flex-wrap items-end gap-2">
      <input type="hidden" name="commissionId" value={commissionId} />
      <div className="flex flex-col">
        <label htmlFor={id} className="text-sm font-semibold">
          Move all pieces of {title} to
        </label>
        <select id={id} name="toStage" defaultValue={stages[stages.length - 1]} className="rounded-md border border-bark/40 bg-white px-2 py-1">
          {stages.map((m) => (
            <option key={m} value={m}>
              {PIECE_STAGE_LABELS[m]}
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" variant="secondary" disabled={pending} className="px-3 py-1 text-sm">
        {pending ? "Moving…" : "Move together"}
      </Button>
      <div className="w-full" aria-live="polite">
        {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
        {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      </div>
    </form>
  );
}

export function SetUpPiecesForm({
  commissionId,
  title,
  layouts,
  start,
}: {
  commissionId: string;
  title: string;
  layouts: { id: string; label: string }[];
  start: boolean;
}) {
  const [state, action, pending] = useActionState<ActionState<{ ok: boolean }>, FormData>(setUpPiecesAction, idleState);
  const id = useId();
  return (
    <form action={action} className="flex flex-wrap items-end gap-2" aria-label={`Pieces for ${title}`}>
      <input type="hidden" name="commissionId" value={commissionId} />
      <input type="hidden" name="start" value={start ? "yes" : "no"} />
      <div className="flex flex-col">
        <label htmlFor={id} className="text-sm font-semibold">
          Pieces for {title}
        </label>
        <select id={id} name="layout" className="rounded-md border border-bark/40 bg-white px-2 py-1">
          {layouts.map((l) => (
            <option key={l.id} value={l.id}>
              {l.label}
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" disabled={pending} className="px-3 py-1 text-sm">
        {start ? "Start production" : "Set up pieces"}
      </Button>
      {state.status === "error" ? (
        <div className="w-full">
          <Notice tone="error">{state.message}</Notice>
        </div>
      ) : null}
    </form>
  );
}

export function MarkReadyForm({ commissionId, title }: { commissionId: string; title: string }) {
  const [state, action, pending] = useActionState<ActionState<{ ok: boolean }>, FormData>(markReadyAction, idleState);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="commissionId" value={commissionId} />
      <Button type="submit" disabled={pending} className="px-3 py-1 text-sm" aria-label={`Mark ${title} ready`}>
        Mark ready
      </Button>
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
    </form>
  );
}
