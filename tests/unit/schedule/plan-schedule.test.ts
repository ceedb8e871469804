// Hand-worked schedules. Today is Monday 2026-03-02 in every example; the block times start at 09:00.
import { describe, expect, test } from "vitest";
import {
  ScheduleInputError,
  addDays,
  earliestPromiseDate,
  planSchedule,
  type ScheduleMember,
  type SchedulePiece,
} from "@/lib/core/schedule";

const TODAY = "2026-03-02";

// Ines (owner) works 5 h on weekdays and has Wednesday 4 March off; Tom (assistant) works 4 h Monday to Thursday.
const ines: ScheduleMember = {
  id: "ines",
  weekdayMinutes: { mon: 300, tue: 300, wed: 300, thu: 300, fri: 300, sat: 0, sun: 0 },
  daysOff: ["2026-03-04"],
};
const tom: ScheduleMember = {
  id: "tom",
  weekdayMinutes: { mon: 240, tue: 240, wed: 240, thu: 240, fri: 0, sat: 0, sun: 0 },
};

// An Aran-weight sweater due Friday 6 March: only Ines knits; anyone embroiders, blocks and finishes; 24 h drying.
const sweater: SchedulePiece = {
  id: "A1",
  commissionId: "c-aran",
  due: "2026-03-06",
  dryingHours: 24,
  stages: {
    knitting: { minutes: 420, memberIds: ["ines"] },
    embroidery: { minutes: 200, memberIds: ["ines", "tom"] },
    blocking: { minutes: 20, memberIds: ["ines", "tom"] },
    finishing: { minutes: 45, memberIds: ["ines", "tom"] },
  },
};
// A baby hat due Thursday 12 March: no embroidery, Tom blocks and finishes, 12 h drying.
const hat: SchedulePiece = {
  id: "B1",
  commissionId: "c-baby",
  due: "2026-03-12",
  dryingHours: 12,
  stages: {
    knitting: { minutes: 500, memberIds: ["ines"] },
    embroidery: { minutes: 0, memberIds: ["ines", "tom"] },
    blocking: { minutes: 15, memberIds: ["tom"] },
    finishing: { minutes: 30, memberIds: ["tom"] },
  },
};

// A new request for mittens: knitting 300 (Ines), finishing 60 (either).
const mittens = {
  id: "N1",
  stages: { knitting: { minutes: 300, memberIds: ["ines"] }, finishing: { minutes: 60, memberIds: ["ines", "tom"] } },
};

