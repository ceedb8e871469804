// The cautions that apply to a piece (lib/core/safety), as one compact block: title, plain words,
// and the source in small print. Not a live region: it changes with the choices above it, and a
// screen reader should not read the whole list again at each change.
import { useId } from "react";
import type { Caution } from "@/lib/core/safety";

export function CautionList({ cautions, title = "Safety notes", intro }: { cautions: Caution[]; title?: string; intro?: string }) {
  const id = useId();
  if (!cautions.length) return null;
  return (
    <section aria-labelledby={id} className="rounded-md border-l-4 border-[#B7791F] bg-[#FFF8E6] p-4" data-testid="cautions">
      <h3 id={id} className="font-semibold">
        {title}
      </h3>
      {intro ? <p className="text-sm">{intro}</p> : null}
      <ul className="mt-2 flex flex-col gap-2">
        {cautions.map((c) => (
          <li key={c.id} data-caution={c.id}>
            <strong>{c.title}.</strong> {c.text}
            <span className="block text-sm text-bark">Source: {c.source}.</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
