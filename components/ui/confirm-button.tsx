"use client";
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button } from "./button";

/**
 * A destructive button that asks once, in place: the first press shows the question with
 * "confirm" and "keep" buttons (focus moves to "keep", the safe choice); Escape keeps.
 */
export function ConfirmButton({
  label,
  question,
  confirmLabel,
  keepLabel = "Keep it",
  onConfirm,
  disabled,
  className = "",
}: {
  label: string;
  question: ReactNode;
  confirmLabel: string;
  keepLabel?: string;
  onConfirm: () => void;
  disabled?: boolean;
  className?: string;
}) {
  const [asking, setAsking] = useState(false);
  const keepRef = useRef<HTMLButtonElement>(null);
  const id = useId();
  useEffect(() => {
    if (asking) keepRef.current?.focus();
  }, [asking]);
  if (!asking) {
    return (
      <Button variant="quiet" className={`px-2 py-1 text-sm ${className}`} disabled={disabled} onClick={() => setAsking(true)}>
        {label}
      </Button>
    );
  }
  return (
    <div
      role="group"
      aria-labelledby={`${id}-q`}
      className="flex w-full flex-wrap items-center gap-2 rounded-md border border-madder/40 bg-fleece p-2"
      onKeyDown={(e) => {
        if (e.key === "Escape") setAsking(false);
      }}
    >
      <p id={`${id}-q`} className="text-sm font-semibold">
        {question}
      </p>
      <Button
        className="px-3 py-1 text-sm"
        disabled={disabled}
        onClick={() => {
          setAsking(false);
          onConfirm();
        }}
      >
        {confirmLabel}
      </Button>
      <Button ref={keepRef} variant="secondary" className="px-3 py-1 text-sm" onClick={() => setAsking(false)}>
        {keepLabel}
      </Button>
    </div>
  );
}