describe("two members, a day off, drying waits and one late commission", () => {
  // The sweater is due first, so it is placed first, even though the hat is listed first.
  // Sweater:
  //   knitting 420, Ines only: Mon 2nd 300 (09:00–14:00), Tue 3rd 120 (09:00–11:00) → ends Tue.
  //   embroidery 200 from Wed 4th: Ines is off Wed, so Thu 5th; Tom Wed 4th → Tom, Wed (earlier finish).
  //   blocking 20 from Thu 5th: both could do it Thu → tie, lower id → Ines Thu 09:00–09:20.
  //   drying 24 h = 1 whole day after Thu → dry by Fri 6th; finishing from Sat 7th.
  //   finishing 45 from Sat: nobody works the weekend; both free Mon 9th → tie → Ines Mon 09:00–09:45.
  //   finished Mon 9th, due Fri 6th → 3 days late.
  // Hat (placed second, gets what is left):
  //   knitting 500, Ines: Mon full; Tue 180 left (11:00–14:00); Wed off; Thu 280 left after the
  //   sweater's blocking (09:20–14:00); Fri 40 (09:00–09:40) → ends Fri 6th.
  //   blocking 15, Tom, from Sat 7th: Tom works Mon 9th → 09:00–09:15.
  //   drying 12 h → rounded up to 1 day → dry by Tue 10th; finishing from Wed 11th.
  //   finishing 30, Tom, Wed 11th 09:00–09:30 → finished Wed 11th, due Thu 12th → on time.
  const plan = planSchedule({ today: TODAY, members: [tom, ines], pieces: [hat, sweater] });

  test("blocks, by day and member", () => {
    expect(plan.blocks.map((b) => [b.date, b.memberId, b.pieceId, b.stage, b.minutes, b.start.slice(11), b.end.slice(11)])).toEqual([
      ["2026-03-02", "ines", "A1", "knitting", 300, "09:00", "14:00"],
      ["2026-03-03", "ines", "A1", "knitting", 120, "09:00", "11:00"],
      ["2026-03-03", "ines", "B1", "knitting", 180, "11:00", "14:00"],
      ["2026-03-04", "tom", "A1", "embroidery", 200, "09:00", "12:20"],
      ["2026-03-05", "ines", "A1", "blocking", 20, "09:00", "09:20"],
      ["2026-03-05", "ines", "B1", "knitting", 280, "09:20", "14:00"],
      ["2026-03-06", "ines", "B1", "knitting", 40, "09:00", "09:40"],
      ["2026-03-09", "ines", "A1", "finishing", 45, "09:00", "09:45"],
      ["2026-03-09", "tom", "B1", "blocking", 15, "09:00", "09:15"],
      ["2026-03-11", "tom", "B1", "finishing", 30, "09:00", "09:30"],
    ]);
  });

  test("pieces", () => {
    expect(plan.pieces.map((p) => [p.pieceId, p.start, p.dryUntil, p.finish, p.due, p.lateByDays])).toEqual([
      ["A1", "2026-03-02", "2026-03-06", "2026-03-09", "2026-03-06", 3],
      ["B1", "2026-03-03", "2026-03-10", "2026-03-11", "2026-03-12", 0],
    ]);
    expect(plan.pieces[0].stages.map((s) => [s.stage, s.memberId, s.start, s.finish])).toEqual([
      ["knitting", "ines", "2026-03-02", "2026-03-03"],
      ["embroidery", "tom", "2026-03-04", "2026-03-04"],
      ["blocking", "ines", "2026-03-05", "2026-03-05"],
      ["finishing", "ines", "2026-03-09", "2026-03-09"],
    ]);
  });

  test("commissions", () => {
    expect(plan.commissions).toEqual([
      { commissionId: "c-aran", finish: "2026-03-09", due: "2026-03-06", lateByDays: 3 },
      { commissionId: "c-baby", finish: "2026-03-11", due: "2026-03-12", lateByDays: 0 },
    ]);
  });

  test("a new request goes after both", () => {
    // New piece: knitting 300 (Ines), finishing 60 (either).
    //   Ines's free minutes after the queue: Mon 0, Tue 0, Wed off, Thu 0, Fri 260, Mon 9th 255.
    //   knitting: Fri 260 + Mon 40 → ends Mon 9th; finishing from Tue 10th: both free → Ines Tue 10th.
    const r = earliestPromiseDate({ today: TODAY, members: [ines, tom], queue: [sweater, hat], newPieces: [mittens] });
    expect(r.date).toBe("2026-03-10");
    expect(r.pieces[0].stages.map((s) => [s.stage, s.memberId, s.start, s.finish])).toEqual([
      ["knitting", "ines", "2026-03-06", "2026-03-09"],
      ["finishing", "ines", "2026-03-10", "2026-03-10"],
    ]);
  });

  test("with an empty queue the same request is knitted Monday and finished Tuesday", () => {
    expect(earliestPromiseDate({ today: TODAY, members: [ines, tom], queue: [], newPieces: [mittens] }).date).toBe("2026-03-03");
  });
});

describe("a weekly cap below the weekdays' total", () => {
  // 4 h every day but at most 10 h a week. Knitting 1000 min from Mon 2nd:
  //   Mon 240, Tue 240, Wed 120 (week reaches 600), Thu–Sun nothing; Mon 9th 240, Tue 10th 160 → ends Tue 10th.
  test("the week is never overbooked", () => {
    const plan = planSchedule({
      today: TODAY,
      members: [
        {
          id: "ines",
          weekdayMinutes: { mon: 240, tue: 240, wed: 240, thu: 240, fri: 240, sat: 240, sun: 240 },
          weeklyCapMinutes: 600,
        },
      ],
      pieces: [{ id: "K", commissionId: "c", due: "2026-03-13", stages: { knitting: { minutes: 1000, memberIds: ["ines"] } } }],
    });
    expect(plan.blocks.map((b) => [b.date, b.minutes])).toEqual([
      ["2026-03-02", 240],
      ["2026-03-03", 240],
      ["2026-03-04", 120],
      ["2026-03-09", 240],
      ["2026-03-10", 160],
    ]);
    expect(plan.pieces[0].finish).toBe("2026-03-10");
  });
});

