/** "1,234 of 2,000 characters", announced politely; shown in the error colour past the limit. */
export function CharCount({ id, length, max, showFrom = 0 }: { id?: string; length: number; max: number; showFrom?: number }) {
  if (length < showFrom) return null;
  const over = length > max;
  return (
    <p id={id} className={`text-sm tabular-nums ${over ? "font-semibold text-madder-dark" : "text-bark"}`} aria-live={over ? "polite" : "off"} data-testid="char-count">
      {length.toLocaleString("en-GB")} of {max.toLocaleString("en-GB")} characters{over ? ` (${(length - max).toLocaleString("en-GB")} too many)` : ""}
    </p>
  );
}
