"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState } from "@/lib/action-state";
import { acceptInvitationAction } from "./actions";

export function AcceptInvitationForm({ token, studioName }: { token: string; studioName: string }) {
  const [state, action, pending] = useActionState(acceptInvitationAction, idleState);
  return (
    <form action={action} className="flex flex-col gap-4">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <div>
        <Button type="submit" disabled={pending}>
          Join {studioName}
        </Button>
      </div>
    </form>
  );
}