describe("drying that has already begun", () => {
  // 30 h of drying left counts as 2 whole days from the end of yesterday: dry by Tue 3rd; finishing from Wed 4th.
  const drying: SchedulePiece = {
    id: "D",
    commissionId: "c-d",
    due: "2026-03-05",
    dryingHours: 30,
    stages: { finishing: { minutes: 60, memberIds: ["ines"] } },
  };
  test("Ines only: her day off pushes finishing to Thursday", () => {
    const plan = planSchedule({ today: TODAY, members: [ines, tom], pieces: [drying] });
    expect(plan.pieces[0]).toMatchObject({ start: TODAY, dryUntil: "2026-03-03", finish: "2026-03-05", lateByDays: 0 });
    expect(plan.blocks.map((b) => [b.date, b.memberId])).toEqual([["2026-03-05", "ines"]]);
  });
  test("Tom may finish too: he does it on Wednesday", () => {
    const plan = planSchedule({
      today: TODAY,
      members: [ines, tom],
      pieces: [{ ...drying, stages: { finishing: { minutes: 60, memberIds: ["ines", "tom"] } } }],
    });
    expect(plan.blocks.map((b) => [b.date, b.memberId])).toEqual([["2026-03-04", "tom"]]);
  });
  test("drying is the last thing left: the piece is finished the day it is dry", () => {
    const plan = planSchedule({ today: TODAY, members: [ines], pieces: [{ ...drying, stages: {}, dryingHours: 48 }] });
    // 48 h = 2 days from the end of yesterday → dry by the end of Tue 3rd.
    expect(plan.pieces[0]).toMatchObject({ start: TODAY, finish: "2026-03-03", dryUntil: "2026-03-03" });
    expect(plan.blocks).toEqual([]);
  });
});

describe("choosing the member", () => {
  const amy: ScheduleMember = { id: "amy", weekdayMinutes: { mon: 300, tue: 300, wed: 300, thu: 300, fri: 300, sat: 0, sun: 0 } };
  const zoe: ScheduleMember = { ...amy, id: "zoe" };
  test("a tie goes to the lower id; the next piece takes the member who is still free", () => {
    const piece = (id: string, due: string): SchedulePiece => ({
      id,
      commissionId: id,
      due,
      stages: { embroidery: { minutes: 300, memberIds: ["zoe", "amy"] } },
    });
    const plan = planSchedule({ today: TODAY, members: [zoe, amy], pieces: [piece("P2", "2026-03-10"), piece("P1", "2026-03-09")] });
    expect(plan.blocks.map((b) => [b.pieceId, b.memberId, b.date])).toEqual([
      ["P1", "amy", TODAY],
      ["P2", "zoe", TODAY],
    ]);
  });

  test("each stage starts the day after the previous one ends, even for the same member", () => {
    // Amy has room for all three on Monday, but a stage handed on is taken up the next working day.
    const plan = planSchedule({
      today: TODAY,
      members: [amy],
      pieces: [
        {
          id: "S",
          commissionId: "c",
          due: "2026-03-04",
          stages: {
            knitting: { minutes: 60, memberIds: ["amy"] },
            embroidery: { minutes: 60, memberIds: ["amy"] },
            finishing: { minutes: 60, memberIds: ["amy"] },
          },
        },
      ],
    });
    expect(plan.pieces[0].stages.map((s) => s.start)).toEqual(["2026-03-02", "2026-03-03", "2026-03-04"]);
  });
});

