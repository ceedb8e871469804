import type { TimelineEntry } from "@/lib/server/queries/lifecycle";

export function LifecycleTimeline({ entries, timeZone = "UTC" }: { entries: TimelineEntry[]; timeZone?: string }) {
  if (!entries.length) return <p className="text-bark">Nothing has happened yet.</p>;
  const fmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone });
  return (
    <ol className="flex flex-col gap-3 border-l-2 border-madder/30 pl-4" aria-label="Timeline">
      {entries.map((e) => (
        <li key={e.id}>
          <p className="font-semibold">{e.title}</p>
          <p className="text-sm text-bark">
            <time dateTime={e.at.toISOString()}>{fmt.format(e.at)}</time> · {e.who}
          </p>
          {e.reason ? <p className="text-sm">“{e.reason}”</p> : null}
        </li>
      ))}
    </ol>
  );
}
