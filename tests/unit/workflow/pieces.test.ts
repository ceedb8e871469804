// Piece stages: every from × to pair for the studio, roles and commission states, and readiness.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import {
  COMMISSION_STATES,
  PIECE_STAGES,
  ROLES,
  canMovePiece,
  commissionReadyWhen,
  pieceMovesFrom,
  type PieceStage,
} from "@/lib/core/workflow";

// Rows: from; columns: to in the order queued knitting embroidery blocking finishing done.
// "y" allowed, "=" same stage, "q" refused (back to the queue), "b" refused (more than one stage back).
const STAGE_MATRIX: Record<PieceStage, string> = {
  queued: "=yyyyy",
  knitting: "q=yyyy",
  embroidery: "qy=yyy",
  blocking: "qby=yy",
  finishing: "qbby=y",
  done: "qbbby=",
};

const CODES = { "=": "same_stage", q: "too_far_back", b: "too_far_back" } as const;

const PAIRS = PIECE_STAGES.flatMap((from) =>
  PIECE_STAGES.map((to, i) => ({ from, to, mark: STAGE_MATRIX[from][i] as "y" | "=" | "q" | "b" })),
);

describe("piece stage moves while in production", () => {
  test.each(PAIRS.flatMap((p) => (["owner", "assistant"] as const).map((role) => ({ ...p, role }))))(
    "$role: $from → $to ($mark)",
    ({ from, to, mark, role }) => {
      const r = canMovePiece(from, to, role, { commissionState: "in_production" });
      if (mark === "y") expect(r).toEqual({ ok: true, from, to });
      else expect(r).toMatchObject({ ok: false, code: CODES[mark] });
    },
  );

  test.each(PAIRS.flatMap((p) => (["client", "system"] as const).map((role) => ({ ...p, role }))))(
    "$role may not move pieces: $from → $to",
    ({ from, to, role }) => {
      expect(canMovePiece(from, to, role, { commissionState: "in_production" })).toMatchObject({
        ok: false,
        code: "forbidden",
        reason: "Only the studio owner or an assistant can move a piece between production stages.",
      });
    },
  );

  test("reasons name the stage to go back to", () => {
    expect(canMovePiece("finishing", "embroidery", "owner", { commissionState: "in_production" })).toMatchObject({
      reason: "A piece goes back only one stage for rework: from Finishing to Blocking.",
    });
    expect(canMovePiece("knitting", "queued", "assistant", { commissionState: "in_production" })).toMatchObject({
      reason:
        "Knitting has started, so the piece cannot go back to the queue; move it back one stage for rework instead.",
    });
  });

  test("buttons from blocking: one back, any forward", () => {
    expect(pieceMovesFrom("blocking", "assistant", { commissionState: "in_production" })).toEqual([
      "embroidery",
      "finishing",
      "done",
    ]);
  });
});

describe("pieces move only while the commission is in production", () => {
  const others = COMMISSION_STATES.filter((s) => s !== "in_production");
  test.each(others)("commission %s: nothing moves", (commissionState) => {
    for (const from of PIECE_STAGES)
      for (const to of PIECE_STAGES)
        for (const role of ROLES) expect(canMovePiece(from, to, role, { commissionState }).ok).toBe(false);
  });

  test("the reason names the commission's state", () => {
    expect(canMovePiece("queued", "knitting", "owner", { commissionState: "proof_sent" })).toMatchObject({
      code: "not_in_production",
      reason: 'Pieces move between stages only while the commission is in production; it is "Proof sent".',
    });
  });
});

describe("commissionReadyWhen", () => {
  test.each([
    [[], { ready: false, notDone: 0, total: 0 }],
    [["done"], { ready: true, notDone: 0, total: 1 }],
    [["done", "done", "done"], { ready: true, notDone: 0, total: 3 }],
    [["done", "finishing"], { ready: false, notDone: 1, total: 2 }],
    [["queued", "knitting", "embroidery"], { ready: false, notDone: 3, total: 3 }],
  ] as [PieceStage[], ReturnType<typeof commissionReadyWhen>][])("%j → %j", (stages, expected) => {
    expect(commissionReadyWhen(stages.map((stage) => ({ stage })))).toEqual(expected);
  });

  test("property: ready exactly when non-empty and all done", () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...PIECE_STAGES), { maxLength: 8 }), (stages) => {
        const r = commissionReadyWhen(stages.map((stage) => ({ stage })));
        expect(r.ready).toBe(stages.length > 0 && stages.every((s) => s === "done"));
        expect(r.notDone + stages.filter((s) => s === "done").length).toBe(stages.length);
      }),
    );
  });

  test("property: a piece walked by allowed moves only ever reaches declared stages and never re-enters the queue", () => {
    fc.assert(
      fc.property(fc.array(fc.nat({ max: 5 }), { maxLength: 30 }), (choices) => {
        let stage: PieceStage = "queued";
        let started = false;
        for (const c of choices) {
          const next = pieceMovesFrom(stage, "assistant", { commissionState: "in_production" });
          if (next.length === 0) break;
          stage = next[c % next.length];
          expect(PIECE_STAGES).toContain(stage);
          if (started) expect(stage).not.toBe("queued");
          started = true;
        }
      }),
    );
  });
});
