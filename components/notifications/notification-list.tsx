import type { NotificationItem } from "@/lib/server/notifications";

const when = (d: Date) => d.toLocaleString("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });

/** Newest first; each item opens its place (a plain link: no prefetch, which would mark it read). */
export function NotificationList({ items }: { items: NotificationItem[] }) {
  if (items.length === 0) return <p>Nothing yet. When something happens on a commission, it appears here.</p>;
  return (
    <ul className="flex flex-col divide-y divide-bark/20 rounded-md border border-bark/20 bg-white" aria-label="Notifications, newest first">
      {items.map((n) => (
        <li key={n.id} className={`p-3 ${n.read ? "" : "bg-fleece"}`}>
          <div className="flex flex-wrap items-start gap-2">
            {/* relative: keeps the screen-reader word inside the link's own box (a click lands on the link) */}
            <a href={n.href} className="relative font-semibold [overflow-wrap:anywhere]" data-testid="notification-link">
              {n.read ? null : <span className="sr-only">Unread: </span>}
              {n.title}
            </a>
            {n.read ? null : (
              <span aria-hidden="true" className="rounded bg-madder px-1.5 py-0.5 text-xs font-semibold text-white">
                new
              </span>
            )}
          </div>
          <p className="mt-1 text-sm [overflow-wrap:anywhere]">{n.body}</p>
          <p className="mt-1 text-xs text-bark">
            <time dateTime={n.createdAt.toISOString()}>{when(n.createdAt)} UTC</time>
          </p>
        </li>
      ))}
    </ul>
  );
}
