import Link from "next/link";
import type { Actor } from "@/lib/server/authz";
import { unreadNotificationCount } from "@/lib/server/notifications";

/**
 * The header's way to a person's notifications with the unread count: one link for their studio
 * work, one for their own commissions (named apart only when they have both).
 */
export async function NotificationLinks({ actor }: { actor: Actor }) {
  const studio = actor.memberships.length > 0;
  const client = actor.clientOf.length > 0 || !studio;
  const [s, c] = await Promise.all([studio ? unreadNotificationCount(actor, "studio") : 0, client ? unreadNotificationCount(actor, "client") : 0]);
  const link = (href: string, word: string, n: number, testId: string) => (
    // The name is read from the content ("Notifications, 3 unread"), so it always contains the visible words.
    <Link href={href} data-testid={testId} className="inline-flex items-center gap-1">
      {word}
      <span className="sr-only">, </span>
      <span className={`rounded-full px-2 text-sm font-semibold ${n > 0 ? "bg-madder text-white" : "bg-bark/15 text-peat"}`}>{n}</span>
      <span className="sr-only"> unread</span>
    </Link>
  );
  return (
    <>
      {studio ? link("/studio/notifications", client ? "Studio notifications" : "Notifications", s, "studio-notifications") : null}
      {client ? link("/portal/notifications", studio ? "My notifications" : "Notifications", c, "portal-notifications") : null}
    </>
  );
}
