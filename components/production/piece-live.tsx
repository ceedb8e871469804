"use client";
// One piece: estimate vs logged per stage (live), its timer, manual entries and corrections.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Notice } from "@/components/ui/notice";
import { estimateStatus, FLAG_LABELS, formatMinutes, type TimerFlag } from "@/lib/core/production";
import { manualEntrySchema, WORK_STAGE_LABELS, WORK_STAGES, type WorkStageName } from "@/lib/schemas/production";
import { api, ApiError, formatClock } from "./api";
import { ScrollArea } from "./scroll-area";
import { useTickingSeconds } from "./use-ticking-seconds";

export interface PieceDetail {
  piece: { id: string; name: string; stage: string; estimate: Record<string, { p50: number; p80: number }>; features: Record<string, number | boolean>; commissionState: string };
  logged: Record<string, number>;
  live: Record<string, number>;
  entries: {
    id: string;
    userId: string;
    userName: string;
    stage: string;
    source: string;
    startedAt: string;
    endedAt: string | null;
    minutes: number;
    running: boolean;
    note: string;
    flag: string | null;
  }[];
}

interface MyTimer {
  timer: { id: string; pieceId: string; pieceName: string; stage: WorkStageName; paused: boolean; seconds: number } | null;
}

const STATUS_TEXT = { within_p50: "Within P50", within_p80: "Between P50 and P80", over_p80: "Over P80", no_estimate: "No estimate" } as const;

