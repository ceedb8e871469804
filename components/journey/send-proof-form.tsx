"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { sendProofAction } from "./proof-actions";

export function SendProofForm({ commissionId, nextNumber }: { commissionId: string; nextNumber: number }) {
  const [state, action, pending] = useActionState<ActionState<{ id: string; number: number }>, FormData>(sendProofAction, idleState);
  return (
    <form action={action} className="flex flex-col gap-2" aria-label="Send a proof">
      <input type="hidden" name="commissionId" value={commissionId} />
      <label htmlFor="proof-note" className="font-semibold">
        Note to the client (optional)
      </label>
      <textarea id="proof-note" name="note" rows={3} maxLength={1000} className="rounded-md border border-bark/40 px-2 py-2" defaultValue={state.status === "error" ? state.values?.note : ""} />
      {state.status === "error" ? <Notice tone="error">{state.fieldErrors?.note?.join(" ") ?? state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <div>
        <Button type="submit" disabled={pending}>
          Send proof {nextNumber}
        </Button>
      </div>
    </form>
  );
}
