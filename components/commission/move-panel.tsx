"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { STATE_LABELS, clientFacingState, moveLabelFor, type CommissionState, type Move } from "@/lib/core/workflow";
import { moveCommissionAction } from "./move-action";

const NEEDS_REASON: ReadonlySet<Move> = new Set<Move>(["decline", "cancel", "pause", "rework"]);
const DESTRUCTIVE: ReadonlySet<Move> = new Set<Move>(["decline", "cancel"]);

export type PanelMove = { move: Move; label: string; ok: true; to: CommissionState } | { move: Move; label: string; ok: false; reason: string };

function MoveForm({ commissionId, m, as }: { commissionId: string; m: PanelMove; as: "studio" | "client" }) {
  const [state, action, pending] = useActionState<ActionState<{ to: CommissionState }>, FormData>(moveCommissionAction, idleState);
  const reasonId = `reason-${m.move}`;
  const label = moveLabelFor(m.move, as);
  const stateWord = (to: CommissionState) => STATE_LABELS[as === "client" ? clientFacingState(to) : to];
  return (
    <form
      action={action}
      className="flex flex-col gap-2 rounded-md border border-bark/20 p-3"
      onSubmit={(e) => {
        if (DESTRUCTIVE.has(m.move) && !window.confirm(`${label}? This cannot be undone.`)) e.preventDefault();
      }}
    >
      <input type="hidden" name="commissionId" value={commissionId} />
      <input type="hidden" name="move" value={m.move} />
      <input type="hidden" name="as" value={as} />
      {m.ok && NEEDS_REASON.has(m.move) ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={reasonId} className="text-sm font-semibold">
            Reason (shown in the timeline)
          </label>
          <input id={reasonId} name="reason" maxLength={500} className="rounded-md border border-bark/40 px-2 py-1" />
        </div>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant={DESTRUCTIVE.has(m.move) ? "secondary" : "primary"} disabled={!m.ok || pending} aria-describedby={m.ok ? undefined : `why-${m.move}`}>
          {label}
        </Button>
        {m.ok ? <span className="text-sm text-bark">Afterwards it shows as “{stateWord(m.to)}”.</span> : null}
      </div>
      {!m.ok ? (
        <p id={`why-${m.move}`} className="text-sm text-bark">
          {m.reason}
        </p>
      ) : null}
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">Done: it now shows as “{stateWord(state.data.to)}”.</Notice> : null}
    </form>
  );
}

export function MovePanel({ commissionId, moves, as }: { commissionId: string; moves: PanelMove[]; as: "studio" | "client" }) {
  if (!moves.length) return <p className="text-bark">There is nothing for you to do here at this step.</p>;
  return (
    <div className="flex flex-col gap-3">
      {moves.map((m) => (
        <MoveForm key={m.move} commissionId={commissionId} m={m} as={as} />
      ))}
    </div>
  );
}
