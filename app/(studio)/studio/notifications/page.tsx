import { PageTitle } from "@/components/ui/card";
import { MarkAllReadForm, NotificationSettingsForm } from "@/components/notifications/forms";
import { NotificationList } from "@/components/notifications/notification-list";
import { getNotificationSettings, listNotifications, unreadNotificationCount } from "@/lib/server/notifications";
import { requireStudioMember } from "@/lib/server/page-guards";

export const metadata = { title: "Notifications" };

export default async function StudioNotificationsPage() {
  const { actor } = await requireStudioMember("/studio/notifications");
  const [items, unread, kinds] = await Promise.all([listNotifications(actor, "studio"), unreadNotificationCount(actor, "studio"), getNotificationSettings(actor, "studio")]);
  return (
    <>
      <PageTitle title="Notifications" lead={unread === 0 ? "You are up to date." : `${unread} unread. Open one to go to its commission.`} />
      <div className="mb-4">
        <MarkAllReadForm audience="studio" unread={unread} />
      </div>
      <NotificationList items={items} />
      <section id="email" aria-labelledby="email-heading" className="mt-10">
        <h2 id="email-heading" className="mb-3 text-xl">
          Notifications by e-mail
        </h2>
        <NotificationSettingsForm audience="studio" kinds={kinds} />
      </section>
    </>
  );
}
