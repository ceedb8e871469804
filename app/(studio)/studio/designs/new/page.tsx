import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { Card, PageTitle } from "@/components/ui/card";
import { getSizeOffers, DEFAULT_GAUGE, offersFrom } from "@/lib/server/design-sizes";
import { getCommissionSizing, sizedCommission } from "@/lib/server/sizing";
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
  // The studio's saved sizing (its measured gauge) when there is one; else the brief at a usual gauge.
  const saved = await getCommissionSizing(actor, c.id);
  const sized = saved.saved ? sizedCommission({ garment: c.garment, sizing: saved.values }) : null;
  const round1 = (v: number) => Math.round(v * 10) / 10;
  const gauge = sized ? { stitchesPer10cm: round1(sized.gauge.stitchesPer10cm), rowsPer10cm: round1(sized.gauge.rowsPer10cm) } : DEFAULT_GAUGE;
  const sizing = sized ? { offers: offersFrom(sized), size: sized.size, reason: null } : getSizeOffers(c.garment, c.brief ?? {});
  const at = `${gauge.stitchesPer10cm} sts and ${gauge.rowsPer10cm} rows per 10 cm`;
  const yarns = await listStudioYarnColours(actor, c.studioId);
  return (
    <>
      <PageTitle title="New design" lead={<>For commission {c.number}: <Link href={`/studio/commissions/${c.id}`}>{c.title}</Link></>} />
      <Card>
        <NewDesignForm
          commissionId={c.id}
          defaultTitle={`${c.title} – design`}
          offers={sizing.offers}
          sizeNote={
            sized
              ? `Chart sizes from the commission's saved sizing${sized.size ? ` (size “${sized.size}”)` : ""} at ${at}.`
              : (sizing.reason ?? (sizing.size ? `Chart sizes for standard size “${sizing.size}” at ${at}; save the sizing with your own gauge to use it here.` : `Chart sizes from the brief's measurements at ${at}; save the sizing with your own gauge to use it here.`))
          }
          gauge={gauge}
          yarns={yarns}
        />
      </Card>
    </>
  );
}
