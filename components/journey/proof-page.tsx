// A proof as the client and the studio see it: the knitted preview at true proportions (and about
// real size), the charts with symbols, the colours by name, the lettering's real size, the quote
// version, and what changed since the proof before.
import Link from "next/link";
import { Card, PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { getStitchCounts, renderChartSvg, renderPreviewSvg } from "@/lib/core/chart";
import { describeDiff } from "@/lib/core/proofs";
import { formatMinor } from "@/lib/format";
import type { getProofView } from "@/lib/server/proofs";
import { ProofCharts } from "./proof-charts";

type View = Awaited<ReturnType<typeof getProofView>>;

const STATUS: Record<string, string> = {
  sent: "Waiting for your answer",
  approved: "Approved",
  changes_requested: "Changes asked",
  superseded: "Replaced by a newer proof",
};

const cellPxFor = (width: number) => (width <= 30 ? 18 : width <= 48 ? 14 : Math.max(8, Math.floor(640 / width)));
const dateFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

export function ProofPage({ view, mode, base }: { view: View; mode: "client" | "studio"; base: string }) {
  const { proof, charts, commission } = view;
  const canAnswer = mode === "client" && proof.status === "sent" && view.isLatest && commission.state === "proof_sent";
  const statusText = mode === "studio" && proof.status === "sent" ? "Waiting for the client" : STATUS[proof.status];
  return (
    <>
      <PageTitle title={`Proof ${proof.number}: ${commission.title}`} lead={`${commission.studioName} · sent ${dateFmt.format(proof.sentAt)} UTC`} />
      <p className="-mt-3 mb-4">
        <Link href={base}>Back to the commission</Link>
      </p>
      <div className="mb-6 flex flex-col gap-3">
        <Notice tone={proof.status === "approved" ? "success" : proof.status === "sent" ? "info" : "caution"} title={statusText}>
          {proof.status === "approved" && proof.decidedAt
            ? `Approved by ${view.decidedByName ?? "the client"} on ${dateFmt.format(proof.decidedAt)} UTC.`
            : null}
          {!view.isLatest ? (
            <>
              There is a newer proof.{" "}
              <Link href={`${base}/proofs/${view.proofs.at(-1)!.id}`}>Open proof {view.proofs.at(-1)!.number}</Link>.
            </>
          ) : null}
        </Notice>
        {proof.noteToClient ? <p className="max-w-prose">Note from the studio: {proof.noteToClient}</p> : null}
      </div>

      {view.diff ? (
        <Card className="mb-6">
          <h2 className="mb-2 text-xl">Changes since proof {view.previousNumber}</h2>
          <ul className="list-disc pl-5">
            {view.diff.map((d) => (
              <li key={d.area}>
                {describeDiff(d)}
                {d.sample.length && d.status === "changed" ? (
                  <span className="text-sm text-bark">
                    {" "}
                    (for example row {d.sample[0].row}, stitch {d.sample[0].stitch})
                  </span>
                ) : null}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}

      {charts.map((c) => {
        const w = (c.chart.width * 10) / c.chart.gauge.stitchesPer10cm;
        const h = (c.chart.height * 10) / c.chart.gauge.rowsPer10cm;
        const counts = getStitchCounts(c.chart);
        return (
          <Card key={c.index} className="mb-6">
            <h2 className="mb-1 text-xl">{c.label}: knitted preview</h2>
            <p className="mb-3 text-sm text-bark">
              {Math.round(w * 10) / 10} × {Math.round(h * 10) / 10} cm at {c.chart.gauge.stitchesPer10cm} stitches and {c.chart.gauge.rowsPer10cm} rows per 10 cm,
              drawn with the fabric&rsquo;s true proportions at about its real size (screens differ a little).
            </p>
            <div>
              <div
                className="[&>svg]:h-auto [&>svg]:w-full"
                style={{ width: `${Math.round(w * 10) / 10}cm`, maxWidth: "100%" }}
                dangerouslySetInnerHTML={{ __html: renderPreviewSvg(c.chart, { stitchPx: 10, title: `${c.label}, knitted preview` }) }}
              />
            </div>
            <h3 className="mb-2 mt-4 text-lg">Colours</h3>
            <table className="w-full max-w-xl text-left">
              <caption className="sr-only">Colours of {c.label}</caption>
              <thead>
                <tr>
                  <th scope="col">Colour</th>
                  <th scope="col">Key</th>
                  <th scope="col" className="text-right">
                    Stitches
                  </th>
                </tr>
              </thead>
              <tbody>
                {c.chart.palette.map((p, i) => (
                  <tr key={p.key}>
                    <td className="py-1">
                      <span aria-hidden="true" className="mr-2 inline-block h-4 w-4 rounded-sm border border-bark/40 align-middle" style={{ background: p.hex }} />
                      {p.name}
                    </td>
                    <td>{p.key}</td>
                    <td className="text-right">{counts[i]}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {c.lettering.length ? (
              <>
                <h3 className="mb-2 mt-4 text-lg">Lettering</h3>
                <ul className="list-disc pl-5">
                  {c.lettering.map((l, i) => (
                    <li key={i}>
                      &ldquo;{l.text}&rdquo;: {l.widthCm} cm wide and {l.heightCm} cm tall ({l.stitches} stitches × {l.rows} rows)
                    </li>
                  ))}
                </ul>
              </>
            ) : null}
          </Card>
        );
      })}

      <Card className="mb-6">
        <h2 className="mb-3 text-xl">Charts</h2>
        <p className="mb-3 text-sm text-bark">Rows are numbered from the bottom and stitches from the right, as you knit them.</p>
        <ProofCharts
          charts={charts.map((c) => {
            const cellPx = cellPxFor(c.chart.width);
            return { index: c.index, label: c.label, width: c.chart.width, height: c.chart.height, cellPx, svg: renderChartSvg(c.chart, { cellPx }) };
          })}
          existing={view.comments.map((c) => ({ id: c.id, chartIndex: c.chartIndex, row: c.row, stitch: c.stitch, body: c.body }))}
          answer={canAnswer ? { proofId: proof.id, contentHash: proof.contentHash, number: proof.number } : undefined}
        />
      </Card>

      <Card className="mb-6">
        <h2 className="mb-2 text-xl">About this proof</h2>
        <dl className="grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-[12rem_1fr]">
          <dt className="font-semibold text-bark">Quote</dt>
          <dd>{view.quote ? `Version ${view.quote.number}, ${formatMinor(view.quote.totalMinor, view.quote.currency)}` : "No quote version attached"}</dd>
          {mode === "studio" ? (
            <>
              <dt className="font-semibold text-bark">Proof fingerprint</dt>
              <dd className="break-all font-mono text-sm">{proof.contentHash}</dd>
            </>
          ) : null}
        </dl>
        {mode === "client" ? (
          <details className="mt-3 text-sm text-bark">
            <summary>Technical details</summary>
            <p className="mt-1">
              This proof&apos;s fingerprint, recorded with your approval so both sides know exactly which design was approved:{" "}
              <span className="break-all font-mono">{proof.contentHash}</span>
            </p>
          </details>
        ) : null}
        {view.proofs.length > 1 ? (
          <>
            <h3 className="mb-1 mt-4 text-lg">All proofs</h3>
            <ul className="list-disc pl-5">
              {[...view.proofs].reverse().map((p) => (
                <li key={p.id}>
                  {p.id === proof.id ? <strong>Proof {p.number} (this one)</strong> : <Link href={`${base}/proofs/${p.id}`}>Proof {p.number}</Link>} · {STATUS[p.status]}
                </li>
              ))}
            </ul>
          </>
        ) : null}
      </Card>
    </>
  );
}
