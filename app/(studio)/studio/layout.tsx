import Link from "next/link";
import type { ReactNode } from "react";
import { Providers } from "@/components/providers";
import { requireStudioMember } from "@/lib/server/page-guards";

export default async function StudioLayout({ children }: { children: ReactNode }) {
  const { membership } = await requireStudioMember("/studio");
  return (
    <div>
      <div className="mb-6 flex flex-wrap items-baseline gap-x-6 gap-y-2 border-b border-bark/20 pb-3">
        <p className="font-display text-xl">{membership.studioName}</p>
        <nav aria-label="Studio" className="flex flex-wrap gap-x-4 gap-y-1">
          <Link href="/studio">Commissions</Link>
          <Link href="/studio/board">Board</Link>
          <Link href="/studio/designs">Designs</Link>
          <Link href="/studio/log">Log hours</Link>
          <Link href="/studio/schedule">Schedule</Link>
          <Link href="/studio/yarns">Yarns</Link>
          {membership.role === "owner" ? <Link href="/studio/insights">Insights</Link> : null}
          <Link href="/studio/team">Team</Link>
          {membership.role === "owner" ? <Link href="/studio/payments">Payments</Link> : null}
          {membership.role === "owner" ? <Link href="/studio/settings">Settings</Link> : null}
          {membership.role === "owner" ? <Link href="/studio/settings/mail">Mail</Link> : null}
          <Link href={`/studios/${membership.studioSlug}`}>Public page</Link>
        </nav>
        <p className="ml-auto text-sm text-bark">
          Signed in as {membership.role === "owner" ? "owner" : "assistant"}
        </p>
      </div>
      <Providers>{children}</Providers>
    </div>
  );
}
