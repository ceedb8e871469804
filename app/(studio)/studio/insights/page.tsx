import { notFound } from "next/navigation";
import { AccuracyChart, HoursByMonthChart, SimpleBarChart } from "@/components/production/insight-charts";
import { Card, PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { RATE_KEYS, STAGES, type LabourRates } from "@/lib/core/labour";
import { minorToDecimalString } from "@/lib/core/pricing/format-money";
import { formatMinor } from "@/lib/format";
import { can } from "@/lib/server/authz";
import { getCalibration, getInsights } from "@/lib/server/insights";
import { requireStudioMember } from "@/lib/server/page-guards";
import { loadStudioSettings } from "@/lib/server/settings";
import { DecideForm, ProposeForm } from "./calibration-forms";

export const metadata = { title: "Insights" };
export const dynamic = "force-dynamic";

const STAGE_NAME: Record<string, string> = { design: "Design", knitting: "Knitting", embroidery: "Embroidery", blocking: "Blocking", finishing: "Finishing" };
const RATE_LABELS: Record<string, string> = {
  designBaseMinutes: "Design, minutes per new design",
  minutesPerProofRound: "Design, minutes per proof round",
  plainStitchesPerMinute: "Plain stitches per minute",
  strandedStitchesPerMinute: "Stranded stitches per minute",
  minutesPerShapingRound: "Minutes per shaping round",
  minutesPerThumb: "Minutes per thumb",
  secondsPerFloatCatch: "Seconds per float catch",
  secondsPerDuplicateStitch: "Seconds per duplicate stitch",
  minutesPerEnd: "Minutes per end woven in",
  secondsPerCarryCm: "Seconds per cm carried",
  blockingMinutesPerPiece: "Blocking minutes per piece",
  dryingHoursPerPiece: "Drying hours per piece",
  finishingMinutesPerPiece: "Finishing minutes per piece",
};
const pct = (v: number | null | undefined) => (v === null || v === undefined ? "—" : `${v} %`);
const num = (v: number) => (Number.isInteger(v) ? String(v) : v.toFixed(2));

export default async function InsightsPage() {
  const { actor, membership } = await requireStudioMember("/studio/insights");
  if (!can(actor, "studio.settings", membership.studioId)) notFound();
  const studioId = membership.studioId;
  const [i, cal, settings] = await Promise.all([getInsights(actor, studioId), getCalibration(actor, studioId), loadStudioSettings(studioId)]);
  const major = (minor: number) => Number(minorToDecimalString(minor, i.currency));
  const open = cal.proposals.find((p) => p.status === "proposed");
  const changed = cal.result ? RATE_KEYS.filter((k) => Math.abs(cal.result!.rates[k] - cal.current[k]) > 1e-9) : [];
  const marginsChanged = cal.result ? STAGES.some((s) => Math.abs(cal.result!.p80Factors[s] - cal.currentP80Factors[s]) > 1e-9) : false;

  return (
    <>
      <PageTitle title="Insights" lead="Where the time and the money go, from the hours logged and the payments received." />
      <div className="flex flex-col gap-6">
        <Card>
          <h2 className="mb-2 text-xl">Hours per stage per month</h2>
          {i.hoursByMonth.length === 0 ? <p className="text-bark">No hours logged yet.</p> : <HoursByMonthChart rows={i.hoursByMonth} />}
        </Card>

        <Card>
          <h2 className="mb-2 text-xl">Busiest stage</h2>
          {i.busiestStage[0]?.hours ? (
            <p className="mb-2">
              Most hours go to <strong>{STAGE_NAME[i.busiestStage[0].stage]}</strong> ({i.busiestStage[0].hours} h logged in all).
            </p>
          ) : null}
          <SimpleBarChart
            rows={i.busiestStage.map((s) => ({ stage: STAGE_NAME[s.stage], hours: s.hours }))}
            xKey="stage"
            bars={[{ key: "hours", name: "Hours", fill: "#3F5E3A" }]}
            caption="hours logged per stage"
            columns={[
              { key: "stage", label: "Stage" },
              { key: "hours", label: "Hours", align: "right" },
            ]}
            unit=" h"
          />
        </Card>

        <Card>
          <h2 className="mb-2 text-xl">Effective hourly rate per commission</h2>
          <p className="mb-2 text-sm text-bark">
            Labour charged (the accepted quote&apos;s labour lines, or the agreed price where there is no quote) divided by the hours logged so far. The
            studio&apos;s set rate is {formatMinor(settings.hourlyRateMinor, i.currency)}{" "}
            an hour.
          </p>
          {i.effectiveRates.length === 0 ? (
            <p className="text-bark">No commission has both a price and logged hours yet.</p>
          ) : (
            <SimpleBarChart
              rows={i.effectiveRates.map((r) => ({
                commission: r.label,
                rate: major(r.rateMinor),
                rateText: formatMinor(r.rateMinor, i.currency),
                hours: r.hours,
                charged: formatMinor(r.chargedMinor, i.currency),
                basis: r.basis === "quote" ? "accepted quote" : "agreed price",
              }))}
              xKey="commission"
              bars={[{ key: "rate", name: `Per hour (${i.currency})`, fill: "#A3342A" }]}
              caption="effective hourly rate per commission"
              columns={[
                { key: "commission", label: "Commission" },
                { key: "charged", label: "Labour charged", align: "right" },
                { key: "basis", label: "From" },
                { key: "hours", label: "Hours logged", align: "right" },
                { key: "rateText", label: "Per hour", align: "right" },
              ]}
            />
          )}
        </Card>

        <Card>
          <h2 className="mb-2 text-xl">Estimate accuracy over time</h2>
          {i.accuracy.length === 0 ? <p className="text-bark">No closed pieces yet.</p> : <AccuracyChart rows={i.accuracy} />}
        </Card>

        <Card>
          <h2 className="mb-2 text-xl">Revenue and deposits by month</h2>
          {i.revenue.length === 0 ? (
            <p className="text-bark">No payments received yet.</p>
          ) : (
            <SimpleBarChart
              rows={i.revenue.map((r) => ({
                month: r.month,
                deposits: major(r.depositsMinor),
                balances: major(r.balancesMinor),
                depositsText: formatMinor(r.depositsMinor, i.currency),
                balancesText: formatMinor(r.balancesMinor, i.currency),
                totalText: formatMinor(r.depositsMinor + r.balancesMinor, i.currency),
              }))}
              xKey="month"
              bars={[
                { key: "deposits", name: "Deposits", fill: "#2F5D7C" },
                { key: "balances", name: "Balances", fill: "#6D5A7E" },
              ]}
              caption="payments received per month, after refunds"
              columns={[
                { key: "month", label: "Month" },
                { key: "depositsText", label: "Deposits", align: "right" },
                { key: "balancesText", label: "Balances", align: "right" },
                { key: "totalText", label: "Total", align: "right" },
              ]}
            />
          )}
        </Card>

        <Card>
          <h2 className="mb-2 text-xl">Rate calibration</h2>
          <p className="mb-3 text-bark">
            Rates refitted from {cal.pieces} finished piece{cal.pieces === 1 ? "" : "s"} of logged history. Accuracy is measured on pieces held back from the fit
            (mean absolute percentage error; lower is better). &ldquo;Within P50&rdquo; and &ldquo;within P80&rdquo; are the shares of those pieces that took no longer than
            the proposed typical (P50) and cautious (P80) figures: about half and at least four in five when the estimates are honest. With few held-back pieces
            these shares move in large steps.
          </p>
          {!cal.result ? (
            <Notice>No history yet: close a commission with logged hours first.</Notice>
          ) : (
            <>
              <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Accuracy table">
                <table className="w-full border-collapse text-left text-sm">
                  <caption className="mb-1 text-left font-semibold">Accuracy before and after</caption>
                  <thead>
                    <tr className="border-b border-bark/30 text-bark">
                      <th scope="col" className="py-1 pr-3">Stage</th>
                      <th scope="col" className="py-1 pr-3 text-right">Held-back pieces</th>
                      <th scope="col" className="py-1 pr-3 text-right">Current rates</th>
                      <th scope="col" className="py-1 pr-3 text-right">Proposed rates</th>
                      <th scope="col" className="py-1 pr-3 text-right">Within P50</th>
                      <th scope="col" className="py-1 pr-3 text-right">Within P80</th>
                    </tr>
                  </thead>
                  <tbody>
                    {cal.result.accuracy ? (
                      <>
                        {STAGES.map((s) => (
                          <tr key={s} className="border-b border-bark/10">
                            <th scope="row" className="py-1 pr-3 font-normal">{STAGE_NAME[s]}</th>
                            <td className="py-1 pr-3 text-right">{cal.result!.accuracy!.stages[s].pieces}</td>
                            <td className="py-1 pr-3 text-right">{pct(cal.result!.accuracy!.stages[s].before)}</td>
                            <td className="py-1 pr-3 text-right">{pct(cal.result!.accuracy!.stages[s].after)}</td>
                            <td className="py-1 pr-3 text-right">{pct(cal.result!.accuracy!.stages[s].p50Coverage)}</td>
                            <td className="py-1 pr-3 text-right">{pct(cal.result!.accuracy!.stages[s].p80Coverage)}</td>
                          </tr>
                        ))}
                        <tr>
                          <th scope="row" className="py-1 pr-3">All logged stages</th>
                          <td className="py-1 pr-3 text-right">{cal.result.accuracy.overall.pieces}</td>
                          <td className="py-1 pr-3 text-right font-semibold">{pct(cal.result.accuracy.overall.before)}</td>
                          <td className="py-1 pr-3 text-right font-semibold" data-testid="accuracy-after">{pct(cal.result.accuracy.overall.after)}</td>
                          <td className="py-1 pr-3 text-right font-semibold" data-testid="coverage-p50">{pct(cal.result.accuracy.overall.p50Coverage)}</td>
                          <td className="py-1 pr-3 text-right font-semibold" data-testid="coverage-p80">{pct(cal.result.accuracy.overall.p80Coverage)}</td>
                        </tr>
                      </>
                    ) : (
                      <tr>
                        <td colSpan={6} className="py-1">Too few pieces to hold one back for an accuracy check.</td>
                      </tr>
                    )}
                  </tbody>
                </table>
              </div>
              <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="Rates table">
                <table className="w-full border-collapse text-left text-sm">
                  <caption className="mb-1 text-left font-semibold">Rates that would change</caption>
                  <thead>
                    <tr className="border-b border-bark/30 text-bark">
                      <th scope="col" className="py-1 pr-3">Rate</th>
                      <th scope="col" className="py-1 pr-3 text-right">Now</th>
                      <th scope="col" className="py-1 pr-3 text-right">Proposed</th>
                    </tr>
                  </thead>
                  <tbody>
                    {changed.length === 0 ? (
                      <tr>
                        <td colSpan={3} className="py-1">None: the history agrees with the current rates.</td>
                      </tr>
                    ) : (
                      changed.map((k) => (
                        <tr key={k} className="border-b border-bark/10">
                          <th scope="row" className="py-1 pr-3 font-normal">{RATE_LABELS[k] ?? k}</th>
                          <td className="py-1 pr-3 text-right tabular-nums">{num(cal.current[k as keyof LabourRates])}</td>
                          <td className="py-1 pr-3 text-right tabular-nums">{num(cal.result!.rates[k as keyof LabourRates])}</td>
                        </tr>
                      ))
                    )}
                  </tbody>
                </table>
              </div>
              <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="P80 margins table">
                <table className="w-full border-collapse text-left text-sm">
                  <caption className="mb-1 text-left font-semibold">Cautious (P80) margin per stage: P80 ÷ P50, accepted with the rates</caption>
                  <thead>
                    <tr className="border-b border-bark/30 text-bark">
                      <th scope="col" className="py-1 pr-3">Stage</th>
                      <th scope="col" className="py-1 pr-3 text-right">Now</th>
                      <th scope="col" className="py-1 pr-3 text-right">Proposed</th>
                      <th scope="col" className="py-1 pr-3">From</th>
                    </tr>
                  </thead>
                  <tbody>
                    {STAGES.map((s) => {
                      const st = cal.result!.stages[s];
                      return (
                        <tr key={s} className="border-b border-bark/10">
                          <th scope="row" className="py-1 pr-3 font-normal">{STAGE_NAME[s]}</th>
                          <td className="py-1 pr-3 text-right tabular-nums">× {cal.currentP80Factors[s].toFixed(3)}</td>
                          <td className="py-1 pr-3 text-right tabular-nums">× {st.p80Factor.toFixed(3)}</td>
                          <td className="py-1 pr-3">
                            {st.spread
                              ? `each of ${st.spread.pieces} pieces predicted from the others (typical piece took ${st.spread.medianRatio.toFixed(2)} × its estimate)`
                              : "our default margin: too few pieces to measure yours"}
                          </td>
                        </tr>
                      );
                    })}
                  </tbody>
                </table>
              </div>
              {cal.result.notes.length ? (
                <ul className="mt-2 list-disc pl-5 text-sm text-bark">
                  {cal.result.notes.map((n) => (
                    <li key={n}>{n}</li>
                  ))}
                </ul>
              ) : null}
              <div className="mt-4">
                {open ? (
                  <div>
                    <p className="mb-2">A proposal from {open.createdAt.toLocaleDateString("en-GB")} is waiting for your decision.</p>
                    <DecideForm studioId={studioId} proposalId={open.id} />
                  </div>
                ) : changed.length || marginsChanged ? (
                  <ProposeForm studioId={studioId} />
                ) : null}
              </div>
              {cal.proposals.filter((p) => p.status !== "proposed").length ? (
                <ul className="mt-3 text-sm text-bark">
                  {cal.proposals
                    .filter((p) => p.status !== "proposed")
                    .map((p) => (
                      <li key={p.id}>
                        Proposal of {p.createdAt.toLocaleDateString("en-GB")}: {p.status}
                        {p.decidedAt ? ` on ${p.decidedAt.toLocaleDateString("en-GB")}` : ""}.
                      </li>
                    ))}
                </ul>
              ) : null}
            </>
          )}
        </Card>
      </div>
    </>
  );
}
