"use client";
// A small form bound to a server action: hidden fields, optional inputs, one submit button, and
// the action's message (or errors) announced beside it.
import { useActionState, useEffect, useRef, useState, type ReactNode } from "react";
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
  confirm,
}: {
  action: (prev: ActionState<T>, form: FormData) => Promise<ActionState<T>>;
  hidden: Record<string, string>;
  label: string;
  variant?: "primary" | "secondary";
  children?: ReactNode;
  name: string;
  /** for an action that cannot be undone: the question asked before it is sent */
  confirm?: string;
}) {
  const [state, run, pending] = useActionState<ActionState<T>, FormData>(action, idleState);
  const [asking, setAsking] = useState(false);
  const keepRef = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (asking) keepRef.current?.focus();
  }, [asking]);
  // The question closes once the action has answered (not on the click: that would remove the submit button).
  useEffect(() => setAsking(false), [state]);
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
      {confirm && asking ? (
        <div role="group" aria-label={confirm} className="flex flex-wrap items-center gap-2 rounded-md border border-madder/40 bg-fleece p-2" onKeyDown={(e) => e.key === "Escape" && setAsking(false)}>
          <p className="font-semibold">{confirm}</p>
          <Button type="submit" disabled={pending}>
            Yes, {label.charAt(0).toLowerCase() + label.slice(1)}
          </Button>
          <Button ref={keepRef} variant="secondary" onClick={() => setAsking(false)}>
            No, go back
          </Button>
        </div>
      ) : (
        <div>
          {confirm ? (
            <Button variant={variant} disabled={pending} onClick={() => setAsking(true)}>
              {label}
            </Button>
          ) : (
            <Button type="submit" variant={variant} disabled={pending}>
              {label}
            </Button>
          )}
        </div>
      )}
    </form>
  );
}
