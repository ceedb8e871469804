import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { Card, PageTitle } from "@/components/ui/card";
import { getSizeOffers, DEFAULT_GAUGE } from "@/lib/server/design-sizes";
import { getCommissionDesign, listStudioYarnColours } from "@/lib/server/designs";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { NewDesignForm } from "./new-design-form";

export const metadata = { title: "New design" };

export default async function NewDesignPage({ searchParams }: { searchParams: Promise<{ commission?: string }> }) {
  const { commission } = await searchParams;
  const { actor } = await requireStudioMember(`/studio/designs/new${commission ? `?commission=${commission}` : ""}`);
  if (!commission || !/^[0-9a-f-]{36}$/i.test(commission)) notFound();
  const c = await getCommissionFor(actor, commission).catch(() => null);
  if (!c || !can(actor, "commission.work", c.studioId)) notFound();
  const existing = await getCommissionDesign(actor, c.id);
  if (existing) redirect(`/studio/designs/${existing.id}`);
  const sizing = getSizeOffers(c.garment, c.brief ?? {});
  const yarns = await listStudioYarnColours(actor, c.studioId);
  return (
    <>
      <PageTitle title="New design" lead={<>For commission {c.number}: <Link href={`/studio/commissions/${c.id}`}>{c.title}</Link></>} />
      <Card>
        <NewDesignForm
          commissionId={c.id}
          defaultTitle={`${c.title} – design`}
          offers={sizing.offers}
          sizeNote={sizing.reason ?? (sizing.size ? `Chart sizes for standard size “${sizing.size}” at ${DEFAULT_GAUGE.stitchesPer10cm} sts and ${DEFAULT_GAUGE.rowsPer10cm} rows per 10 cm.` : `Chart sizes from the brief's measurements at ${DEFAULT_GAUGE.stitchesPer10cm} sts and ${DEFAULT_GAUGE.rowsPer10cm} rows per 10 cm.`)}
          gauge={DEFAULT_GAUGE}
          yarns={yarns}
        />
      </Card>
    </>
  );
}
