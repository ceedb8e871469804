import type { QuoteVersion } from "@/db/schema";
import { formatMoney } from "@/lib/core/pricing/format-money";

const STATUS: Record<QuoteVersion["status"], string> = {
  draft: "Draft (not sent)",
  sent: "Sent, awaiting answer",
  accepted: "Accepted",
  changes_requested: "Changes asked for",
  superseded: "Replaced by a newer version",
  expired: "Expired",
};

/** Quote versions as a table, with their PDFs. */
export function QuoteVersionList({ versions }: { versions: QuoteVersion[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm [&_td]:px-2 [&_th]:px-2">
        <caption className="sr-only">Quote versions, newest first</caption>
        <thead>
          <tr>
            <th scope="col">Version</th>
            <th scope="col">Status</th>
            <th scope="col" className="text-right">
              Total
            </th>
            <th scope="col">Valid until</th>
            <th scope="col">PDF</th>
          </tr>
        </thead>
        <tbody>
          {versions.map((v) => (
            <tr key={v.id} className="border-t border-bark/10">
              <td className="py-1">{v.number}</td>
              <td className="py-1">
                {STATUS[v.status]}
                {v.status === "accepted" && v.acceptedName ? ` by ${v.acceptedName}` : ""}
                {v.status === "changes_requested" && v.changeRequest ? `: “${v.changeRequest}”` : ""}
              </td>
              <td className="py-1 text-right tabular-nums">{formatMoney(v.totalMinor, v.currency)}</td>
              <td className="py-1">{v.validUntil ?? "—"}</td>
              <td className="py-1">
                <a href={`/api/quotes/${v.id}/pdf`} download>
                  Quote version {v.number} (PDF)
                </a>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
