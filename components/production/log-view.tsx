"use client";
// The phone view for logging while knitting: one large button per running stage, quick starts.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Notice } from "@/components/ui/notice";
import { FLAG_LABELS, formatMinutes, type TimerFlag } from "@/lib/core/production";
import { WORK_STAGE_LABELS, type WorkStageName } from "@/lib/schemas/production";
import { api, formatClock } from "./api";
import { useTickingSeconds } from "./use-ticking-seconds";

interface LogData {
  timer: { id: string; pieceName: string; commissionTitle: string; stage: WorkStageName; paused: boolean; seconds: number; startedAt: string } | null;
  pieces: { id: string; name: string; stage: string; workStage: WorkStageName; commissionTitle: string; commissionNumber: number; logged: Record<string, number> }[];
  recent: { id: string; pieceName: string; stage: WorkStageName; minutes: number; flag: string | null; startedAt: string }[];
}

const big = "w-full rounded-xl px-5 py-5 text-xl font-semibold shadow-sm disabled:opacity-60";

export function LogView({ initial }: { initial: LogData }) {
  const qc = useQueryClient();
  const q = useQuery({
    queryKey: ["production", "log"],
    queryFn: () => api<LogData>("/api/production/log"),
    initialData: initial,
    // Another device may start or stop the timer: look again now and then.
    refetchInterval: 15_000,
  });
  const [fetchedAt, setFetchedAt] = useState(() => Date.now());
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const data = q.data;
  const timer = data.timer;
  const seconds = useTickingSeconds(timer?.seconds ?? null, Boolean(timer && !timer.paused), q.dataUpdatedAt || fetchedAt);

  const refresh = async () => {
    await qc.invalidateQueries({ queryKey: ["production"] });
    setFetchedAt(Date.now());
  };
  const onError = (e: Error) => setError(e.message);
  const start = useMutation({
    mutationFn: (v: { pieceId: string; stage: WorkStageName }) => api("/api/production/timers", { body: v }),
    onMutate: () => {
      setError(null);
      setDone(null);
    },
    onSuccess: refresh,
    onError,
  });
  const change = useMutation({
    mutationFn: (v: { id: string; action: "pause" | "resume" | "stop" }) =>
      api<{ entry: { minutes: number; flag: string | null } }>(`/api/production/timers/${v.id}`, { method: "PATCH", body: { action: v.action } }),
    onMutate: () => setError(null),
    onSuccess: async (res, v) => {
      if (v.action === "stop") {
        setDone(
          res.entry.flag
            ? `Stopped: ${formatMinutes(res.entry.minutes)} kept for review. ${FLAG_LABELS[res.entry.flag as TimerFlag] ?? ""}.`
            : `Stopped: ${formatMinutes(res.entry.minutes)} logged.`,
        );
      }
      await refresh();
    },
    onError,
  });
  const busy = start.isPending || change.isPending;

  return (
    <div className="mx-auto flex max-w-md flex-col gap-6">
      {error ? <Notice tone="error">{error}</Notice> : null}
      {done ? <Notice tone="success">{done}</Notice> : null}
      {timer ? (
        <section aria-labelledby="running-heading" className="rounded-xl border-2 border-moss bg-white p-5">
          <h2 id="running-heading" className="text-lg text-bark">
            {timer.paused ? "Paused" : "Running"}: {WORK_STAGE_LABELS[timer.stage]}
          </h2>
          <p className="text-xl font-semibold">{timer.pieceName}</p>
          <p className="text-bark">{timer.commissionTitle}</p>
          <p className="my-4 text-center font-display text-5xl tabular-nums" aria-live="off" data-testid="timer-clock">
            {formatClock(seconds)}
          </p>
          <div className="flex flex-col gap-3">
            {timer.paused ? (
              <button type="button" className={`${big} bg-moss text-white`} disabled={busy} onClick={() => change.mutate({ id: timer.id, action: "resume" })}>
                Resume {WORK_STAGE_LABELS[timer.stage].toLowerCase()}
              </button>
            ) : (
              <button type="button" className={`${big} border-2 border-bark/40 bg-white text-peat`} disabled={busy} onClick={() => change.mutate({ id: timer.id, action: "pause" })}>
                Pause
              </button>
            )}
            <button type="button" className={`${big} bg-madder text-white`} disabled={busy} onClick={() => change.mutate({ id: timer.id, action: "stop" })}>
              Stop and log
            </button>
          </div>
        </section>
      ) : (
        <section aria-labelledby="start-heading">
          <h2 id="start-heading" className="mb-3 text-xl">
            Start a timer
          </h2>
          {data.pieces.length === 0 ? <p className="text-bark">No pieces are in production.</p> : null}
          <ul className="flex flex-col gap-3">
            {data.pieces.map((p) => (
              <li key={p.id}>
                <button
                  type="button"
                  className={`${big} bg-madder text-left text-white`}
                  disabled={busy}
                  onClick={() => start.mutate({ pieceId: p.id, stage: p.workStage })}
                >
                  Start {WORK_STAGE_LABELS[p.workStage].toLowerCase()}: {p.name}
                  <span className="block text-base font-normal">
                    {p.commissionNumber}. {p.commissionTitle} · {formatMinutes(p.logged[p.workStage] ?? 0)} logged on this stage
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </section>
      )}
      <section aria-labelledby="recent-heading">
        <h2 id="recent-heading" className="mb-2 text-xl">
          My recent entries
        </h2>
        {data.recent.length === 0 ? <p className="text-bark">Nothing logged yet.</p> : null}
        <ul className="flex flex-col gap-1">
          {data.recent.map((r) => (
            <li key={r.id} className="text-base">
              {r.pieceName}, {WORK_STAGE_LABELS[r.stage]}: <span className="tabular-nums">{formatMinutes(r.minutes)}</span>
              {r.flag ? <span className="ml-2 font-semibold text-madder-dark">(to confirm)</span> : null}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
