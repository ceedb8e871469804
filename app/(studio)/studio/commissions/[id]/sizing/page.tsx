import Link from "next/link";
import { notFound } from "next/navigation";
import { SizingForm } from "@/components/sizing/sizing-form";
import { PageTitle } from "@/components/ui/card";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getCommissionSizing } from "@/lib/server/sizing";

export const metadata = { title: "Sizing" };
export const dynamic = "force-dynamic";

export default async function SizingPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const { actor } = await requireStudioMember(`/studio/commissions/${id}/sizing`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const data = await getCommissionSizing(actor, id).catch(() => null);
  if (!data) notFound();
  const c = data.commission;
  return (
    <>
      <PageTitle
        title={`Sizing: ${c.number}. ${c.title}`}
        lead={
          <>
            From the client&apos;s measurements and your swatch to the stitch counts, chart sizes and a recipe.{" "}
            <Link href={`/studio/commissions/${c.id}`}>Back to the commission</Link>
          </>
        }
      />
      {!data.saved ? <p className="mb-4 text-bark">Not saved yet: these are the brief&apos;s measurements with a usual firm gauge for fingering-weight colourwork. Measure your swatch.</p> : null}
      <SizingForm commissionId={c.id} garment={c.garment} wearer={c.wearer} fibres={data.fibres} initial={data.values} saved={data.saved} canEdit={can(actor, "commission.work", c.studioId)} />
    </>
  );
}
