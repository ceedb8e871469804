"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import type { Audience } from "@/lib/schemas/notifications";
import { markAllReadAction, saveNotificationSettingsAction } from "./actions";

export function MarkAllReadForm({ audience, unread }: { audience: Audience; unread: number }) {
  const [state, run, pending] = useActionState<ActionState<{ marked: number }>, FormData>(markAllReadAction, idleState);
  return (
    <form action={run} className="flex flex-wrap items-center gap-3">
      <input type="hidden" name="audience" value={audience} />
      <Button type="submit" variant="secondary" disabled={pending || unread === 0}>
        {pending ? "Marking…" : "Mark all as read"}
      </Button>
      <p role="status" aria-live="polite" className="text-sm text-bark">
        {state.status === "error" ? state.message : state.status === "ok" ? `${state.data.marked} marked as read.` : ""}
      </p>
    </form>
  );
}

export function NotificationSettingsForm({ audience, kinds }: { audience: Audience; kinds: { kind: string; label: string; email: boolean }[] }) {
  const [state, run, pending] = useActionState<ActionState<{ saved: boolean }>, FormData>(saveNotificationSettingsAction, idleState);
  return (
    <form action={run} aria-label="E-mail notifications" className="flex flex-col gap-3">
      <input type="hidden" name="audience" value={audience} />
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">E-mail me when…</legend>
        {kinds.map((k) => (
          <label key={k.kind} className="flex items-start gap-2">
            <input type="checkbox" name={`email_${k.kind}`} defaultChecked={k.email} className="mt-1 h-5 w-5" />
            <span>{k.label}</span>
          </label>
        ))}
      </fieldset>
      <p className="text-sm text-bark">Everything also appears in your notifications list here, whatever you choose.</p>
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Save e-mail choices"}
        </Button>
      </div>
      <div aria-live="polite">
        {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
        {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      </div>
    </form>
  );
}
