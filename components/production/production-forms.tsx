"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { closeAction, shipAction } from "./production-actions";

export function ShipForm({ commissionId }: { commissionId: string }) {
  const [state, action, pending] = useActionState<ActionState<{ ok: boolean }>, FormData>(shipAction, idleState);
  const v = state.status === "error" ? state.values : undefined;
  const fe = state.status === "error" ? state.fieldErrors : undefined;
  return (
    <form action={action} className="flex flex-col gap-3" aria-label="Mark shipped">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <input type="hidden" name="commissionId" value={commissionId} />
      <Field name="carrier" label="Carrier" hint="Or “hand-over in person”." defaultValue={v?.carrier ?? ""} errors={fe?.carrier} />
      <Field name="tracking" label="Tracking number" defaultValue={v?.tracking ?? ""} errors={fe?.tracking} />
      <div>
        <Button type="submit" disabled={pending}>
          Mark shipped
        </Button>
      </div>
    </form>
  );
}

export function CloseForm({ commissionId }: { commissionId: string }) {
  const [state, action, pending] = useActionState<ActionState<{ historyRows: number }>, FormData>(closeAction, idleState);
  return (
    <form action={action} className="flex flex-col gap-2" aria-label="Close commission">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <input type="hidden" name="commissionId" value={commissionId} />
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          Close and keep its hours as history
        </Button>
      </div>
    </form>
  );
}
