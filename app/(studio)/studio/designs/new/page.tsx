import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { Card, PageTitle } from "@/components/ui/card";
import { DEFAULT_SIZING_GAUGE } from "@/lib/schemas/sizing";
import { offersFrom } from "@/lib/server/design-sizes";
import { loadSizing, resolveSizing } from "@/lib/server/sizing";
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
  const sizing = resolveSizing({ ...c, sizing: await loadSizing(c.id) });
  const round1 = (v: number) => Math.round(v * 10) / 10;
  const gauge =
    sizing.saved && sizing.result ? { stitchesPer10cm: round1(sizing.result.gauge.stitchesPer10cm), rowsPer10cm: round1(sizing.result.gauge.rowsPer10cm) } : DEFAULT_SIZING_GAUGE;
  const at = `${gauge.stitchesPer10cm} sts and ${gauge.rowsPer10cm} rows per 10 cm`;
  const size = sizing.result?.size;
  const yarns = await listStudioYarnColours(actor, c.studioId);
  return (
    <>
      <PageTitle title="New design" lead={<>For commission {c.number}: <Link href={`/studio/commissions/${c.id}`}>{c.title}</Link></>} />
      <Card>
        <NewDesignForm
          commissionId={c.id}
          defaultTitle={`${c.title} – design`}
          offers={sizing.result ? offersFrom(sizing.result) : []}
          sizeNote={
            !sizing.result
              ? `${sizing.reason}; choose the chart size by hand, or work out the sizing first.`
              : sizing.saved
                ? `Chart sizes from the commission's saved sizing${size ? ` (size “${size}”)` : ""} at ${at}.`
                : `Chart sizes ${size ? `for standard size “${size}”` : "from the brief's measurements"} at ${at}; save the sizing with your own gauge to use it here.`
          }
          gauge={gauge}
          yarns={yarns}
        />
      </Card>
    </>
  );
}
