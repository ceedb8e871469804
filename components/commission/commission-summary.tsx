import { STATE_LABELS, type CommissionState } from "@/lib/core/workflow/states";
import type { CommissionBrief } from "@/db/schema";
import { MOTIFS } from "@/lib/core/chart/motifs";
import { formatDay, formatMinor, GARMENT_LABELS, WEARER_LABELS } from "@/lib/format";
import { MEASUREMENT_LABELS } from "@/lib/schemas/request";
import { StateBadge } from "./state-badge";

/** "handLengthCm" → "Hand length, wrist to fingertip" (the words the request form used). */
function measurementWords(key: string): string {
  const name = key.replace(/Cm$/, "") as keyof typeof MEASUREMENT_LABELS;
  return MEASUREMENT_LABELS[name] ?? name.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase().replace(/^./, (ch) => ch.toUpperCase());
}

export function CommissionSummary({
  c,
}: {
  c: {
    garment: string;
    wearer: string;
    state: CommissionState;
    neededBy: string | null;
    currency: string;
    budgetMinor: number | null;
    priceMinor: number | null;
    brief: CommissionBrief;
  };
}) {
  const rows: [string, React.ReactNode][] = [
    ["Status", <StateBadge key="s" state={c.state} />],
    ["Garment", `${GARMENT_LABELS[c.garment] ?? c.garment} · ${WEARER_LABELS[c.wearer] ?? c.wearer}`],
    ["Needed by", formatDay(c.neededBy)],
    ["Budget", formatMinor(c.budgetMinor, c.currency)],
    ["Agreed price", formatMinor(c.priceMinor, c.currency)],
  ];
  if (c.brief.sizeLabel) rows.push(["Size", c.brief.sizeLabel]);
  if (c.brief.measurements)
    rows.push(["Measurements", Object.entries(c.brief.measurements).map(([k, v]) => `${measurementWords(k)}: ${v} cm`).join("; ")]);
  if (c.brief.lettering) rows.push(["Lettering", c.brief.lettering]);
  if (c.brief.colourWishes) rows.push(["Colours", c.brief.colourWishes]);
  if (c.brief.motifWishes?.length) rows.push(["Motifs", c.brief.motifWishes.map((id) => MOTIFS.find((m) => m.id === id)?.name ?? id).join(", ")]);
  if (c.brief.notes) rows.push(["Notes", c.brief.notes]);
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-[10rem_1fr]">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-semibold text-bark">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export function Timeline({
  events,
}: {
  events: { id: string; kind: string; toState: CommissionState | null; at: Date; actorRole: string }[];
}) {
  return (
    <ol className="flex flex-col gap-2 border-l-2 border-madder/30 pl-4">
      {events.map((e) => (
        <li key={e.id}>
          <span className="font-semibold">
            {e.kind === "price_set" ? "Price set" : e.toState ? STATE_LABELS[e.toState] : e.kind}
          </span>{" "}
          <span className="text-sm text-bark">
            {new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" }).format(e.at)} · {e.actorRole}
          </span>
        </li>
      ))}
    </ol>
  );
}
