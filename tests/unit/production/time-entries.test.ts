import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  buildTimeline,
  estimatePiece,
  estimateStatus,
  findOverlap,
  formatMinutes,
  getCareCard,
  getFibreFamily,
  getPieceLayout,
  intervalsOverlap,
  localDate,
  pieceLayouts,
  remainingMinutes,
  timerFlag,
  timerMinutes,
  timerSeconds,
} from "@/lib/core/production";

const t = (iso: string) => new Date(iso);

describe("timer arithmetic", () => {
  test.each([
    { banked: 0, since: "2026-11-30T09:00:00Z", now: "2026-11-30T09:45:00Z", minutes: 45 },
    { banked: 30 * 60, since: null, now: "2026-11-30T12:00:00Z", minutes: 30 },
    { banked: 30 * 60, since: "2026-11-30T10:00:00Z", now: "2026-11-30T10:15:29Z", minutes: 45 },
    { banked: 30 * 60, since: "2026-11-30T10:00:00Z", now: "2026-11-30T10:15:30Z", minutes: 46 },
    { banked: 0, since: "2026-11-30T10:00:00Z", now: "2026-11-30T10:00:05Z", minutes: 1 },
    // A clock that went back never gives negative time.
    { banked: 0, since: "2026-11-30T10:00:00Z", now: "2026-11-30T09:00:00Z", minutes: 0 },
  ])("banked $banked s, running since $since → $minutes min", ({ banked, since, now, minutes }) => {
    expect(timerMinutes({ bankedSeconds: banked, runningSince: since ? t(since) : null }, t(now))).toBe(minutes);
  });

  test("seconds never decrease as time goes on", () => {
    fc.assert(
      fc.property(fc.nat(100_000), fc.nat(100_000), fc.nat(100_000), (banked, a, b) => {
        const since = t("2026-01-01T00:00:00Z");
        const s1 = timerSeconds({ bankedSeconds: banked, runningSince: since }, new Date(since.getTime() + Math.min(a, b) * 1000));
        const s2 = timerSeconds({ bankedSeconds: banked, runningSince: since }, new Date(since.getTime() + Math.max(a, b) * 1000));
        return s2 >= s1 && s1 >= banked;
      }),
    );
  });
});

describe("overnight and long timers", () => {
  test.each([
    { start: "2026-11-30T20:00:00Z", end: "2026-11-30T23:30:00Z", minutes: 210, flag: null },
    { start: "2026-11-30T22:30:00Z", end: "2026-12-01T00:30:00Z", minutes: 120, flag: "overnight" },
    { start: "2026-11-30T07:00:00Z", end: "2026-11-30T18:00:00Z", minutes: 660, flag: "long" },
    { start: "2026-11-30T07:00:00Z", end: "2026-11-30T18:00:00Z", minutes: 540, flag: null },
  ])("$start → $end ($minutes min counted) in London: $flag", ({ start, end, minutes, flag }) => {
    expect(timerFlag(t(start), t(end), minutes, "Europe/London")).toBe(flag);
  });

  test("midnight is the studio's own: 23:30 UTC on 1 July is already the next day in London (BST)", () => {
    expect(localDate(t("2026-07-01T23:30:00Z"), "Europe/London")).toBe("2026-07-02");
    expect(timerFlag(t("2026-07-01T21:00:00Z"), t("2026-07-01T23:30:00Z"), 150, "Europe/London")).toBe("overnight");
    expect(timerFlag(t("2026-07-01T21:00:00Z"), t("2026-07-01T23:30:00Z"), 150, "UTC")).toBeNull();
  });
});

