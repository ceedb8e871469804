// Pure rules for logged time: timer arithmetic, the overnight flag, overlaps and remaining work.

/** A timer left running longer than this is flagged for the person to confirm. */
export const LONG_TIMER_MINUTES = 10 * 60;

export interface TimerState {
  /** seconds banked by earlier runs (before pauses) */
  bankedSeconds: number;
  /** start of the current run; null while paused */
  runningSince: Date | null;
}

/** Whole seconds a timer has counted so far (never negative, e.g. with a clock that went back). */
export function timerSeconds(t: TimerState, now: Date): number {
  const run = t.runningSince ? Math.max(0, Math.floor((now.getTime() - t.runningSince.getTime()) / 1000)) : 0;
  return Math.max(0, t.bankedSeconds) + run;
}

/** Minutes to record for a stopped timer: nearest whole minute, and at least one once it has run at all. */
export function timerMinutes(t: TimerState, now: Date): number {
  const seconds = timerSeconds(t, now);
  return seconds === 0 ? 0 : Math.max(1, Math.round(seconds / 60));
}

/** The calendar date (YYYY-MM-DD) of an instant in a time zone. */
export function localDate(at: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).formatToParts(at);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? "";
  return `${get("year")}-${get("month")}-${get("day")}`;
}

export type TimerFlag = "overnight" | "long";

/**
 * Why a stopped timer needs confirming, or null: it ran past midnight in the studio's time zone,
 * or for more than ten hours. Such minutes are kept but not counted until someone confirms them.
 */
export function timerFlag(startedAt: Date, endedAt: Date, countedMinutes: number, timeZone: string): TimerFlag | null {
  if (localDate(startedAt, timeZone) !== localDate(endedAt, timeZone)) return "overnight";
  if (countedMinutes > LONG_TIMER_MINUTES) return "long";
  return null;
}

export const FLAG_LABELS: Record<TimerFlag, string> = {
  overnight: "Timer ran past midnight: confirm the minutes",
  long: "Timer ran more than 10 hours: confirm the minutes",
};

export interface Interval {
  start: Date;
  end: Date;
}

/** Half-open intervals [start, end) overlap when each starts before the other ends. */
export function intervalsOverlap(a: Interval, b: Interval): boolean {
  return a.start.getTime() < b.end.getTime() && b.start.getTime() < a.end.getTime();
}

export function findOverlap<T extends Interval>(candidate: Interval, others: readonly T[]): T | null {
  return others.find((o) => intervalsOverlap(candidate, o)) ?? null;
}

export interface StageFigures {
  p50: number;
  p80: number;
}

/** Minutes left of a stage's estimate after what is logged; never below zero. */
export function remainingMinutes(estimate: StageFigures | undefined, logged: number, which: "p50" | "p80" = "p80"): number {
  if (!estimate) return 0;
  return Math.max(0, Math.round(estimate[which] - Math.max(0, logged)));
}

export type EstimateStatus = "within_p50" | "within_p80" | "over_p80" | "no_estimate";

export function estimateStatus(estimate: StageFigures | undefined, logged: number): EstimateStatus {
  if (!estimate || estimate.p80 <= 0) return logged > 0 ? "over_p80" : "no_estimate";
  if (logged > estimate.p80) return "over_p80";
  if (logged > estimate.p50) return "within_p80";
  return "within_p50";
}

/** "3 h 05 min", "45 min" */
export function formatMinutes(minutes: number): string {
  const m = Math.max(0, Math.round(minutes));
  const h = Math.floor(m / 60);
  const r = m % 60;
  if (h === 0) return `${r} min`;
  return `${h} h ${String(r).padStart(2, "0")} min`;
}

/** Signed percent error of an estimate against what was logged ((est − actual) ÷ actual), or null. */
export function estimateErrorPercent(estimated: number, logged: number): number | null {
  if (logged <= 0) return null;
  return Math.round(((estimated - logged) / logged) * 1000) / 10;
}
