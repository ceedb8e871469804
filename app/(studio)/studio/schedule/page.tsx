import { Card, PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { buildTimeline, formatMinutes, type Garment } from "@/lib/core/production";
import { WORK_STAGE_LABELS, type WorkStageName } from "@/lib/schemas/production";
import { formatDay, GARMENT_LABELS } from "@/lib/format";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getEarliestPromiseDate, getStudioSchedule, newPiecesForGarment } from "@/lib/server/schedule";
import { AvailabilityForm } from "./availability-form";

export const metadata = { title: "Schedule" };
export const dynamic = "force-dynamic";

// Fills for commissions on the timeline; the table view carries the same facts in words.
const FILLS = ["bg-madder", "bg-loch", "bg-moss", "bg-heather", "bg-bark", "bg-[#B7791F]"];
const STAGE_LETTER: Record<string, string> = { knitting: "K", embroidery: "E", blocking: "B", finishing: "F" };
const DAY_HEIGHT_MINUTES = 480;

export default async function SchedulePage() {
  const { actor, membership } = await requireStudioMember("/studio/schedule");
  const studioId = membership.studioId;
  const s = await getStudioSchedule(actor, studioId);
  const isOwner = can(actor, "studio.settings", studioId);
  const promises = await Promise.all(
    (["hat", "mittens", "pullover"] as Garment[]).map(async (g) => ({
      garment: g,
      result: await getEarliestPromiseDate(studioId, newPiecesForGarment(g)).catch((e: Error) => ({ error: e.message })),
    })),
  );
  const label = new Map(s.labels.map((l) => [l.pieceId, l]));
  const commissionOrder = [...new Set(s.labels.map((l) => l.commissionId))];
  const fill = (commissionId: string) => FILLS[Math.max(0, commissionOrder.indexOf(commissionId)) % FILLS.length];
  const timeline = s.plan
    ? buildTimeline(
        s.plan.blocks,
        s.members.map((m) => ({ id: m.memberId, weekdayMinutes: m.weekdayMinutes, daysOff: m.daysOff })),
        s.today,
        { minDays: 21, maxDays: 42 },
      )
    : null;
  const memberName = new Map(s.members.map((m) => [m.memberId, m.name]));
  const late = s.plan?.commissions.filter((c) => c.lateByDays > 0) ?? [];
  const commissionTitle = (id: string) => {
    const l = s.labels.find((x) => x.commissionId === id);
    return l ? `${l.commissionNumber}. ${l.commissionTitle}` : id;
  };

  return (
    <>
      <PageTitle
        title="Schedule"
        lead={`Booked work placed on each person's hours, soonest due first, from today (${formatDay(s.today)}). Remaining time is the P80 estimate less what is logged; blocking's drying is a wait that uses no hours.`}
      />
      {s.problem ? <Notice tone="error" title="The schedule cannot be planned">{s.problem}</Notice> : null}

      <Card className="mb-6">
        <h2 className="mb-2 text-xl">Earliest date we can promise a new request</h2>
        <p className="mb-2 text-bark">After everything already booked, with the usual pieces of each garment. Add shipping time on top.</p>
        <ul className="flex flex-col gap-1">
          {promises.map((p) => (
            <li key={p.garment}>
              <span className="font-semibold">{GARMENT_LABELS[p.garment]}:</span>{" "}
              {"error" in p.result ? <span className="text-madder-dark">{p.result.error}</span> : <span data-testid={`promise-${p.garment}`}>{formatDay(p.result.date)}</span>}
            </li>
          ))}
        </ul>
      </Card>

      {late.length > 0 ? (
        <Notice tone="caution" title={`${late.length} commission${late.length === 1 ? "" : "s"} would miss the date`}>
          <ul>
            {late.map((c) => (
              <li key={c.commissionId}>
                {commissionTitle(c.commissionId)}: due {formatDay(c.due)}, projected {formatDay(c.finish)}, late by {c.lateByDays} day{c.lateByDays === 1 ? "" : "s"}
              </li>
            ))}
          </ul>
        </Notice>
      ) : s.plan ? (
        <Notice tone="success">Every booked commission is projected to finish by its date.</Notice>
      ) : null}

      {timeline ? (
        <Card className="my-6">
          <h2 className="mb-2 text-xl">Timeline per person</h2>
          <p className="mb-3 text-sm text-bark">
            Each column is a day from today (marked); bar height is booked time, letters are stages (K knitting, E embroidery, B blocking, F finishing). Hatched days are days off.
            The same plan is in the table below.
          </p>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Timeline picture; the table view below has the same plan">
            <div className="inline-flex flex-col gap-3 pb-2" aria-hidden="true">
              <div className="flex pl-28">
                {timeline.days.map((d) => (
                  <div key={d.date} className={`w-8 shrink-0 text-center text-[11px] ${d.isToday ? "font-bold text-madder-dark" : "text-bark"}`}>
                    {d.isToday ? "Today" : d.weekday.slice(0, 2)}
                    <br />
                    {Number(d.date.slice(8))}
                  </div>
                ))}
              </div>
              {timeline.rows.map((row) => (
                <div key={row.memberId} className="flex items-end">
                  <div className="w-28 shrink-0 pr-2 text-sm font-semibold">{memberName.get(row.memberId)}</div>
                  {row.cells.map((c, i) => (
                    <div
                      key={c.date}
                      className={`relative flex h-16 w-8 shrink-0 flex-col-reverse border-l border-bark/15 ${i === 0 ? "border-l-2 border-l-madder" : ""} ${c.dayOff || c.capacity === 0 ? "bg-[repeating-linear-gradient(45deg,#F1EBDF,#F1EBDF_3px,#fff_3px,#fff_6px)]" : "bg-white"}`}
                      title={`${c.date}: ${formatMinutes(c.booked)} of ${formatMinutes(c.capacity)}`}
                    >
                      {c.blocks.map((b, k) => (
                        <div
                          key={k}
                          className={`${fill(b.commissionId)} mx-[2px] mt-px overflow-hidden text-center text-[10px] leading-3 text-white`}
                          style={{ height: `${Math.max(8, (b.minutes / DAY_HEIGHT_MINUTES) * 64)}px` }}
                        >
                          {STAGE_LETTER[b.stage]}
                        </div>
                      ))}
                    </div>
                  ))}
                </div>
              ))}
            </div>
          </div>
          {timeline.hiddenBlocks > 0 ? <p className="text-sm text-bark">{timeline.hiddenBlocks} later blocks are beyond the days shown; see the table.</p> : null}
          <ul className="mt-2 flex flex-wrap gap-3 text-sm">
            {commissionOrder.map((id) => (
              <li key={id} className="flex items-center gap-1">
                <span aria-hidden="true" className={`inline-block h-3 w-3 ${fill(id)}`} />
                {commissionTitle(id)}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}

      {s.plan ? (
        <Card className="mb-6">
          <h2 className="mb-2 text-xl">Commissions</h2>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Commissions table">
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Booked commissions with their due date, projected finish and lateness</caption>
              <thead>
                <tr className="border-b border-bark/30 text-sm text-bark">
                  <th scope="col" className="py-2 pr-4">Commission</th>
                  <th scope="col" className="py-2 pr-4">Needed by</th>
                  <th scope="col" className="py-2 pr-4">Projected finish</th>
                  <th scope="col" className="py-2 pr-4">On time?</th>
                </tr>
              </thead>
              <tbody>
                {s.plan.commissions.map((c) => (
                  <tr key={c.commissionId} className="border-b border-bark/10">
                    <th scope="row" className="py-2 pr-4 font-normal">{commissionTitle(c.commissionId)}</th>
                    <td className="py-2 pr-4">{formatDay(c.due)}</td>
                    <td className="py-2 pr-4">{formatDay(c.finish)}</td>
                    <td className={`py-2 pr-4 ${c.lateByDays > 0 ? "font-semibold text-madder-dark" : ""}`}>
                      {c.lateByDays > 0 ? `Late by ${c.lateByDays} day${c.lateByDays === 1 ? "" : "s"}` : "On time"}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <details className="mt-4">
            <summary className="cursor-pointer font-semibold">Table view of the timeline ({s.plan.blocks.length} blocks)</summary>
            <div className="mt-2 max-h-96 overflow-auto" tabIndex={0} role="region" aria-label="Planned work table">
              <table className="w-full border-collapse text-left text-sm">
                <caption className="sr-only">Planned work per person and day</caption>
                <thead>
                  <tr className="border-b border-bark/30 text-bark">
                    <th scope="col" className="py-1 pr-3">Date</th>
                    <th scope="col" className="py-1 pr-3">Person</th>
                    <th scope="col" className="py-1 pr-3">Piece</th>
                    <th scope="col" className="py-1 pr-3">Stage</th>
                    <th scope="col" className="py-1 pr-3 text-right">Time</th>
                  </tr>
                </thead>
                <tbody>
                  {s.plan.blocks.map((b, i) => {
                    const l = label.get(b.pieceId);
                    return (
                      <tr key={i} className="border-b border-bark/10">
                        <td className="py-1 pr-3 whitespace-nowrap">{formatDay(b.date)}</td>
                        <td className="py-1 pr-3">{memberName.get(b.memberId)}</td>
                        <td className="py-1 pr-3">
                          {l ? `${l.pieceName} (${l.commissionNumber}. ${l.commissionTitle})${l.planned ? ", not started" : ""}` : b.pieceId}
                        </td>
                        <td className="py-1 pr-3">{WORK_STAGE_LABELS[b.stage as WorkStageName]}</td>
                        <td className="py-1 pr-3 text-right tabular-nums">{formatMinutes(b.minutes)}</td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </div>
          </details>
        </Card>
      ) : null}

      <h2 className="mb-3 text-2xl">Availability</h2>
      <div className="flex flex-col gap-6">
        {s.members.map((m) => (
          <Card key={m.memberId}>
            <h3 className="mb-2 text-xl">
              {m.name} <span className="text-base text-bark">({m.role})</span>
            </h3>
            {isOwner ? (
              <AvailabilityForm studioId={studioId} member={m} />
            ) : (
              <p>
                {m.weekdayMinutes.map((x, i) => `${["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"][i]} ${formatMinutes(x)}`).join(" · ")}
                {m.daysOff.length ? ` · days off: ${m.daysOff.map((d) => formatDay(d)).join(", ")}` : ""}
                {m.stages.length ? ` · stages: ${m.stages.map((x) => WORK_STAGE_LABELS[x]).join(", ")}` : " · all stages"}
              </p>
            )}
          </Card>
        ))}
      </div>
    </>
  );
}
