"use client";
// The proof's charts with their symbols. When the client may answer, a click (or tap) on a stitch
// pins a comment there in trade numbering (row from the bottom, stitch from the right); the same
// can be done with the row and stitch fields, for keyboards and screen readers.
import { useActionState, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { CharCount } from "@/components/ui/char-count";
import { useUnsavedChanges } from "@/components/ui/use-unsaved-changes";
import { idleState, type ActionState } from "@/lib/action-state";
import type { PinnedComment } from "@/lib/schemas/proofs";
import { approveProofAction, requestChangesAction } from "./proof-actions";

/** The chart SVG's grid starts this many pixels from the top left (lib/core/chart renderChartSvg, no title). */
const GRID_ORIGIN = 12;

export interface ChartForClient {
  index: number;
  label: string;
  width: number;
  height: number;
  cellPx: number;
  svg: string;
}

export interface ExistingComment {
  id: string;
  chartIndex: number | null;
  row: number | null;
  stitch: number | null;
  body: string;
}

function Marker({ chart, row, stitch, n }: { chart: ChartForClient; row: number; stitch: number; n: number }) {
  const c = chart.cellPx;
  const left = GRID_ORIGIN + (chart.width - stitch) * c + c / 2;
  const top = GRID_ORIGIN + (chart.height - row) * c + c / 2;
  return (
    <span
      aria-hidden="true"
      className="pointer-events-none absolute flex h-5 w-5 -translate-x-1/2 -translate-y-1/2 items-center justify-center rounded-full border-2 border-white bg-madder text-xs font-bold text-white shadow"
      style={{ left, top }}
    >
      {n}
    </span>
  );
}

export function ProofCharts({
  charts,
  existing,
  answer,
}: {
  charts: ChartForClient[];
  existing: ExistingComment[];
  /** present when the client may answer this proof */
  answer?: { proofId: string; contentHash: string; number: number };
}) {
  const [pending, setPending] = useState<PinnedComment[]>([]);
  const [target, setTarget] = useState<{ chartIndex: number; row: string; stitch: string }>({ chartIndex: 0, row: "", stitch: "" });
  const [body, setBody] = useState("");
  const [pinError, setPinError] = useState<string | null>(null);
  const commentRef = useRef<HTMLTextAreaElement>(null);
  const [changesState, changesAction, changesPending] = useActionState<ActionState<{ id: string }>, FormData>(requestChangesAction, idleState);
  const [approveState, approveAction, approvePending] = useActionState<ActionState<{ id: string }>, FormData>(approveProofAction, idleState);

  const [noteLength, setNoteLength] = useState(0);
  // A half-typed comment, pinned comments not sent yet, or a typed note: ask before leaving.
  useUnsavedChanges(changesState.status !== "ok" && approveState.status !== "ok" && (body.trim() !== "" || pending.length > 0 || noteLength > 0));

  const pinnedOld = existing.filter((e) => e.row !== null && e.stitch !== null && e.chartIndex !== null);

  function pick(chart: ChartForClient, e: React.MouseEvent<HTMLDivElement>) {
    if (!answer) return;
    const svg = e.currentTarget.querySelector("svg");
    if (!svg) return;
    const rect = svg.getBoundingClientRect();
    const scale = rect.width / Number(svg.getAttribute("width") || rect.width);
    const px = (e.clientX - rect.left) / scale - GRID_ORIGIN;
    const py = (e.clientY - rect.top) / scale - GRID_ORIGIN;
    const x = Math.floor(px / chart.cellPx);
    const yFromTop = Math.floor(py / chart.cellPx);
    if (x < 0 || yFromTop < 0 || x >= chart.width || yFromTop >= chart.height) return;
    setTarget({ chartIndex: chart.index, row: String(chart.height - yFromTop), stitch: String(chart.width - x) });
    setPinError(null);
    commentRef.current?.focus();
  }

  function pin() {
    const chart = charts.find((c) => c.index === target.chartIndex);
    const row = Number(target.row);
    const stitch = Number(target.stitch);
    if (!chart || !Number.isInteger(row) || !Number.isInteger(stitch) || row < 1 || stitch < 1 || row > chart.height || stitch > chart.width) {
      setPinError(`Choose a stitch on the chart, or enter a row from 1 to ${chart?.height ?? "?"} and a stitch from 1 to ${chart?.width ?? "?"}.`);
      return;
    }
    if (!body.trim()) {
      setPinError("Write what you would like changed at this stitch.");
      return;
    }
    setPending((list) => [...list, { chartIndex: chart.index, row, stitch, body: body.trim() }]);
    setBody("");
    setPinError(null);
  }

  return (
    <div className="flex flex-col gap-6">
      {charts.map((chart) => (
        <figure key={chart.index} className="flex flex-col gap-2">
          <figcaption className="font-semibold">
            {chart.label} <span className="font-normal text-bark">({chart.width} stitches × {chart.height} rows)</span>
          </figcaption>
          {/* Focusable so a keyboard can scroll a chart wider than the screen. */}
          <div className="overflow-x-auto rounded-md border border-bark/20 bg-white" tabIndex={0} role="region" aria-label={`${chart.label} chart (scrolls sideways)`}>
            <div
              className={`relative inline-block ${answer ? "cursor-crosshair" : ""}`}
              onClick={(e) => pick(chart, e)}
              data-testid={`proof-chart-${chart.index}`}
            >
              <div dangerouslySetInnerHTML={{ __html: chart.svg }} />
              {pinnedOld.map((c, i) =>
                c.chartIndex === chart.index ? <Marker key={c.id} chart={chart} row={c.row!} stitch={c.stitch!} n={i + 1} /> : null,
              )}
              {pending
                .map((c, i) => ({ c, i }))
                .filter(({ c }) => c.chartIndex === chart.index)
                .map(({ c, i }) => (
                  <Marker key={`p${i}`} chart={chart} row={c.row} stitch={c.stitch} n={pinnedOld.length + i + 1} />
                ))}
            </div>
          </div>
        </figure>
      ))}

      {pinnedOld.length || existing.some((e) => e.row === null) ? (
        <section aria-labelledby="earlier-comments">
          <h3 id="earlier-comments" className="mb-2 text-lg">
            Comments on this proof
          </h3>
          <ol className="flex list-decimal flex-col gap-1 pl-6">
            {pinnedOld.map((c) => (
              <li key={c.id}>
                {charts[c.chartIndex!]?.label ?? "Chart"}, row {c.row}, stitch {c.stitch}: {c.body}
              </li>
            ))}
          </ol>
          {existing
            .filter((e) => e.row === null)
            .map((e) => (
              <p key={e.id} className="mt-2">
                General note: {e.body}
              </p>
            ))}
        </section>
      ) : null}

      {answer ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <section aria-labelledby="ask-changes" className="flex flex-col gap-3 rounded-lg border border-bark/20 p-4">
            <h3 id="ask-changes" className="text-lg">
              Ask for changes
            </h3>
            <p className="text-sm text-bark">Tap a stitch on a chart to pin a comment there, or enter its row and stitch.</p>
            <div className="grid grid-cols-3 gap-2">
              <div className="col-span-3 flex flex-col gap-1 sm:col-span-1">
                <label htmlFor="pin-chart" className="text-sm font-semibold">
                  Chart
                </label>
                <select
                  id="pin-chart"
                  className="rounded-md border border-bark/40 bg-white px-2 py-2"
                  value={target.chartIndex}
                  onChange={(e) => setTarget((t) => ({ ...t, chartIndex: Number(e.target.value) }))}
                >
                  {charts.map((c) => (
                    <option key={c.index} value={c.index}>
                      {c.label}
                    </option>
                  ))}
                </select>
              </div>
              <div className="flex flex-col gap-1">
                <label htmlFor="pin-row" className="text-sm font-semibold">
                  Row
                </label>
                <input id="pin-row" inputMode="numeric" className="rounded-md border border-bark/40 px-2 py-2" value={target.row} onChange={(e) => setTarget((t) => ({ ...t, row: e.target.value }))} />
              </div>
              <div className="flex flex-col gap-1">
                <label htmlFor="pin-stitch" className="text-sm font-semibold">
                  Stitch
                </label>
                <input id="pin-stitch" inputMode="numeric" className="rounded-md border border-bark/40 px-2 py-2" value={target.stitch} onChange={(e) => setTarget((t) => ({ ...t, stitch: e.target.value }))} />
              </div>
            </div>
            <label htmlFor="pin-body" className="text-sm font-semibold">
              Comment for this stitch
            </label>
            <textarea id="pin-body" ref={commentRef} rows={2} maxLength={500} className="rounded-md border border-bark/40 px-2 py-2" value={body} aria-describedby={body.length >= 300 ? "pin-body-count" : undefined} onChange={(e) => setBody(e.target.value)} />
            <CharCount id="pin-body-count" length={body.length} max={500} showFrom={300} />
            {pinError ? <Notice tone="error">{pinError}</Notice> : null}
            <div>
              <Button variant="secondary" onClick={pin}>
                Pin comment
              </Button>
            </div>
            {pending.length ? (
              <ul className="flex flex-col gap-1" aria-label="Comments to send">
                {pending.map((c, i) => (
                  <li key={i} className="flex flex-wrap items-center gap-2">
                    <span>
                      {pinnedOld.length + i + 1}. {charts[c.chartIndex]?.label}, row {c.row}, stitch {c.stitch}: {c.body}
                    </span>
                    <Button variant="quiet" onClick={() => setPending((l) => l.filter((_, j) => j !== i))}>
                      Remove comment {pinnedOld.length + i + 1}
                    </Button>
                  </li>
                ))}
              </ul>
            ) : null}
            <form action={changesAction} className="flex flex-col gap-2">
              <input type="hidden" name="proofId" value={answer.proofId} />
              <input type="hidden" name="contentHash" value={answer.contentHash} />
              <input type="hidden" name="comments" value={JSON.stringify(pending)} />
              <label htmlFor="changes-note" className="text-sm font-semibold">
                A general note (optional)
              </label>
              <textarea id="changes-note" name="note" rows={3} maxLength={2000} className="rounded-md border border-bark/40 px-2 py-2" defaultValue={changesState.status === "error" ? changesState.values?.note : ""} aria-describedby={noteLength >= 1500 ? "changes-note-count" : undefined} onChange={(e) => setNoteLength(e.target.value.length)} />
              <CharCount id="changes-note-count" length={noteLength} max={2000} showFrom={1500} />
              {changesState.status === "error" ? (
                <Notice tone="error">{changesState.fieldErrors?.note?.join(" ") ?? changesState.message}</Notice>
              ) : null}
              {changesState.status === "ok" ? <Notice tone="success">{changesState.message}</Notice> : null}
              <div>
                <Button type="submit" variant="secondary" disabled={changesPending}>
                  Send my changes
                </Button>
              </div>
            </form>
          </section>
          <section aria-labelledby="approve-proof" className="flex flex-col gap-3 rounded-lg border border-moss/50 p-4">
            <h3 id="approve-proof" className="text-lg">
              Approve proof {answer.number}
            </h3>
            <p className="text-sm">
              Approving fixes this design: the studio knits exactly this. A later change needs a new quote.
            </p>
            <form action={approveAction} className="flex flex-col gap-3">
              <input type="hidden" name="proofId" value={answer.proofId} />
              <input type="hidden" name="contentHash" value={answer.contentHash} />
              <label className="flex items-start gap-2">
                <input type="checkbox" name="checked" className="mt-1" aria-describedby={approveState.status === "error" ? "approve-error" : undefined} />
                <span>I have checked the charts, the colours and the lettering.</span>
              </label>
              {approveState.status === "error" ? (
                <div id="approve-error">
                  <Notice tone="error">{approveState.fieldErrors?.checked?.join(" ") ?? approveState.message}</Notice>
                </div>
              ) : null}
              {approveState.status === "ok" ? <Notice tone="success">{approveState.message}</Notice> : null}
              <div>
                <Button type="submit" disabled={approvePending}>
                  Approve this proof
                </Button>
              </div>
            </form>
          </section>
        </div>
      ) : null}
    </div>
  );
}
