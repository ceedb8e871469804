// A guard-rail warning shown in a field's hint (so the field's aria-describedby reads it): a note,
// not an error — the value can still be saved. Polite status, so it is heard once when it appears.
import type { GuardRailField, GuardRailWarning } from "@/lib/core/pricing/guard-rails";

export function GuardRailNote({ warnings, field }: { warnings: GuardRailWarning[]; field: GuardRailField }) {
  const w = warnings.find((x) => x.field === field);
  return (
    <span role="status" className="block">
      {w ? (
        <span className="mt-1 block rounded border-l-4 border-[#B7791F] bg-[#FFF8E6] px-2 py-1 font-semibold text-peat" data-testid={`guard-rail-${field}`}>
          {w.message}
        </span>
      ) : null}
    </span>
  );
}