describe("finished and half-finished commissions", () => {
  test("a piece with nothing left has no dates and is not late; its commission takes the other piece's finish", () => {
    const plan = planSchedule({
      today: TODAY,
      members: [ines],
      pieces: [
        { id: "left", commissionId: "pair", due: "2026-03-01", stages: {} },
        { id: "right", commissionId: "pair", due: "2026-03-02", stages: { finishing: { minutes: 30, memberIds: ["ines"] } } },
      ],
    });
    expect(plan.pieces.map((p) => [p.pieceId, p.start, p.finish, p.lateByDays])).toEqual([
      ["left", null, null, 0],
      ["right", TODAY, TODAY, 0],
    ]);
    // The commission is due at its earliest piece's date, 1 March, and finishes on 2 March: 1 day late.
    expect(plan.commissions).toEqual([{ commissionId: "pair", finish: TODAY, due: "2026-03-01", lateByDays: 1 }]);
  });

  test("nothing to plan", () => {
    expect(planSchedule({ today: TODAY, members: [], pieces: [] })).toEqual({ blocks: [], pieces: [], commissions: [] });
  });

  test("the day may start at another hour", () => {
    const plan = planSchedule({
      today: TODAY,
      dayStartHour: 7,
      members: [ines],
      pieces: [{ id: "x", commissionId: "c", due: TODAY, stages: { knitting: { minutes: 90, memberIds: ["ines"] } } }],
    });
    expect([plan.blocks[0].start, plan.blocks[0].end]).toEqual(["2026-03-02T07:00", "2026-03-02T08:30"]);
  });
});

describe("earliestPromiseDate with several new pieces", () => {
  test("the promise is the last new piece's finish, and nothing left means today", () => {
    const r = earliestPromiseDate({
      today: TODAY,
      members: [ines],
      queue: [],
      newPieces: [
        { id: "m1", stages: { knitting: { minutes: 300, memberIds: ["ines"] } } }, // Mon 2nd
        { id: "m2", stages: { knitting: { minutes: 300, memberIds: ["ines"] } } }, // Tue 3rd (Mon is full)
      ],
    });
    expect(r.date).toBe("2026-03-03");
    expect(r.pieces.map((p) => p.finish)).toEqual(["2026-03-02", "2026-03-03"]);
    expect(earliestPromiseDate({ today: TODAY, members: [ines], queue: [], newPieces: [{ id: "z", stages: {} }] }).date).toBe(TODAY);
  });
});

