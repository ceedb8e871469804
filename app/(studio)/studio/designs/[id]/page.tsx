import Link from "next/link";
import { PdfDownload } from "@/components/ui/pdf-download";
import { notFound } from "next/navigation";
import { ChartEditor } from "@/components/chart-editor/chart-editor";
import { PageTitle } from "@/components/ui/card";
import type { StoredEntry } from "@/components/chart-editor/editor-model";
import { can } from "@/lib/server/authz";
import { getDesignWithHead, listStudioYarnColours } from "@/lib/server/designs";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { listCommissionUploads } from "@/lib/server/queries/uploads";
import { policyFrom } from "@/lib/server/quotes";
import { commissionSizing } from "@/lib/server/garment";
import { loadStudioSettings } from "@/lib/server/settings";
import { loadSizing } from "@/lib/server/sizing";

export const metadata = { title: "Design" };

export default async function DesignPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const { actor } = await requireStudioMember(`/studio/designs/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const found = await getDesignWithHead(actor, id).catch(() => null);
  if (!found || !found.head) notFound();
  const { design, head } = found;
  const [yarns, settings] = await Promise.all([listStudioYarnColours(actor, design.studioId), loadStudioSettings(design.studioId)]);
  // The live price is shown to studio members only (this page is members-only); prices are the commission's currency.
  const found0 = design.commissionId ? await getCommissionFor(actor, design.commissionId).catch(() => null) : null;
  const commission = found0 ? { ...found0, sizing: await loadSizing(found0.id) } : null;
  // The commission's photos (reference photos and message attachments, not progress photos) for "Import from a photo".
  const photos = commission
    ? (await listCommissionUploads(actor, commission.id)).filter((u) => u.kind !== "progress").map((u) => ({ id: u.id, kind: u.kind, width: u.width, height: u.height }))
    : [];
  const livePricing = commission
    ? { policy: policyFrom(settings, commission.currency), designFeeMinor: settings.designFeeMinor, floatLimitStitches: settings.floatLimitStitches, floatLimitCm: settings.floatLimitCm, carryLimitCm: settings.carryLimitCm }
    : undefined;
  // The garment the live price reads and the areas' shapes: the commission's sizing (saved, else the brief, else a standard size).
  const firstGauge = (head.charts[0]?.chart as { gauge?: { stitchesPer10cm: number; rowsPer10cm: number } } | undefined)?.gauge;
  const sized = commission ? (() => {
    try {
      return { ok: true as const, ...commissionSizing(commission, firstGauge) };
    } catch (e) {
      return { ok: false as const, note: `The garment could not be sized: ${(e as Error).message}` };
    }
  })() : null;
  const locked = design.lockedVersionId !== null || !can(actor, "commission.work", design.studioId);
  return (
    <>
      <PageTitle
        title={design.title}
        lead={
          design.commissionId ? (
            <>
              Commission {design.commissionNumber}: <Link href={`/studio/commissions/${design.commissionId}`}>{design.commissionTitle}</Link>
            </>
          ) : undefined
        }
      />
      <p className="-mt-3 mb-4">
        <PdfDownload href={`/api/designs/${design.id}/work-sheet`} label="Download the work sheet (PDF)" fallbackName="work-sheet.pdf" />
      </p>
      <ChartEditor
        key={head.id}
        designId={design.id}
        headVersionId={head.id}
        headNumber={head.number}
        entries={head.charts as StoredEntry[]}
        yarns={yarns}
        locked={locked}
        inTheRound={design.garment !== null}
        livePricing={livePricing}
        sizing={sized?.ok ? sized.sizing : null}
        sizingNote={sized ? (sized.ok ? sized.note : sized.note) : null}
        photos={photos}
        planDefaults={{ carryLimitCm: settings.carryLimitCm, floatLimitStitches: settings.floatLimitStitches, floatLimitCm: settings.floatLimitCm }}
      />
    </>
  );
}
