import Link from "next/link";
import type { CommissionState } from "@/lib/core/workflow/states";
import { formatDay, formatMinor, GARMENT_LABELS } from "@/lib/format";
import { StateBadge } from "./state-badge";

export interface CommissionRow {
  id: string;
  number: number;
  title: string;
  garment: string;
  state: CommissionState;
  neededBy: string | null;
  currency: string;
  priceMinor: number | null;
  budgetMinor: number | null;
  clientName: string;
  studioName: string;
  /** messages from the other side not yet read by the viewer */
  unread?: number;
}

export function CommissionTable({
  rows,
  hrefFor,
  show,
  caption,
}: {
  rows: CommissionRow[];
  hrefFor: (id: string) => string;
  show: "client" | "studio";
  caption: string;
}) {
  if (rows.length === 0) return <p className="text-bark">No commissions yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-bark/30 text-sm text-bark">
            <th scope="col" className="py-2 pr-4">No.</th>
            <th scope="col" className="py-2 pr-4">Commission</th>
            <th scope="col" className="py-2 pr-4">{show === "client" ? "Client" : "Studio"}</th>
            <th scope="col" className="py-2 pr-4">Status</th>
            <th scope="col" className="py-2 pr-4">Needed by</th>
            <th scope="col" className="py-2 pr-4 text-right">Price</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-bark/10 align-top">
              <td className="py-3 pr-4 tabular-nums">{r.number}</td>
              <td className="py-3 pr-4">
                <Link href={hrefFor(r.id)} className="font-semibold">
                  {r.title}
                </Link>
                {r.unread ? (
                  <Link
                    href={`${hrefFor(r.id)}#messages`}
                    className="ml-2 inline-block rounded-full bg-madder-dark px-2 py-0.5 text-xs font-semibold text-white no-underline"
                    data-testid="unread-badge"
                    aria-label={`${r.unread} new message${r.unread === 1 ? "" : "s"} on ${r.title}`}
                  >
                    {r.unread} new message{r.unread === 1 ? "" : "s"}
                  </Link>
                ) : null}
                <div className="text-sm text-bark">{GARMENT_LABELS[r.garment] ?? r.garment}</div>
              </td>
              <td className="py-3 pr-4">{show === "client" ? r.clientName : r.studioName}</td>
              <td className="py-3 pr-4">
                <StateBadge state={r.state} />
              </td>
              <td className="py-3 pr-4 whitespace-nowrap">{formatDay(r.neededBy)}</td>
              <td className="py-3 pr-4 text-right tabular-nums">{formatMinor(r.priceMinor, r.currency)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