export function PieceLive({ initial, me, isOwner, today }: { initial: PieceDetail; me: string; isOwner: boolean; today: string }) {
  const qc = useQueryClient();
  const key = ["production", "piece", initial.piece.id];
  const detail = useQuery({ queryKey: key, queryFn: () => api<PieceDetail>(`/api/production/pieces/${initial.piece.id}`), initialData: initial, refetchInterval: 20_000 });
  const mine = useQuery({ queryKey: ["production", "timer"], queryFn: () => api<MyTimer>("/api/production/timers"), refetchInterval: 15_000 });
  const [error, setError] = useState<string | null>(null);
  const [stage, setStage] = useState<WorkStageName>(
    (WORK_STAGES as readonly string[]).includes(initial.piece.stage) ? (initial.piece.stage as WorkStageName) : "knitting",
  );
  const stageId = useId();
  const d = detail.data;
  const timer = mine.data?.timer ?? null;
  const here = timer?.pieceId === d.piece.id ? timer : null;
  const seconds = useTickingSeconds(here?.seconds ?? null, Boolean(here && !here.paused), mine.dataUpdatedAt);
  const refresh = () => qc.invalidateQueries({ queryKey: ["production"] });
  const onError = (e: Error) => setError(e.message);

  const start = useMutation({ mutationFn: () => api("/api/production/timers", { body: { pieceId: d.piece.id, stage } }), onMutate: () => setError(null), onSuccess: refresh, onError });
  const change = useMutation({
    mutationFn: (v: { id: string; action: "pause" | "resume" | "stop" }) => api(`/api/production/timers/${v.id}`, { method: "PATCH", body: { action: v.action } }),
    onMutate: () => setError(null),
    onSuccess: refresh,
    onError,
  });
  // A refused correction is shown at its entry (on a phone the page top is far away).
  const [fixError, setFixError] = useState<{ id: string; message: string } | null>(null);
  const fix = useMutation({
    mutationFn: (v: { id: string; minutes: number; confirm?: boolean }) => api(`/api/production/entries/${v.id}`, { method: "PATCH", body: { minutes: v.minutes, confirm: v.confirm } }),
    onMutate: () => {
      setError(null);
      setFixError(null);
    },
    onSuccess: refresh,
    onError: (e: Error, v) => setFixError({ id: v.id, message: e instanceof ApiError && e.fieldErrors?.minutes?.[0] ? `${e.message} ${e.fieldErrors.minutes[0]}` : e.message }),
  });
  // A deleted entry can be brought back for a while (the server keeps it, marked deleted).
  const [undoable, setUndoable] = useState<{ id: string; text: string } | null>(null);
  const remove = useMutation({
    mutationFn: (e: { id: string; text: string }) => api(`/api/production/entries/${e.id}`, { method: "DELETE" }),
    onMutate: () => setError(null),
    onSuccess: (_r, e) => {
      setUndoable(e);
      void refresh();
    },
    onError,
  });
  const restore = useMutation({
    mutationFn: (id: string) => api(`/api/production/entries/${id}/restore`, { method: "POST" }),
    onMutate: () => setError(null),
    onSuccess: () => {
      setUndoable(null);
      void refresh();
    },
    onError,
  });
  const loggable = ["in_production", "ready", "balance_paid"].includes(d.piece.commissionState);

  return (
    <div className="flex flex-col gap-6">
      {error ? (
        <RevealOnShow key={error}>
          <Notice tone="error">{error}</Notice>
        </RevealOnShow>
      ) : null}
      <div aria-live="polite">
        {undoable ? (
          <p className="flex flex-wrap items-center gap-3 rounded-md border border-bark/20 bg-white p-3">
            <span>Deleted: {undoable.text}.</span>
            <Button variant="secondary" className="px-3 py-1 text-sm" disabled={restore.isPending} onClick={() => restore.mutate(undoable.id)}>
              Undo
            </Button>
          </p>
        ) : null}
      </div>
      <section aria-labelledby="est-heading">
        <h2 id="est-heading" className="mb-2 text-xl">
          Estimate and hours logged
        </h2>
        <ScrollArea label="Estimate and logged time per stage">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Estimate and logged time per stage for {d.piece.name} (running timers included)</caption>
            <thead>
              <tr className="border-b border-bark/30 text-sm text-bark">
                <th scope="col" className="py-2 pr-4">Stage</th>
                <th scope="col" className="py-2 pr-4 text-right">P50</th>
                <th scope="col" className="py-2 pr-4 text-right">P80</th>
                <th scope="col" className="py-2 pr-4 text-right">Logged</th>
                <th scope="col" className="py-2 pr-4">Status</th>
              </tr>
            </thead>
            <tbody>
              {WORK_STAGES.map((s) => {
                const e = d.piece.estimate[s];
                const l = d.live[s] ?? 0;
                const st = estimateStatus(e, l);
                return (
                  <tr key={s} className="border-b border-bark/10">
                    <th scope="row" className="py-2 pr-4 font-semibold">{WORK_STAGE_LABELS[s]}</th>
                    <td className="py-2 pr-4 text-right tabular-nums">{formatMinutes(e?.p50 ?? 0)}</td>
                    <td className="py-2 pr-4 text-right tabular-nums">{formatMinutes(e?.p80 ?? 0)}</td>
                    <td className="py-2 pr-4 text-right tabular-nums" data-testid={`logged-${s}`}>{formatMinutes(l)}</td>
                    <td className={`py-2 pr-4 ${st === "over_p80" ? "font-semibold text-madder-dark" : ""}`}>
                      {st === "over_p80" ? "▲ " : ""}
                      {STATUS_TEXT[st]}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </ScrollArea>
      </section>

      <section aria-labelledby="timer-heading" className="rounded-lg border border-bark/20 bg-white p-4">
        <h2 id="timer-heading" className="mb-2 text-xl">Timer</h2>
        {here ? (
          <div className="flex flex-wrap items-center gap-3">
            <p className="text-lg">
              {WORK_STAGE_LABELS[here.stage]} {here.paused ? "paused at" : "running:"} <span className="font-display text-2xl tabular-nums">{formatClock(seconds)}</span>
            </p>
            {here.paused ? (
              <Button onClick={() => change.mutate({ id: here.id, action: "resume" })} disabled={change.isPending}>Resume</Button>
            ) : (
              <Button variant="secondary" onClick={() => change.mutate({ id: here.id, action: "pause" })} disabled={change.isPending}>Pause</Button>
            )}
            <Button onClick={() => change.mutate({ id: here.id, action: "stop" })} disabled={change.isPending}>Stop and log</Button>
          </div>
        ) : timer ? (
          <p>
            Your timer is running on {timer.pieceName} ({WORK_STAGE_LABELS[timer.stage]}); stop it there before starting one here.
          </p>
        ) : d.piece.commissionState !== "in_production" ? (
          <p className="text-bark">Timers run while the commission is in production.</p>
        ) : (
          <div className="flex flex-wrap items-end gap-3">
            <div className="flex flex-col">
              <label htmlFor={stageId} className="font-semibold">Stage</label>
              <select id={stageId} value={stage} onChange={(e) => setStage(e.target.value as WorkStageName)} className="rounded-md border border-bark/40 bg-white px-3 py-2">
                {WORK_STAGES.map((s) => (
                  <option key={s} value={s}>{WORK_STAGE_LABELS[s]}</option>
                ))}
              </select>
            </div>
            <Button onClick={() => start.mutate()} disabled={start.isPending}>Start timer</Button>
          </div>
        )}
      </section>

      {loggable ? <ManualEntryForm pieceId={d.piece.id} today={today} onSaved={refresh} /> : null}

      <section aria-labelledby="entries-heading">
        <h2 id="entries-heading" className="mb-2 text-xl">Entries</h2>
        {d.entries.length === 0 ? <p className="text-bark">No time logged on this piece yet.</p> : null}
        <ul className="flex flex-col gap-2">
          {d.entries.map((e) => (
            <li key={e.id} className="rounded-md border border-bark/20 bg-white p-3">
              <p>
                <span className="font-semibold">{WORK_STAGE_LABELS[e.stage as WorkStageName] ?? e.stage}</span>, {e.userName}:{" "}
                <span className="tabular-nums">{formatMinutes(e.minutes)}</span> {e.running ? "(timer running)" : e.source === "manual" ? "(entered)" : "(timer)"}
                <span className="block text-sm text-bark">
                  {new Date(e.startedAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}
                  {e.note ? ` · ${e.note}` : ""}
                </span>
              </p>
              {e.flag ? (
                <p className="mt-1 font-semibold text-madder-dark">{FLAG_LABELS[e.flag as TimerFlag] ?? e.flag}; not counted until confirmed.</p>
              ) : null}
              {!e.running && (e.userId === me || isOwner) ? (
                <EntryEdit entry={e} onSave={(minutes, confirm) => fix.mutate({ id: e.id, minutes, confirm })} error={fixError?.id === e.id ? fixError.message : null} onDelete={() => remove.mutate({ id: e.id, text: `${formatMinutes(e.minutes)} of ${(WORK_STAGE_LABELS[e.stage as WorkStageName] ?? e.stage).toLowerCase()}` })} busy={fix.isPending || remove.isPending} />
              ) : null}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}

/** Brings a message that just appeared into view (the page may be scrolled far from it). */
function RevealOnShow({ children }: { children: ReactNode }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    ref.current?.scrollIntoView?.({ block: "center", behavior: "smooth" });
  }, []);
  return <div ref={ref}>{children}</div>;
}

function EntryEdit({
  entry,
  onSave,
  onDelete,
  busy,
  error,
}: {
  entry: PieceDetail["entries"][number];
  onSave: (m: number, confirm?: boolean) => void;
  onDelete: () => void;
  busy: boolean;
  error: string | null;
}) {
  const [minutes, setMinutes] = useState(String(entry.minutes));
  const id = useId();
  const n = Number(minutes);
  const valid = Number.isInteger(n) && n >= 1 && n <= 1440;
  return (
    <div className="mt-2 flex flex-wrap items-end gap-2">
      <div className="flex flex-col">
        <label htmlFor={id} className="text-sm font-semibold">Minutes</label>
        <input id={id} inputMode="numeric" value={minutes} onChange={(e) => setMinutes(e.target.value)} className="w-24 rounded-md border border-bark/40 px-2 py-1" aria-invalid={!valid || undefined} />
      </div>
      <Button variant="secondary" className="px-3 py-1 text-sm" disabled={busy || !valid} onClick={() => onSave(n, entry.flag ? true : undefined)}>
        {entry.flag ? "Confirm minutes" : "Save correction"}
      </Button>
      <ConfirmButton
        label="Delete entry"
        question={`Delete ${formatMinutes(entry.minutes)} logged on ${new Date(entry.startedAt).toLocaleDateString("en-GB", { dateStyle: "medium" })}?`}
        confirmLabel="Delete"
        keepLabel="Keep it"
        disabled={busy}
        onConfirm={onDelete}
      />
      {!valid ? <p className="w-full text-sm text-madder-dark" role="alert">Use whole minutes from 1 to 1440.</p> : null}
      {error ? (
        <div className="w-full" data-testid="entry-error">
          <RevealOnShow key={error}>
            <p className="text-sm font-semibold text-madder-dark" role="alert">
              {error}
            </p>
          </RevealOnShow>
        </div>
      ) : null}
    </div>
  );
}

type FormIn = z.input<typeof manualEntrySchema>;
type FormOut = z.output<typeof manualEntrySchema>;

function ManualEntryForm({ pieceId, today, onSaved }: { pieceId: string; today: string; onSaved: () => void }) {
  const form = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(manualEntrySchema),
    defaultValues: { pieceId, stage: "knitting", date: today, startTime: "09:00", minutes: "" as unknown as number, note: "" },
  });
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const ids = { stage: useId(), date: useId(), time: useId(), minutes: useId(), note: useId() };
  const errs = form.formState.errors;
  const submit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await api("/api/production/entries", { body: values });
      setMessage({ tone: "success", text: `Logged ${formatMinutes(values.minutes)}.` });
      form.reset({ ...values, minutes: "" as unknown as number, note: "" });
      onSaved();
    } catch (err) {
      if (err instanceof ApiError && err.fieldErrors) {
        for (const [k, v] of Object.entries(err.fieldErrors)) form.setError(k as keyof FormIn, { message: v.join(" ") });
      }
      setMessage({ tone: "error", text: (err as Error).message });
    }
  });
  const err = (k: keyof FormIn, id: string) =>
    errs[k]?.message ? (
      <p id={`${id}-e`} role="alert" className="text-sm font-semibold text-madder-dark">{String(errs[k]?.message)}</p>
    ) : null;
  const input = "rounded-md border border-bark/40 bg-white px-3 py-2";
  return (
    <section aria-labelledby="manual-heading" className="rounded-lg border border-bark/20 bg-white p-4">
      <h2 id="manual-heading" className="mb-2 text-xl">Add time by hand</h2>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <form onSubmit={submit} className="mt-2 grid gap-3 sm:grid-cols-2" noValidate>
        <input type="hidden" {...form.register("pieceId")} />
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.stage} className="font-semibold">Stage</label>
          <select id={ids.stage} className={input} {...form.register("stage")}>
            {WORK_STAGES.map((s) => (
              <option key={s} value={s}>{WORK_STAGE_LABELS[s]}</option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.date} className="font-semibold">Date</label>
          <input id={ids.date} type="date" max={today} className={input} aria-invalid={errs.date ? true : undefined} aria-describedby={errs.date ? `${ids.date}-e` : undefined} {...form.register("date")} />
          {err("date", ids.date)}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.time} className="font-semibold">Started at</label>
          <input id={ids.time} type="time" className={input} aria-invalid={errs.startTime ? true : undefined} aria-describedby={errs.startTime ? `${ids.time}-e` : undefined} {...form.register("startTime")} />
          {err("startTime", ids.time)}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.minutes} className="font-semibold">Minutes</label>
          <input id={ids.minutes} inputMode="numeric" className={input} aria-invalid={errs.minutes ? true : undefined} aria-describedby={errs.minutes ? `${ids.minutes}-e` : undefined} {...form.register("minutes")} />
          {err("minutes", ids.minutes)}
        </div>
        <div className="flex flex-col gap-1 sm:col-span-2">
          <label htmlFor={ids.note} className="font-semibold">Note (optional)</label>
          <input id={ids.note} className={input} {...form.register("note")} />
          {err("note", ids.note)}
        </div>
        <div>
          <Button type="submit" disabled={form.formState.isSubmitting}>Add entry</Button>
        </div>
      </form>
    </section>
  );
}
