import Link from "next/link";
import { notFound } from "next/navigation";
import { QuoteBuilder } from "@/components/quotes/quote-builder";
import { QuoteVersionList } from "@/components/quotes/quote-version-list";
import { Card, PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { getQuoteBuilderData, storedInputOf } from "@/lib/server/quotes";

export const metadata = { title: "Quote" };

export default async function QuoteBuilderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const { actor } = await requireStudioMember(`/studio/commissions/${id}/quote`);
  const c = await getCommissionFor(actor, id).catch(() => null);
  if (!c || !can(actor, "studio.view", c.studioId)) notFound();
  const back = (
    <Link href={`/studio/commissions/${c.id}`} className="text-base">
      Back to the commission
    </Link>
  );
  if (!can(actor, "commission.price", c.studioId)) {
    return (
      <>
        <PageTitle title={`Quote: ${c.title}`} lead={back} />
        <Notice tone="info">Only the studio owner can price and send quotes.</Notice>
      </>
    );
  }
  const data = await getQuoteBuilderData(actor, c.id);
  const latest = data.versions[0];
  const baseline = latest ? storedInputOf(latest).draft : null;
  return (
    <>
      <PageTitle title={`Quote: ${c.number}. ${c.title}`} lead={<>For {c.clientName}. {back}</>} />
      {data.versions.length ? (
        <Card className="mb-6">
          <h2 className="mb-3 text-xl">Versions</h2>
          <QuoteVersionList versions={data.versions} />
        </Card>
      ) : null}
      <QuoteBuilder
        commissionId={c.id}
        policy={data.policy}
        yarns={data.yarns}
        initial={data.initial}
        baseline={baseline}
        initialValidUntil={latest?.status === "draft" ? (latest.validUntil ?? "") : ""}
        initialMessage={latest?.messageToClient ?? ""}
        featuresFromDesign={data.featuresFromDesign}
        garment={data.garment}
        yarnEstimate={data.yarnEstimate}
        scheduleEarliest={data.scheduleEarliest}
      />
    </>
  );
}