describe("overlaps", () => {
  const iv = (a: string, b: string) => ({ start: t(`2026-11-30T${a}:00Z`), end: t(`2026-11-30T${b}:00Z`) });
  test.each([
    { a: iv("09:00", "10:00"), b: iv("09:30", "10:30"), overlap: true },
    { a: iv("09:00", "10:00"), b: iv("10:00", "11:00"), overlap: false },
    { a: iv("09:00", "12:00"), b: iv("10:00", "11:00"), overlap: true },
    { a: iv("09:00", "10:00"), b: iv("11:00", "12:00"), overlap: false },
  ])("$a.start–$a.end vs $b.start–$b.end: $overlap", ({ a, b, overlap }) => {
    expect(intervalsOverlap(a, b)).toBe(overlap);
    expect(intervalsOverlap(b, a)).toBe(overlap);
  });
  test("findOverlap returns the entry hit", () => {
    const others = [{ ...iv("08:00", "09:00"), id: "a" }, { ...iv("09:30", "10:00"), id: "b" }];
    expect(findOverlap(iv("09:00", "09:45"), others)?.id).toBe("b");
    expect(findOverlap(iv("09:00", "09:30"), others)).toBeNull();
  });
});

describe("estimates", () => {
  test("remaining minutes never go below zero", () => {
    expect(remainingMinutes({ p50: 100, p80: 125 }, 40)).toBe(85);
    expect(remainingMinutes({ p50: 100, p80: 125 }, 40, "p50")).toBe(60);
    expect(remainingMinutes({ p50: 100, p80: 125 }, 300)).toBe(0);
    expect(remainingMinutes(undefined, 30)).toBe(0);
  });
  test.each([
    { logged: 50, status: "within_p50" },
    { logged: 110, status: "within_p80" },
    { logged: 126, status: "over_p80" },
  ])("logged $logged of P50 100 / P80 125 → $status", ({ logged, status }) => {
    expect(estimateStatus({ p50: 100, p80: 125 }, logged)).toBe(status);
  });
  test("formatMinutes", () => {
    expect(formatMinutes(45)).toBe("45 min");
    expect(formatMinutes(185)).toBe("3 h 05 min");
  });
  // The layouts are built from the garment's own pieces (lib/core/design-garment); these stand-ins
  // are the test's own counts, not typical figures of the app.
  const left = { label: "left mitten", newDesign: true, proofRounds: 1, plainStitches: 2500, strandedStitches: 3700, floatCatches: 300, shapingRounds: 15, thumbs: 1, blocked: true };
  const right = { ...left, label: "right mitten", newDesign: false, proofRounds: 0 };
  const body = { label: "body", newDesign: true, plainStitches: 30000, strandedStitches: 0, shapingRounds: 4, blocked: true };
  const sleeve = (side: string) => ({ label: `${side} sleeve`, newDesign: false, plainStitches: 9000, shapingRounds: 12, blocked: true });
  const yoke = { label: "yoke", newDesign: false, plainStitches: 3000, strandedStitches: 6000, floatCatches: 200, shapingRounds: 3, blocked: true };
  test("every layout's pieces get a positive knitting estimate with P80 above P50", () => {
    for (const [g, ps] of [["mittens", [left, right]], ["pullover", [body, sleeve("left"), sleeve("right"), yoke]]] as const) {
      for (const l of pieceLayouts(g, [...ps])) {
        for (const p of l.pieces) {
          const { estimate, dryingHours } = estimatePiece(p.features);
          expect(estimate.knitting.p50).toBeGreaterThan(0);
          expect(estimate.knitting.p80).toBeGreaterThanOrEqual(estimate.knitting.p50);
          expect(dryingHours).toBeGreaterThan(0);
        }
      }
    }
  });
  test("the layouts are the garment's pieces one by one (a pullover may be one piece); earlier ids still read; unknown layouts are refused", () => {
    expect(getPieceLayout("mittens", [left, right]).pieces.map((p) => p.name)).toEqual(["Left mitten", "Right mitten"]);
    expect(getPieceLayout("mittens", [left, right], "pair").id).toBe("pieces");
    expect(getPieceLayout("hat", [{ ...left, label: "hat", thumbs: 0 }], "one").pieces).toHaveLength(1);
    const ps = [body, sleeve("left"), sleeve("right"), yoke];
    expect(getPieceLayout("pullover", ps, "body_sleeves").pieces).toHaveLength(4);
    const one = getPieceLayout("pullover", ps, "one").pieces;
    expect(one).toHaveLength(1);
    // Knitted in one: every stitch of the four pieces, still counted once.
    expect(one[0].features.plainStitches).toBe(30000 + 9000 + 9000 + 3000);
    expect(one[0].features.strandedStitches).toBe(6000);
    expect(one[0].features.newDesign).toBe(true);
    expect(() => getPieceLayout("hat", [left], "one-and-a-half")).toThrow(/not a way to split/);
    expect(() => getPieceLayout("mittens", [left, right], "one")).toThrow(/not a way to split/);
  });
});

