import Link from "next/link";
import { Card, PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { formatMinutes } from "@/lib/core/production";
import { PIECE_STAGE_LABELS, PIECE_STAGES } from "@/lib/core/workflow/pieces";
import { formatDay } from "@/lib/format";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getBoard, type BoardPiece } from "@/lib/server/production";
import { RefreshEvery } from "@/components/production/refresh-every";
import { MarkReadyForm, MoveCommissionPiecesForm, MovePieceForm, SetUpPiecesForm } from "./board-forms";

export const metadata = { title: "Board" };
export const dynamic = "force-dynamic";

function PieceCard({ p }: { p: BoardPiece }) {
  const paused = p.commissionState !== "in_production";
  return (
    <li className="rounded-md border border-bark/25 bg-white p-3 shadow-sm">
      <p className="font-semibold">
        <Link href={`/studio/pieces/${p.id}`}>{p.name}</Link>
      </p>
      <p className="text-sm text-bark">
        {p.commissionNumber}. {p.commissionTitle} · {p.clientName}
      </p>
      <p className="text-sm">Needed by {formatDay(p.neededBy)}</p>
      <p className="mt-1 text-sm tabular-nums" data-testid="piece-hours">
        Logged {formatMinutes(p.loggedTotal)} of {formatMinutes(p.estimateP50)} (P80 {formatMinutes(p.estimateP80)})
      </p>
      {p.overP80 ? (
        <p className="mt-1 rounded bg-[#FFF8E6] px-2 py-1 text-sm font-semibold text-madder-dark">
          <span aria-hidden="true">▲ </span>Over the P80 estimate
        </p>
      ) : null}
      {p.running.map((r) => (
        <p key={r.userName} className="mt-1 text-sm text-moss">
          <span aria-hidden="true">● </span>
          {r.userName}: {r.stage} timer {r.paused ? "paused" : "running"}
        </p>
      ))}
      {p.stage === "blocking" || (p.dryUntil && new Date(p.dryUntil) > new Date()) ? (
        <p className="mt-1 text-sm text-loch">{p.dryUntil ? `Drying until ${formatDay(p.dryUntil.slice(0, 10))}` : "Blocking"}</p>
      ) : null}
      {paused ? <p className="mt-1 text-sm text-bark">Commission is {p.commissionState.replace("_", " ")}: no moves now.</p> : null}
      <MovePieceForm pieceId={p.id} pieceName={p.name} stage={p.stage} moves={p.moves} />
    </li>
  );
}

export default async function BoardPage() {
  const { actor, membership } = await requireStudioMember("/studio/board");
  const board = await getBoard(actor, membership.studioId);
  // Commissions in production with more than one piece on the board, for the "move together" form.
  const byCommission = new Map<string, { id: string; number: number; title: string; count: number }>();
  for (const p of board.cards) {
    if (p.commissionState !== "in_production") continue;
    const c = byCommission.get(p.commissionId) ?? { id: p.commissionId, number: p.commissionNumber, title: p.commissionTitle, count: 0 };
    c.count += 1;
    byCommission.set(p.commissionId, c);
  }
  const together = [...byCommission.values()].filter((c) => c.count > 1);
  return (
    <>
      <RefreshEvery seconds={30} />
      <PageTitle
        title="Production board"
        lead="Every piece in the studio by stage, soonest needed first. Move a piece with its Move button; hours come from the timers and entries."
      />
      {board.readyToMark.length > 0 ? (
        <Card className="mb-6">
          <h2 className="mb-2 text-xl">All pieces done</h2>
          <ul className="flex flex-col gap-2">
            {board.readyToMark.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center gap-3">
                <span>
                  {c.number}. {c.title}
                </span>
                <MarkReadyForm commissionId={c.id} title={c.title} />
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      {board.waiting.length > 0 ? (
        <Card className="mb-6">
          <h2 className="mb-2 text-xl">Waiting for pieces</h2>
          <p className="mb-3 text-bark">Choose how each commission splits into pieces; each piece gets its own estimate at the studio&apos;s rates.</p>
          <ul className="flex flex-col gap-4">
            {board.waiting.map((c) => (
              <li key={c.id}>
                <p className="text-sm text-bark">
                  {c.number}. {c.title} · needed by {formatDay(c.neededBy)} · {c.state === "proof_approved" ? "proof approved" : "in production"}
                </p>
                <SetUpPiecesForm
                  commissionId={c.id}
                  title={c.title}
                  start={c.state === "proof_approved"}
                  layouts={c.layouts.map((l) => ({ id: l.id, label: l.label }))}
                />
                {c.layouts[0] ? (
                  <p className="mt-1 text-sm tabular-nums" data-testid="garment-estimate">
                    Knitting estimate:{" "}
                    {c.layouts[0].pieces.map((p) => `${p.name} ${formatMinutes(p.estimate.knitting?.p50 ?? 0)}`).join(", ")} (total{" "}
                    {formatMinutes(c.layouts[0].pieces.reduce((s, p) => s + (p.estimate.knitting?.p50 ?? 0), 0))})
                  </p>
                ) : null}
                {c.note ? <p className="text-sm text-bark">{c.note}</p> : null}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      {together.length > 0 ? (
        <Card className="mb-6">
          <h2 className="mb-2 text-xl">Move a commission&apos;s pieces together</h2>
          <p className="mb-3 text-sm text-bark">Every piece goes to the chosen stage through the stages between, each recorded; if one piece may not go, none moves.</p>
          <ul className="flex flex-col gap-3">
            {together.map((c) => (
              <li key={c.id}>
                <MoveCommissionPiecesForm commissionId={c.id} title={`${c.number}. ${c.title} (${c.count} pieces)`} stages={PIECE_STAGES.filter((s) => s !== "queued")} />
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      {board.cards.length === 0 ? <Notice title="Nothing in production">Pieces appear here once production starts.</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {PIECE_STAGES.map((stage) => {
          const cards = board.cards.filter((c) => c.stage === stage);
          return (
            <section key={stage} aria-labelledby={`col-${stage}`} className="rounded-lg bg-fleece p-3">
              <h2 id={`col-${stage}`} className="mb-2 text-lg">
                {PIECE_STAGE_LABELS[stage]} <span className="text-sm text-bark">({cards.length})</span>
              </h2>
              {cards.length === 0 ? (
                <p className="text-sm text-bark">No pieces.</p>
              ) : (
                <ul className="flex flex-col gap-3">
                  {cards.map((p) => (
                    <PieceCard key={p.id} p={p} />
                  ))}
                </ul>
              )}
            </section>
          );
        })}
      </div>
    </>
  );
}
