"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { inviteAssistantAction } from "./actions";

export function InviteForm() {
  const [state, action, pending] = useActionState<ActionState<{ id: string; email: string }>, FormData>(
    inviteAssistantAction,
    idleState,
  );
  return (
    <form action={action} className="flex flex-col gap-3" aria-label="Invite an assistant">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">Invitation sent to {state.data.email}.</Notice> : null}
      <Field
        label="Assistant's e-mail"
        name="email"
        type="email"
        autoComplete="off"
        defaultValue={state.status === "error" ? state.values?.email : ""}
        errors={state.status === "error" ? state.fieldErrors?.email : undefined}
      />
      <div>
        <Button type="submit" disabled={pending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
