// A small GET form above a list: a search box and one select, kept in the URL so a filtered view
// can be bookmarked and shared. Works without JavaScript; "Clear" goes back to the whole list.
import Link from "next/link";

export function ListFilter({
  action,
  label,
  q,
  placeholder,
  select,
}: {
  action: string;
  /** names the form for assistive technology, e.g. "Find commissions" */
  label: string;
  q: string;
  placeholder: string;
  select?: { name: string; label: string; value: string; options: { value: string; label: string }[] };
}) {
  const filtered = q !== "" || (select && select.value !== "");
  return (
    <form method="get" action={action} role="search" aria-label={label} className="mb-6 flex flex-wrap items-end gap-3">
      <div className="flex flex-col">
        <label htmlFor="list-q" className="text-sm font-semibold">
          Search
        </label>
        <input id="list-q" name="q" type="search" defaultValue={q} placeholder={placeholder} maxLength={100} className="w-64 rounded-md border border-bark/40 bg-white px-3 py-2" />
      </div>
      {select ? (
        <div className="flex flex-col">
          <label htmlFor="list-select" className="text-sm font-semibold">
            {select.label}
          </label>
          <select id="list-select" name={select.name} defaultValue={select.value} className="rounded-md border border-bark/40 bg-white px-3 py-2">
            {select.options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </div>
      ) : null}
      <button type="submit" className="rounded-md bg-madder px-4 py-2 font-semibold text-white hover:bg-madder-dark">
        Show
      </button>
      {filtered ? (
        <Link href={action} className="py-2">
          Clear
        </Link>
      ) : null}
    </form>
  );
}

/** One search parameter as a short plain string ("" when missing, repeated or too long). */
export function searchParam(v: string | string[] | undefined, max = 100): string {
  return typeof v === "string" ? v.trim().slice(0, max) : "";
}

/** Case- and accent-insensitive "contains" over a row's words. */
export function matchesSearch(q: string, ...fields: (string | number | null | undefined)[]): boolean {
  if (!q) return true;
  const fold = (s: string) => s.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();
  const needle = fold(q);
  return fields.some((f) => f !== null && f !== undefined && fold(String(f)).includes(needle));
}