describe("timeline layout", () => {
  const block = (memberId: string, date: string, minutes: number) => ({
    memberId,
    pieceId: "p1",
    commissionId: "c1",
    stage: "knitting" as const,
    date,
    minutes,
    start: `${date}T09:00`,
    end: `${date}T10:00`,
  });
  const members = [
    { id: "a", weekdayMinutes: [360, 360, 360, 360, 360, 0, 0], daysOff: ["2026-12-02"] },
    { id: "b", weekdayMinutes: [0, 300, 0, 300, 0, 0, 0], daysOff: [] },
  ];
  test("days start today, weekdays are right, days off have no capacity, blocks land on their member and day", () => {
    // 2026-11-30 is a Monday.
    const t = buildTimeline([block("a", "2026-11-30", 200), block("a", "2026-11-30", 100), block("b", "2026-12-01", 300)], members, "2026-11-30", { minDays: 7 });
    expect(t.days.map((d) => d.weekday)).toEqual(["mon", "tue", "wed", "thu", "fri", "sat", "sun"]);
    expect(t.days[0].isToday).toBe(true);
    expect(t.rows[0].cells[0]).toMatchObject({ capacity: 360, booked: 300 });
    expect(t.rows[0].cells[2]).toMatchObject({ dayOff: true, capacity: 0 });
    expect(t.rows[1].cells[1]).toMatchObject({ capacity: 300, booked: 300 });
    expect(t.hiddenBlocks).toBe(0);
  });
  test("the span grows to the last block but is capped, counting what is hidden", () => {
    const t = buildTimeline([block("a", "2027-03-01", 60)], members, "2026-11-30", { maxDays: 30 });
    expect(t.days).toHaveLength(30);
    expect(t.hiddenBlocks).toBe(1);
  });
});

describe("care card", () => {
  test.each([
    { fibre: "Wool (100 %, non-superwash)", family: "wool" },
    { fibre: "Superwash merino 75 %, nylon 25 %", family: "superwash_wool" },
    { fibre: "Organic cotton", family: "plant" },
    { fibre: "Acrylic", family: "synthetic_blend" },
    { fibre: "Mystery fibre", family: "wool" },
  ])("$fibre → $family", ({ fibre, family }) => {
    expect(getFibreFamily(fibre)).toBe(family);
  });
  test("wool: hand wash cool, no agitation, dry flat; re-block; allergy note; no child cautions for an adult", () => {
    const card = getCareCard({ fibres: ["Wool (100 %, non-superwash)"], wearer: "adult", garment: "pullover" });
    const text = card.sections.map((s) => `${s.heading}: ${s.lines.join(" ")}`).join("\n");
    expect(text).toMatch(/Hand wash only, in cool water/);
    expect(text).toMatch(/agitate/);
    expect(text).toMatch(/Dry flat/);
    expect(text).toMatch(/re-block/);
    expect(card.cautions.map((c) => c.id)).toEqual(["wool-lanolin", "local-rules"]);
  });
  test("a baby's cotton mittens carry the cord, float and attachment cautions and defer to local rules", () => {
    const card = getCareCard({ fibres: ["Organic cotton"], wearer: "baby", garment: "mittens" });
    const ids = card.cautions.map((c) => c.id);
    expect(ids).toEqual(["mitten-sleeve-cord", "mitten-floats-baby", "mitten-ends", "attachments", "local-rules"]);
    expect(card.cautions.map((c) => c.text).join(" ")).toMatch(/where the child lives/);
  });
  test("a standard child's size makes an adult-recorded wearer's card a child's", () => {
    expect(getCareCard({ fibres: ["Wool"], wearer: "adult", garment: "hat", sizeKey: "toddler" }).ageBand).toBe("young-child");
  });
  test("the most delicate fibre decides", () => {
    expect(getCareCard({ fibres: ["Organic cotton", "Wool"], wearer: "adult", garment: "hat" }).fibreFamily).toBe("wool");
  });
});
