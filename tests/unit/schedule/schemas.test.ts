// The boundary schemas accept what planSchedule takes and name the field that is wrong.
import { describe, expect, test } from "vitest";
import { describeIssues, planInputSchema, planSchedule, promiseInputSchema } from "@/lib/core/schedule";

const valid = {
  today: "2026-03-02",
  members: [{ id: "ines", weekdayMinutes: { mon: 300, tue: 300, wed: 300, thu: 300, fri: 300, sat: 0, sun: 0 } }],
  pieces: [{ id: "p", commissionId: "c", due: "2026-03-10", stages: { knitting: { minutes: 60, memberIds: ["ines"] } } }],
};

describe("schedule schemas", () => {
  test("a valid input parses and plans", () => {
    const parsed = planInputSchema.parse(valid);
    expect(planSchedule(parsed).pieces[0].finish).toBe("2026-03-02");
  });

  test.each([
    [{ ...valid, today: "2026-3-2" }, "today: must be a date in the form YYYY-MM-DD"],
    [{ ...valid, pieces: [{ ...valid.pieces[0], due: "2026-02-30" }] }, "pieces.0.due: must be a date in the form YYYY-MM-DD"],
    [
      { ...valid, pieces: [{ ...valid.pieces[0], stages: { knitting: { minutes: 1.5, memberIds: ["ines"] } } }] },
      "pieces.0.stages.knitting.minutes: must be whole minutes",
    ],
    [{ ...valid, pieces: [{ ...valid.pieces[0], stages: { felting: { minutes: 5, memberIds: [] } } }] }, "pieces.0.stages"],
    [{ ...valid, members: [{ id: "", weekdayMinutes: valid.members[0].weekdayMinutes }] }, "members.0.id: must be a non-empty text"],
  ])("%#: %s", (input, message) => {
    const r = planInputSchema.safeParse(input);
    expect(r.success).toBe(false);
    if (!r.success) expect(describeIssues(r.error)).toContain(message);
  });

  test("a promise needs at least one new piece", () => {
    const r = promiseInputSchema.safeParse({ today: valid.today, members: valid.members, queue: valid.pieces, newPieces: [] });
    expect(r.success).toBe(false);
    if (!r.success) expect(describeIssues(r.error)).toBe("newPieces: give at least one new piece");
  });
});
