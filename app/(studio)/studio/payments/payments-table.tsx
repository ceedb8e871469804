"use client";
// The studio's payments: filters kept in the URL, fetched with react-query, shown with react-table.
import { useQuery } from "@tanstack/react-query";
import { flexRender, type SortingState } from "@tanstack/react-table";
// The v8-style API of react-table 9 (its compatibility layer): plain sorting is all we need.
import { getCoreRowModel, getSortedRowModel, legacyCreateColumnHelper, useLegacyTable, type LegacyColumnDef } from "@tanstack/react-table/legacy";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { Notice } from "@/components/ui/notice";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { PAYMENT_STATUSES } from "@/lib/schemas/payments";

interface Row {
  id: string;
  createdAt: string;
  paidAt: string | null;
  kind: "deposit" | "balance";
  status: string;
  amountMinor: number;
  refundedMinor: number;
  currency: string;
  commissionId: string;
  commissionNumber: number;
  commissionTitle: string;
  clientName: string;
}

const STATUS_LABEL: Record<string, string> = { open: "Awaiting payment", paid: "Paid", failed: "Declined", expired: "Expired", refunded: "Refunded", partially_refunded: "Partly refunded" };
const col = legacyCreateColumnHelper<Row>();
const columns = [
  col.accessor("createdAt", { header: "Created", cell: (c) => c.getValue().slice(0, 10) }),
  col.accessor("commissionTitle", {
    header: "Commission",
    cell: (c) => <Link href={`/studio/commissions/${c.row.original.commissionId}`}>{`${c.row.original.commissionNumber}. ${c.getValue()}`}</Link>,
  }),
  col.accessor("clientName", { header: "Client" }),
  col.accessor("kind", { header: "Kind", cell: (c) => (c.getValue() === "deposit" ? "Deposit" : "Balance") }),
  col.accessor("status", { header: "Status", cell: (c) => STATUS_LABEL[c.getValue()] ?? c.getValue() }),
  col.accessor("amountMinor", { header: "Amount", cell: (c) => formatMoney(c.getValue(), c.row.original.currency) }),
  col.accessor("refundedMinor", { header: "Refunded", cell: (c) => formatMoney(c.getValue(), c.row.original.currency) }),
  // Each accessor knows its own value type; the table takes them as one list.
] as unknown as LegacyColumnDef<Row>[];

const SETTLED = new Set(["paid", "partially_refunded", "refunded"]);

export function PaymentsTable() {
  const params = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const filters = { status: params.get("status") ?? "", from: params.get("from") ?? "", to: params.get("to") ?? "" };
  const qs = new URLSearchParams(Object.entries(filters).filter(([, v]) => v)).toString();
  const [sorting, setSorting] = useState<SortingState>([]);
  const q = useQuery({
    queryKey: ["payments", qs],
    queryFn: async () => {
      const res = await fetch(`/api/payments${qs ? `?${qs}` : ""}`);
      const body = (await res.json()) as { payments?: Row[]; error?: { message: string } };
      if (!res.ok) throw new Error(body.error?.message ?? "The payments could not be loaded.");
      return body.payments ?? [];
    },
  });
  const data = q.data ?? [];
  const table = useLegacyTable({ data, columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });
  const setFilter = (key: string, value: string) => {
    const next = new URLSearchParams(params.toString());
    if (value) next.set(key, value);
    else next.delete(key);
    router.replace(`${pathname}${next.size ? `?${next}` : ""}`, { scroll: false });
  };
  const totals = new Map<string, { received: number; refunded: number; open: number }>();
  for (const r of data) {
    const t = totals.get(r.currency) ?? { received: 0, refunded: 0, open: 0 };
    if (SETTLED.has(r.status)) t.received += r.amountMinor;
    if (r.status === "open" || r.status === "failed") t.open += r.amountMinor;
    t.refunded += r.refundedMinor;
    totals.set(r.currency, t);
  }
  return (
    <div className="flex flex-col gap-4">
      <form role="search" aria-label="Filter payments" className="flex flex-wrap items-end gap-4" onSubmit={(e) => e.preventDefault()}>
        <div className="flex flex-col gap-1">
          <label htmlFor="f-status" className="font-semibold">
            Status
          </label>
          <select id="f-status" className="rounded-md border border-bark/40 bg-white px-3 py-2" value={filters.status} onChange={(e) => setFilter("status", e.target.value)}>
            <option value="">Any</option>
            {PAYMENT_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABEL[s]}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="f-from" className="font-semibold">
            From
          </label>
          <input id="f-from" type="date" className="rounded-md border border-bark/40 bg-white px-3 py-2" value={filters.from} onChange={(e) => setFilter("from", e.target.value)} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="f-to" className="font-semibold">
            To
          </label>
          <input id="f-to" type="date" className="rounded-md border border-bark/40 bg-white px-3 py-2" value={filters.to} onChange={(e) => setFilter("to", e.target.value)} />
        </div>
        <a href={`/api/payments/export${qs ? `?${qs}` : ""}`} download className="pb-2">
          Download these payments as CSV
        </a>
      </form>
      {q.isError ? <Notice tone="error">{(q.error as Error).message}</Notice> : null}
      <div className="overflow-x-auto rounded-lg border border-bark/20 bg-white">
        <table className="w-full text-left text-sm">
          <caption className="p-3 text-left text-bark">{q.isLoading ? "Loading payments…" : `${data.length} payment${data.length === 1 ? "" : "s"}`}</caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => (
                  <th key={h.id} scope="col" className="px-3 py-2" aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : undefined}>
                    <button type="button" className="font-semibold underline-offset-2 hover:underline" onClick={h.column.getToggleSortingHandler()}>
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      {h.column.getIsSorted() === "asc" ? " ↑" : h.column.getIsSorted() === "desc" ? " ↓" : ""}
                    </button>
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((r) => (
              <tr key={r.id} className="border-t border-bark/10">
                {r.getVisibleCells().map((c) => (
                  <td key={c.id} className="px-3 py-2">
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
          <tfoot>
            {[...totals].map(([cur, t]) => (
              <tr key={cur} className="border-t border-bark/30 font-semibold">
                <th scope="row" className="px-3 py-2" colSpan={5}>
                  Totals ({cur})
                </th>
                <td className="px-3 py-2">Received {formatMoney(t.received, cur)}; awaiting {formatMoney(t.open, cur)}</td>
                <td className="px-3 py-2">{formatMoney(t.refunded, cur)}</td>
              </tr>
            ))}
          </tfoot>
        </table>
      </div>
    </div>
  );
}
