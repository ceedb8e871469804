"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { setPriceAction } from "./actions";

export function PriceForm({ commissionId, current, currency }: { commissionId: string; current: string; currency: string }) {
  const [state, action, pending] = useActionState<ActionState<{ priceMinor: number | null }>, FormData>(setPriceAction, idleState);
  return (
    <form action={action} className="flex flex-col gap-3" aria-label="Agreed price">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <input type="hidden" name="commissionId" value={commissionId} />
      <Field
        label={`Agreed price (${currency})`}
        name="price"
        inputMode="decimal"
        defaultValue={state.status === "error" ? (state.values?.price ?? current) : current}
        errors={state.status === "error" ? state.fieldErrors?.price : undefined}
      />
      <div>
        <Button type="submit" disabled={pending}>
          Save price
        </Button>
      </div>
    </form>
  );
}
