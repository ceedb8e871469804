"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { decideProposalAction, proposeRatesAction } from "./actions";

export function ProposeForm({ studioId }: { studioId: string }) {
  const [state, action, pending] = useActionState<ActionState<{ id: string }>, FormData>(proposeRatesAction, idleState);
  return (
    <form action={action} className="flex flex-col gap-2">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <input type="hidden" name="studioId" value={studioId} />
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          Propose these rates
        </Button>
      </div>
    </form>
  );
}

export function DecideForm({ studioId, proposalId }: { studioId: string; proposalId: string }) {
  const [state, action, pending] = useActionState<ActionState<{ status: string }>, FormData>(decideProposalAction, idleState);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="studioId" value={studioId} />
      <input type="hidden" name="proposalId" value={proposalId} />
      <Button type="submit" name="decision" value="accepted" disabled={pending}>
        Accept: use these rates
      </Button>
      <Button type="submit" name="decision" value="rejected" variant="secondary" disabled={pending}>
        Reject
      </Button>
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">Proposal {state.data.status}.</Notice> : null}
    </form>
  );
}
