import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { Card, PageTitle } from "@/components/ui/card";
import { DEFAULT_SIZING_GAUGE } from "@/lib/schemas/sizing";
import { offersFrom } from "@/lib/server/design-sizes";
import { commissionSizing } from "@/lib/server/garment";
import { loadSizing } from "@/lib/server/sizing";
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
  const raw = await loadSizing(c.id);
  // The garment's sizing: saved (its measured gauge), else the brief at a usual gauge, else a standard size (said so).
  const sized = (() => {
    try {
      return commissionSizing({ ...c, sizing: raw });
    } catch (e) {
      return { error: (e as Error).message };
    }
  })();
  const result = "sizing" in sized ? sized.sizing : null;
  const round1 = (v: number) => Math.round(v * 10) / 10;
  const gauge =
    "sizing" in sized && sized.sizedFrom === "saved sizing" ? { stitchesPer10cm: round1(sized.sizing.gauge.stitchesPer10cm), rowsPer10cm: round1(sized.sizing.gauge.rowsPer10cm) } : DEFAULT_SIZING_GAUGE;
  const at = `${gauge.stitchesPer10cm} sts and ${gauge.rowsPer10cm} rows per 10 cm`;
  const size = result?.size;
  const yarns = await listStudioYarnColours(actor, c.studioId);
  return (
    <>
      <PageTitle title="New design" lead={<>For commission {c.number}: <Link href={`/studio/commissions/${c.id}`}>{c.title}</Link></>} />
      <Card>
        <NewDesignForm
          commissionId={c.id}
          defaultTitle={`${c.title} – design`}
          offers={result ? offersFrom(result) : []}
          sizeNote={
            !("sizing" in sized)
              ? `The garment could not be sized (${sized.error}); choose the chart size by hand, or work out the sizing first.`
              : sized.sizedFrom === "saved sizing"
                ? `Chart sizes from the commission's saved sizing${size ? ` (size “${size}”)` : ""} at ${at}, one per decorated area.`
                : sized.sizedFrom === "brief"
                  ? `Chart sizes ${size ? `for standard size “${size}”` : "from the brief's measurements"} at ${at}, one per decorated area; save the sizing with your own gauge to use it here.`
                  : `Chart sizes at ${at}, one per decorated area. ${sized.note}`
          }
          gauge={gauge}
          yarns={yarns}
        />
      </Card>
    </>
  );
}
