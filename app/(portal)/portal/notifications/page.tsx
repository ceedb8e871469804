import { PageTitle } from "@/components/ui/card";
import { MarkAllReadForm, NotificationSettingsForm } from "@/components/notifications/forms";
import { NotificationList } from "@/components/notifications/notification-list";
import { getNotificationSettings, listNotifications, unreadNotificationCount } from "@/lib/server/notifications";
import { requirePageActor } from "@/lib/server/page-guards";

export const metadata = { title: "My notifications" };

export default async function PortalNotificationsPage() {
  const actor = await requirePageActor("/portal/notifications");
  const [items, unread, kinds] = await Promise.all([listNotifications(actor, "client"), unreadNotificationCount(actor, "client"), getNotificationSettings(actor, "client")]);
  return (
    <>
      <PageTitle title="My notifications" lead={unread === 0 ? "You are up to date." : `${unread} unread. Open one to go to your commission.`} />
      <div className="mb-4">
        <MarkAllReadForm audience="client" unread={unread} />
      </div>
      <NotificationList items={items} />
      <section id="email" aria-labelledby="email-heading" className="mt-10">
        <h2 id="email-heading" className="mb-3 text-xl">
          My e-mail settings
        </h2>
        <NotificationSettingsForm audience="client" kinds={kinds} />
      </section>
    </>
  );
}
