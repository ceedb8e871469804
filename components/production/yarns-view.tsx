"use client";
// The studio's yarns: a sortable, filterable table, stock against reservations, the purchase list,
// and the add / edit forms (react-hook-form + the shared zod schema).
import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import {
  createColumnHelper,
  createSortedRowModel,
  flexRender,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_text,
  tableFeatures,
  useTable,
  type SortingState,
} from "@tanstack/react-table";
import { useId, useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { formatMoney, minorToDecimalString } from "@/lib/core/pricing/format-money";
import { YARN_WEIGHTS } from "@/lib/core/yarn/yarn-weights";
import { lotSchema, yarnFormSchema } from "@/lib/schemas/yarns";
import type { YarnRow } from "@/lib/server/yarns";
import { api, ApiError } from "./api";
import { ScrollArea } from "./scroll-area";


export interface YarnsData {
  currency: string;
  yarns: YarnRow[];
  purchase: { yarnId: string; label: string; skeins: number; costMinor: number }[];
}

// Sorting in the browser; filtering is done on the rows before they reach the table.
const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, basic: sortFn_basic },
});
const col = createColumnHelper<typeof features, YarnRow>();

export function YarnsView({ initial, isOwner }: { initial: YarnsData; isOwner: boolean }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ["yarns"], queryFn: () => api<YarnsData>("/api/yarns"), initialData: initial });
  const data = q.data;
  const money = (minor: number) => formatMoney(minor, data.currency, "en-GB");
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const [filter, setFilter] = useState("");
  const [weight, setWeight] = useState("");
  const [editing, setEditing] = useState<YarnRow | "new" | null>(null);
  const ids = { filter: useId(), weight: useId() };
  const refresh = () => qc.invalidateQueries({ queryKey: ["yarns"] });

  const columns = useMemo(
    () => col.columns([
      col.accessor((r) => `${r.colourName}`, {
        id: "colour",
        header: "Colour",
        cell: (c) => (
          <span className="flex items-center gap-2">
            <span aria-hidden="true" className="inline-block h-5 w-5 rounded border border-bark/40" style={{ backgroundColor: c.row.original.hex }} />
            {c.row.original.colourName} <span className="text-sm text-bark">{c.row.original.hex}</span>
          </span>
        ),
      }),
      col.accessor("name", { header: "Yarn" }),
      col.accessor("fibre", { header: "Fibre" }),
      col.accessor("weightCategory", { header: "Weight", cell: (c) => `${c.getValue()} ${c.row.original.weightName}` }),
      col.accessor("metresPerSkein", { header: "m / skein" }),
      col.accessor("gramsPerSkein", { header: "g / skein" }),
      col.accessor("priceMinor", { header: "Price / skein", cell: (c) => money(c.getValue()) }),
      col.accessor("stock", {
        header: "Stock (skeins)",
        cell: (c) => (
          <span>
            {c.getValue()}
            <span className="block text-sm text-bark">{c.row.original.lots.map((l) => `${l.lotCode}: ${l.stockSkeins}`).join(", ") || "no lots"}</span>
          </span>
        ),
      }),
      col.accessor("reserved", { header: "Reserved" }),
      col.accessor("short", {
        header: "Status",
        cell: (c) =>
          c.getValue() > 0 ? (
            <span className="font-semibold text-madder-dark">▲ Short by {c.getValue()}</span>
          ) : (
            <span className="text-moss">Enough</span>
          ),
      }),
      col.display({
        id: "actions",
        header: "Change",
        cell: (c) => (
          <Button variant="quiet" className="px-0 py-0 text-sm" onClick={() => setEditing(c.row.original)} aria-label={`Edit ${c.row.original.name}, ${c.row.original.colourName}`}>
            Edit
          </Button>
        ),
      }),
    ]),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [data.currency],
  );
  const rows = useMemo(() => {
    const v = filter.trim().toLowerCase();
    return data.yarns.filter(
      (y) =>
        (weight === "" || String(y.weightCategory) === weight) &&
        (v === "" || [y.name, y.colourName, y.fibre, y.hex, y.weightName].some((t) => t.toLowerCase().includes(v))),
    );
  }, [data.yarns, weight, filter]);
  const table = useTable({
    features,
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
  });

  return (
    <div className="flex flex-col gap-6">
      {data.purchase.length > 0 ? (
        <section aria-labelledby="buy-heading" className="rounded-lg border-l-4 border-madder bg-white p-4">
          <h2 id="buy-heading" className="mb-2 text-xl">To buy</h2>
          <p className="mb-2 text-bark">Stock is below what accepted commissions have reserved.</p>
          <ul>
            {data.purchase.map((p) => (
              <li key={p.yarnId}>
                {p.label}: {p.skeins} skein{p.skeins === 1 ? "" : "s"} (about {money(p.costMinor)})
              </li>
            ))}
          </ul>
          <p className="mt-2 font-semibold">Total about {money(data.purchase.reduce((s, p) => s + p.costMinor, 0))}</p>
        </section>
      ) : (
        <Notice tone="success">Stock covers every reservation.</Notice>
      )}

      <div className="flex flex-wrap items-end gap-4">
        <div className="flex flex-col">
          <label htmlFor={ids.filter} className="font-semibold">Filter</label>
          <input id={ids.filter} value={filter} onChange={(e) => setFilter(e.target.value)} placeholder="Name, colour or fibre" className="rounded-md border border-bark/40 bg-white px-3 py-2" />
        </div>
        <div className="flex flex-col">
          <label htmlFor={ids.weight} className="font-semibold">Weight</label>
          <select id={ids.weight} value={weight} onChange={(e) => setWeight(e.target.value)} className="rounded-md border border-bark/40 bg-white px-3 py-2">
            <option value="">All weights</option>
            {YARN_WEIGHTS.categories.map((w) => (
              <option key={w.category} value={w.category}>
                {w.category} {w.name}
              </option>
            ))}
          </select>
        </div>
        {isOwner ? <Button onClick={() => setEditing("new")}>Add a yarn</Button> : null}
      </div>

      {editing ? (
        <YarnForm
          key={editing === "new" ? "new" : editing.id}
          yarn={editing === "new" ? null : editing}
          currency={data.currency}
          isOwner={isOwner}
          onDone={() => {
            setEditing(null);
            void refresh();
          }}
          onSaved={refresh}
        />
      ) : null}

      <ScrollArea label="Yarns table">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">The studio&apos;s yarns; column headings sort the table</caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id} className="border-b border-bark/30 text-sm text-bark">
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th key={h.id} scope="col" className="py-2 pr-3" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                      {h.column.id !== "actions" ? (
                        <button type="button" onClick={h.column.getToggleSortingHandler()} className="font-semibold underline-offset-2 hover:underline">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">{sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((r) => (
              <tr key={r.id} className="border-b border-bark/10 align-top">
                {r.getAllCells().map((c) => (
                  <td key={c.id} className="py-2 pr-3">
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {table.getRowModel().rows.length === 0 ? <p className="mt-2 text-bark">No yarn matches.</p> : null}
      </ScrollArea>
    </div>
  );
}

const formSchema = yarnFormSchema.extend({
  lotCode: z.string().trim().max(40).optional(),
  stockSkeins: z.string().trim().optional(),
});
type FormIn = z.input<typeof formSchema>;
type FormOut = z.output<typeof formSchema>;

function YarnForm({ yarn, currency, isOwner, onDone, onSaved }: { yarn: YarnRow | null; currency: string; isOwner: boolean; onDone: () => void; onSaved: () => void }) {
  const form = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(formSchema),
    defaultValues: yarn
      ? {
          name: yarn.name,
          colourName: yarn.colourName,
          hex: yarn.hex,
          fibre: yarn.fibre,
          weightCategory: yarn.weightCategory,
          metresPerSkein: yarn.metresPerSkein,
          gramsPerSkein: yarn.gramsPerSkein,
          price: minorToDecimalString(yarn.priceMinor, currency),
          lotCode: "",
          stockSkeins: "",
        }
      : { name: "", colourName: "", hex: "#F2EEE4", fibre: "Wool (100 %)", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, price: "", lotCode: "", stockSkeins: "" },
  });
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const base = useId();
  const errs = form.formState.errors;
  const hex = form.watch("hex");

  const submit = form.handleSubmit(async (v) => {
    setMessage(null);
    const { lotCode, stockSkeins, ...record } = v;
    const lot = lotCode ? lotSchema.safeParse({ lotCode, stockSkeins: stockSkeins ?? "0" }) : null;
    if (lot && !lot.success) {
      form.setError("stockSkeins", { message: lot.error.issues[0]?.message ?? "Check the stock." });
      return;
    }
    try {
      if (yarn) {
        await api(`/api/yarns/${yarn.id}`, { method: "PATCH", body: record });
        if (lot?.success) await api(`/api/yarns/${yarn.id}/lots`, { method: "PUT", body: lot.data });
      } else {
        await api("/api/yarns", { body: { ...record, lot: lot?.success ? lot.data : undefined } });
      }
      setMessage({ tone: "success", text: "Saved." });
      onSaved();
      if (!yarn) onDone();
    } catch (err) {
      if (err instanceof ApiError && err.fieldErrors) {
        for (const [k, m] of Object.entries(err.fieldErrors)) form.setError(k as keyof FormIn, { message: m.join(" ") });
      }
      setMessage({ tone: "error", text: (err as Error).message });
    }
  });

  const input = "rounded-md border border-bark/40 bg-white px-3 py-2";
  const field = (name: keyof FormIn, label: string, extra: Record<string, unknown> = {}, hint?: string) => {
    const id = `${base}-${name}`;
    const e = errs[name]?.message;
    return (
      <div className="flex flex-col gap-1">
        <label htmlFor={id} className="font-semibold">{label}</label>
        {hint ? <p id={`${id}-h`} className="text-sm text-bark">{hint}</p> : null}
        <input
          id={id}
          className={input}
          aria-invalid={e ? true : undefined}
          aria-describedby={[hint ? `${id}-h` : "", e ? `${id}-e` : ""].filter(Boolean).join(" ") || undefined}
          {...form.register(name)}
          {...extra}
        />
        {e ? <p id={`${id}-e`} role="alert" className="text-sm font-semibold text-madder-dark">{String(e)}</p> : null}
      </div>
    );
  };

  return (
    <section aria-labelledby={`${base}-h`} className="rounded-lg border border-bark/20 bg-white p-4">
      <h2 id={`${base}-h`} className="mb-2 text-xl">{yarn ? `Edit ${yarn.name}, ${yarn.colourName}` : "Add a yarn"}</h2>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <form onSubmit={submit} noValidate className="mt-2 grid gap-3 sm:grid-cols-2">
        {field("name", "Yarn name")}
        {field("colourName", "Colour name")}
        <div className="flex items-end gap-2">
          <div className="flex-1">{field("hex", "Colour (hex)", {}, "Like #A3342A.")}</div>
          <span aria-hidden="true" className="mb-1 inline-block h-9 w-9 rounded border border-bark/40" style={{ backgroundColor: /^#[0-9a-f]{6}$/i.test(hex ?? "") ? hex : "transparent" }} />
        </div>
        {field("fibre", "Fibre")}
        <div className="flex flex-col gap-1">
          <label htmlFor={`${base}-weight`} className="font-semibold">Weight category</label>
          <select id={`${base}-weight`} className={input} {...form.register("weightCategory")}>
            {YARN_WEIGHTS.categories.map((w) => (
              <option key={w.category} value={w.category}>
                {w.category} {w.name} ({w.typicalYarns.join(", ")})
              </option>
            ))}
          </select>
        </div>
        {field("metresPerSkein", "Metres per skein", { inputMode: "numeric" })}
        {field("gramsPerSkein", "Grams per skein", { inputMode: "numeric" })}
        {field("price", `Price per skein (${currency})`, { inputMode: "decimal", readOnly: !isOwner }, isOwner ? undefined : "Only the studio owner can change prices.")}
        {field("lotCode", yarn ? "Dye lot to add or restock" : "First dye lot (optional)", {}, yarn ? `Lots now: ${yarn.lots.map((l) => l.lotCode).join(", ") || "none"}` : undefined)}
        {field("stockSkeins", "Skeins in stock for that lot", { inputMode: "numeric" })}
        <div className="flex gap-2 sm:col-span-2">
          <Button type="submit" disabled={form.formState.isSubmitting}>Save yarn</Button>
          <Button variant="secondary" onClick={onDone}>Close</Button>
        </div>
      </form>
    </section>
  );
}