describe("bad input is refused with the field named", () => {
  const ok = { id: "p", commissionId: "c", due: "2026-03-10", stages: { knitting: { minutes: 60, memberIds: ["ines"] } } };
  test.each([
    [{ today: "2026-02-30", members: [ines], pieces: [] }, 'today: "2026-02-30" is not a date in the form YYYY-MM-DD'],
    [{ today: TODAY, members: [ines], pieces: [{ ...ok, due: "10/03/2026" }] }, 'pieces[0] ("p").due: "10/03/2026" is not a date'],
    [
      { today: TODAY, members: [ines], pieces: [{ ...ok, stages: { knitting: { minutes: 60, memberIds: ["bob"] } } }] },
      'pieces[0] ("p").stages.knitting.memberIds: no member has the id "bob"',
    ],
    [
      { today: TODAY, members: [ines], pieces: [{ ...ok, stages: { knitting: { minutes: 60, memberIds: [] } } }] },
      'pieces[0] ("p").stages.knitting: 60 minutes are left but no member who may do this stage has working hours',
    ],
    [
      {
        today: TODAY,
        members: [{ ...tom, weeklyCapMinutes: 0 }],
        pieces: [{ ...ok, stages: { blocking: { minutes: 10, memberIds: ["tom"] } } }],
      },
      "no member who may do this stage has working hours",
    ],
    [{ today: TODAY, members: [ines], pieces: [{ ...ok, stages: { knitting: { minutes: 12.5, memberIds: ["ines"] } } }] }, "must be whole minutes"],
    [{ today: TODAY, members: [ines], pieces: [ok, ok] }, 'pieces[1] ("p").id: "p" is used by another piece'],
    [{ today: TODAY, members: [ines, ines], pieces: [] }, 'members[1] ("ines").id: "ines" is used by another member'],
    [
      { today: TODAY, members: [{ ...ines, weekdayMinutes: { ...ines.weekdayMinutes, mon: 1000 } }], pieces: [] },
      'members[0] ("ines").weekdayMinutes.mon: must be whole minutes from 0 to 900',
    ],
    [{ today: TODAY, members: [{ ...ines, daysOff: ["tomorrow"] }], pieces: [] }, 'members[0] ("ines").daysOff[0]'],
    [{ today: TODAY, dayStartHour: 24, members: [], pieces: [] }, "dayStartHour: must be a whole hour from 0 to 23"],
    [{ today: TODAY, members: [ines], pieces: [{ ...ok, dryingHours: -1 }] }, "dryingHours: must be whole hours"],
  ] as [Parameters<typeof planSchedule>[0], string][])("%#: %s", (input, message) => {
    expect(() => planSchedule(input)).toThrow(ScheduleInputError);
    expect(() => planSchedule(input)).toThrow(message);
  });

  test("a stage whose only member is off for ten years cannot be placed", () => {
    const daysOff = Array.from({ length: 3700 }, (_, i) => addDays(TODAY, i));
    expect(() =>
      planSchedule({ today: TODAY, members: [{ ...ines, daysOff }], pieces: [ok] }),
    ).toThrow('pieces[0] ("p").stages.knitting: cannot be placed within 3653 days of today');
  });

  test("new pieces may not reuse a queued piece's id", () => {
    expect(() =>
      earliestPromiseDate({ today: TODAY, members: [ines], queue: [ok], newPieces: [{ id: "p", stages: {} }] }),
    ).toThrow('newPieces[0] ("p").id: "p" is used by another piece');
  });
});

// Found by the property "booking one more piece never makes a new request's promise earlier"
// (fast-check seed 807557146), when members were chosen stage by stage.
describe("members are chosen for the whole piece, not stage by stage", () => {
  const members: ScheduleMember[] = [
    { id: "amy", weekdayMinutes: { mon: 68, tue: 0, wed: 30, thu: 248, fri: 0, sat: 62, sun: 36 }, daysOff: [] },
    { id: "ines", weekdayMinutes: { mon: 0, tue: 30, wed: 144, thu: 30, fri: 0, sat: 30, sun: 178 }, daysOff: [], weeklyCapMinutes: 240 },
  ];
  const queue = [{ id: "p0", commissionId: "c1", due: TODAY, stages: { embroidery: { minutes: 563, memberIds: ["amy", "ines"] }, finishing: { minutes: 73, memberIds: ["amy"] } } }];
  const request = { id: "new", stages: { embroidery: { minutes: 894, memberIds: ["amy", "ines"] }, finishing: { minutes: 67, memberIds: ["ines"] } } };

  test("embroidery goes to Amy although Ines would end it a day sooner, because only Ines can finish", () => {
    const plan = planSchedule({ today: TODAY, members, pieces: [...queue, { ...request, commissionId: "c2", due: "2027-01-01" }] });
    const mine = plan.pieces.find((p) => p.pieceId === "new")!;
    expect(mine.stages.map((s) => [s.stage, s.memberId])).toEqual([
      ["embroidery", "amy"],
      ["finishing", "ines"],
    ]);
    // Ines embroidering (to 25 March) would leave her finishing to 31 March; this way it ends on the 29th.
    expect(mine.finish).toBe("2026-03-29");
  });

  test("one more minute booked for Ines no longer brings the promise forward", () => {
    const booked = { id: "b", commissionId: "c1", due: "2026-12-27", stages: { finishing: { minutes: 1, memberIds: ["ines"] } } };
    const without = earliestPromiseDate({ today: TODAY, members, queue, newPieces: [request] });
    const withMore = earliestPromiseDate({ today: TODAY, members, queue: [...queue, booked], newPieces: [request] });
    expect(without.date).toBe("2026-03-29");
    expect(withMore.date >= without.date).toBe(true);
  });
});
