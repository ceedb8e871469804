import { notFound, redirect } from "next/navigation";
import { nullIfNotFound } from "@/lib/server/errors";
import { openNotification } from "@/lib/server/notifications";
import { requirePageActor } from "@/lib/server/page-guards";

/** Opening an item: marks it read (the person's own only), then goes to its place. */
export default async function OpenPortalNotification({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/portal/notifications/${encodeURIComponent(id)}`);
  const link = await openNotification(actor, "client", id).catch(nullIfNotFound);
  if (!link) notFound();
  redirect(link);
}
