import { STATE_LABELS, type CommissionState } from "@/lib/core/workflow/states";

const tone: Partial<Record<CommissionState, string>> = {
  enquiry: "bg-loch/10 text-loch border-loch/40",
  quote_sent: "bg-heather/10 text-heather border-heather/40",
  proof_sent: "bg-heather/10 text-heather border-heather/40",
  in_production: "bg-moss/10 text-moss border-moss/40",
  ready: "bg-moss/10 text-moss border-moss/40",
  closed: "bg-fleece text-bark border-bark/30",
  cancelled: "bg-fleece text-bark border-bark/30",
  declined: "bg-fleece text-bark border-bark/30",
};

export function StateBadge({ state }: { state: CommissionState }) {
  return (
    <span
      className={`inline-block rounded-full border px-2.5 py-0.5 text-sm font-semibold ${tone[state] ?? "bg-madder/10 text-madder-dark border-madder/40"}`}
    >
      {STATE_LABELS[state]}
    </span>
  );
}
