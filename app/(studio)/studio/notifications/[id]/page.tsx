import { notFound, redirect } from "next/navigation";
import { nullIfNotFound } from "@/lib/server/errors";
import { openNotification } from "@/lib/server/notifications";
import { requireStudioMember } from "@/lib/server/page-guards";

/** Opening an item: marks it read (the person's own only), then goes to its place. */
export default async function OpenStudioNotification({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const { actor } = await requireStudioMember(`/studio/notifications/${encodeURIComponent(id)}`);
  const link = await openNotification(actor, "studio", id).catch(nullIfNotFound);
  if (!link) notFound();
  redirect(link);
}
