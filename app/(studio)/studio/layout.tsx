import Link from "next/link";
import type { ReactNode } from "react";
import { requireStudioMember } from "@/lib/server/page-guards";

export default async function StudioLayout({ children }: { children: ReactNode }) {
  const { membership } = await requireStudioMember("/studio");
  return (
    <div>
      <div className="mb-6 flex flex-wrap items-baseline gap-x-6 gap-y-2 border-b border-bark/20 pb-3">
        <p className="font-display text-xl">{membership.studioName}</p>
        <nav aria-label="Studio" className="flex gap-4">
          <Link href="/studio">Commissions</Link>
          <Link href="/studio/team">Team</Link>
          <Link href={`/studios/${membership.studioSlug}`}>Public page</Link>
        </nav>
        <p className="ml-auto text-sm text-bark">
          Signed in as {membership.role === "owner" ? "owner" : "assistant"}
        </p>
      </div>
      {children}
    </div>
  );
}
