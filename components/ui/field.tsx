import { useId, type InputHTMLAttributes, type ReactNode } from "react";

/** A labelled input with its hint and errors wired for screen readers. */
export function Field({
  label,
  hint,
  errors,
  id,
  className = "",
  ...input
}: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; hint?: ReactNode; errors?: string[] }) {
  const auto = useId();
  const inputId = id ?? auto;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = errors?.length ? `${inputId}-error` : undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={inputId} className="font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-bark">
          {hint}
        </p>
      ) : null}
      <input
        id={inputId}
        aria-invalid={errorId ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(" ") || undefined}
        className={`rounded-md border bg-white px-3 py-2 text-base ${errorId ? "border-madder" : "border-bark/40"}`}
        {...input}
      />
      {errorId ? (
        <p id={errorId} className="text-sm font-semibold text-madder-dark" role="alert">
          {errors!.join(" ")}
        </p>
      ) : null}
    </div>
  );
}
