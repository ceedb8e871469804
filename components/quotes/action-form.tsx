"use client";
// A small form bound to a server action: hidden fields, optional inputs, one submit button, and
// the action's message (or errors) announced beside it.
import { useActionState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";

export function ActionForm<T>({
  action,
  hidden,
  label,
  variant = "primary",
  children,
  name,
}: {
  action: (prev: ActionState<T>, form: FormData) => Promise<ActionState<T>>;
  hidden: Record<string, string>;
  label: string;
  variant?: "primary" | "secondary";
  children?: ReactNode;
  name: string;
}) {
  const [state, run, pending] = useActionState<ActionState<T>, FormData>(action, idleState);
  const okText = state.status === "ok" ? (state.message ?? (state.data as { text?: string } | undefined)?.text) : undefined;
  return (
    <form action={run} aria-label={name} className="flex flex-col gap-3">
      {Object.entries(hidden).map(([k, v]) => (
        <input key={k} type="hidden" name={k} value={v} />
      ))}
      {children}
      {state.status === "error" ? (
        <Notice tone="error">
          {state.message}
          {state.fieldErrors ? " " + Object.values(state.fieldErrors).flat().join(" ") : ""}
        </Notice>
      ) : null}
      {okText ? <Notice tone="success">{okText}</Notice> : null}
      <div>
        <Button type="submit" variant={variant} disabled={pending}>
          {label}
        </Button>
      </div>
    </form>
  );
}
