"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { idleState, type ActionState } from "@/lib/action-state";
import { retryMailAction } from "./actions";

export function RetryButton({ id, subject }: { id: string; subject: string }) {
  const [state, action, pending] = useActionState<ActionState<{ id: string }>, FormData>(retryMailAction, idleState);
  return (
    <form action={action} className="flex flex-col gap-1">
      <input type="hidden" name="id" value={id} />
      <Button type="submit" variant="secondary" disabled={pending} aria-label={`Send again: ${subject}`}>
        Send again
      </Button>
      {state.status !== "idle" ? (
        <span role="status" className="text-sm">
          {state.message}
        </span>
      ) : null}
    </form>
  );
}
