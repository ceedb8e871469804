import { describe, expect, test } from "vitest";
import { decideAttempt, LOCK_POLICY, lockSeconds, type LockState } from "@/lib/server/sign-in-lock";

const t0 = new Date("2026-12-01T10:00:00Z");
const at = (s: number) => new Date(t0.getTime() + s * 1000);

/** Runs attempts at the given seconds; returns each outcome ("ok", "ok+lock" or "429:<seconds>"). */
function run(times: number[]): string[] {
  let state: LockState | null = null;
  return times.map((s) => {
    const d = decideAttempt(state, at(s));
    state = d.next;
    return d.allowed ? (d.lockedNow ? "ok+lock" : "ok") : `429:${d.retryAfterSeconds}`;
  });
}

describe("per-account sign-in lock policy", () => {
  test("the threshold-th attempt in a series is checked and starts a lock; attempts during it are refused", () => {
    expect(LOCK_POLICY.threshold).toBe(5);
    expect(run([0, 1, 2, 3, 4, 5, 30])).toEqual(["ok", "ok", "ok", "ok", "ok+lock", "429:59", "429:34"]);
  });

  test("each further attempt after a lock locks again for twice as long, capped at an hour", () => {
    expect(run([0, 1, 2, 3, 4, 64, 65, 184, 185])).toEqual(["ok", "ok", "ok", "ok", "ok+lock", "ok+lock", "429:119", "ok+lock", "429:239"]);
    expect([1, 2, 3, 4, 5, 6, 7, 8, 30].map((n) => lockSeconds(n))).toEqual([60, 120, 240, 480, 960, 1920, 3600, 3600, 3600]);
  });

  test("a quiet quarter of an hour before any lock starts a new series; after a lock, only a quiet day does", () => {
    expect(run([0, 1, 2, 3, 15 * 60 + 4, 15 * 60 + 5])).toEqual(["ok", "ok", "ok", "ok", "ok", "ok"]);
    const afterLock = run([0, 1, 2, 3, 4, 3600, 3600 + 121]);
    expect(afterLock.slice(4)).toEqual(["ok+lock", "ok+lock", "ok+lock"]);
    expect(run([0, 1, 2, 3, 4, 86_400 + 10])).toEqual(["ok", "ok", "ok", "ok", "ok+lock", "ok"]);
  });

  test("at most `threshold` passwords are checked in a burst, however many arrive at once", () => {
    const outcomes = run(Array.from({ length: 50 }, () => 0));
    expect(outcomes.filter((o) => o.startsWith("ok"))).toHaveLength(LOCK_POLICY.threshold);
  });
});
