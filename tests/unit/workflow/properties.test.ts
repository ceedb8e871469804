// Property tests: random lives of a commission, with the facts a database would hold kept beside it.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import {
  COMMISSION_STATES,
  MOVES,
  PAUSABLE_STATES,
  PIECE_STAGES,
  ROLES,
  TERMINAL_STATES,
  applyMove,
  canMove,
  movesFrom,
  type CommissionState,
  type Move,
  type MoveContext,
  type PieceStage,
  type Role,
} from "@/lib/core/workflow";

interface World {
  state: CommissionState;
  ctx: MoveContext;
  history: Move[];
}

// The facts change as a database layer would change them after each move.
function afterMove(w: World, move: Move, to: CommissionState, pieceStages: PieceStage[]): World {
  const ctx: MoveContext = { ...w.ctx };
  if (move === "accept_quote") ctx.quoteAccepted = true;
  if (move === "send_quote" || move === "revise_quote" || move === "reopen_quote") ctx.quoteAccepted = false;
  if (move === "record_deposit") ctx.depositPaid = true;
  if (move === "pause") ctx.pausedFrom = w.state;
  if (move === "resume") ctx.pausedFrom = null;
  if (to === "in_production") ctx.pieces = pieceStages.map((stage) => ({ stage }));
  return { state: to, ctx, history: [...w.history, move] };
}

// Each step picks one allowed move among all roles; endings (decline, cancel, expiry) are picked rarely,
// so that walks get past the quote and reach production, shipping and closing.
const stepArb: fc.Arbitrary<Step> = fc.record({
  pick: fc.nat({ max: 1000 }),
  end: fc.integer({ min: 0, max: 15 }).map((n) => n === 0),
  pieces: fc.array(fc.constantFrom<PieceStage>(...PIECE_STAGES, "done", "done"), { minLength: 0, maxLength: 3 }),
});

type Step = { pick: number; end: boolean; pieces: PieceStage[] };

function walk(steps: Step[], check: (before: World, move: Move, role: Role, after: World) => void) {
  let w: World = { state: "enquiry", ctx: { depositPaid: false, quoteAccepted: false }, history: [] };
  for (const s of steps) {
    const all = ROLES.flatMap((role) =>
      movesFrom(w.state, role, w.ctx).flatMap((m) => (m.ok ? [{ role, move: m.move, to: m.to }] : [])),
    );
    const endings = all.filter((o) => TERMINAL_STATES.includes(o.to as (typeof TERMINAL_STATES)[number]));
    const others = all.filter((o) => !endings.includes(o));
    const options = s.end || others.length === 0 ? all : others;
    if (options.length === 0) continue;
    const chosen = options[s.pick % options.length];
    const audit = applyMove(w.state, chosen.move, chosen.role, w.ctx);
    const next = afterMove(w, chosen.move, audit.to, s.pieces);
    check(w, chosen.move, chosen.role, next);
    w = next;
  }
  return w;
}

describe("random walks", () => {
  test("only declared states are reached, and the money facts match the ending", () => {
    fc.assert(
      fc.property(fc.array(stepArb, { maxLength: 80 }), (steps) => {
        walk(steps, (_before, _move, _role, after) => {
          expect(COMMISSION_STATES).toContain(after.state);
          // Declined means nothing was paid; cancelled means a deposit was.
          if (after.state === "declined") expect(after.ctx.depositPaid).toBe(false);
          if (after.state === "cancelled") expect(after.ctx.depositPaid).toBe(true);
          if (after.state === "booked") expect(after.history).toContain("accept_quote");
          if (after.state === "shipped") expect(after.history).toContain("record_balance");
          if (after.state === "in_production") expect(after.history).toContain("approve_proof");
        });
      }),
      { numRuns: 300 },
    );
  });

  test("resume returns to the state the hold began in", () => {
    fc.assert(
      fc.property(fc.array(stepArb, { maxLength: 80 }), (steps) => {
        let pausedFrom: CommissionState | null = null;
        walk(steps, (before, move, _role, after) => {
          if (move === "pause") pausedFrom = before.state;
          if (move === "resume") expect(after.state).toBe(pausedFrom);
        });
      }),
      { numRuns: 300 },
    );
  });

  test("the walks themselves reach every state (otherwise the properties above would prove little)", () => {
    const reached = new Set<CommissionState>();
    for (const steps of fc.sample(fc.array(stepArb, { minLength: 40, maxLength: 80 }), { numRuns: 120, seed: 7 }))
      walk(steps, (_b, _m, _r, after) => reached.add(after.state));
    expect([...reached].sort()).toEqual([...COMMISSION_STATES].sort());
  });

  test("pause then resume from any pausable state lands where it started", () => {
    fc.assert(
      fc.property(fc.constantFrom(...PAUSABLE_STATES), (s) => {
        const paused = applyMove(s, "pause", "owner");
        expect(paused.to).toBe("paused");
        expect(applyMove("paused", "resume", "owner", { pausedFrom: s }).to).toBe(s);
      }),
    );
  });

  test("every declared state can be reached from a new request", () => {
    const ctxs: MoveContext[] = [
      { quoteAccepted: true, depositPaid: false, pieces: [{ stage: "done" }] },
      { quoteAccepted: true, depositPaid: true, pieces: [{ stage: "done" }] },
    ];
    const seen = new Set<CommissionState>(["enquiry"]);
    const queue: CommissionState[] = ["enquiry"];
    while (queue.length) {
      const s = queue.shift()!;
      for (const ctx of ctxs)
        for (const role of ROLES)
          for (const m of movesFrom(s, role, ctx))
            if (m.ok && !seen.has(m.to)) {
              seen.add(m.to);
              queue.push(m.to);
            }
    }
    expect([...seen].sort()).toEqual([...COMMISSION_STATES].sort());
  });
});

const ctxArb: fc.Arbitrary<MoveContext> = fc.record(
  {
    quoteAccepted: fc.boolean(),
    depositPaid: fc.boolean(),
    pieces: fc.array(fc.record({ stage: fc.constantFrom(...PIECE_STAGES) }), { maxLength: 4 }),
    pausedFrom: fc.option(fc.constantFrom(...COMMISSION_STATES), { nil: null }),
  },
  { requiredKeys: [] },
);

describe("whatever the facts", () => {
  test("terminal states have no moves, except that the owner may reopen a declined request", () => {
    fc.assert(
      fc.property(fc.constantFrom(...TERMINAL_STATES), fc.constantFrom(...ROLES), ctxArb, (state, role, ctx) => {
        const moves = movesFrom(state, role, ctx).map((m) => m.move);
        if (state === "declined" && role === "owner") expect(moves).toEqual(["reopen_request"]);
        else expect(moves).toEqual([]);
      }),
    );
  });

  test("movesFrom lists exactly the moves canMove allows or blocks by a guard", () => {
    fc.assert(
      fc.property(fc.constantFrom(...COMMISSION_STATES), fc.constantFrom(...ROLES), ctxArb, (state, role, ctx) => {
        const listed = movesFrom(state, role, ctx);
        const expected = MOVES.filter((m) => {
          const r = canMove(state, m, role, ctx);
          return r.ok || r.code === "guard";
        });
        expect(listed.map((m) => m.move)).toEqual(expected);
        for (const m of listed) {
          const r = canMove(state, m.move, role, ctx);
          expect(m.ok).toBe(r.ok);
        }
      }),
    );
  });

  test("applyMove agrees with canMove: the audit row when allowed, the same reason when not", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...COMMISSION_STATES),
        fc.constantFrom(...MOVES),
        fc.constantFrom(...ROLES),
        ctxArb,
        (state, move, role, ctx) => {
          const r = canMove(state, move, role, ctx);
          if (r.ok) {
            expect(applyMove(state, move, role, ctx)).toEqual({ from: state, to: r.to, move, role });
            expect(COMMISSION_STATES).toContain(r.to);
          } else {
            expect(() => applyMove(state, move, role, ctx)).toThrow(r.reason);
          }
        },
      ),
      { numRuns: 500 },
    );
  });

  test("the client never moves a commission into or out of production, nor ships it", () => {
    fc.assert(
      fc.property(fc.constantFrom(...COMMISSION_STATES), ctxArb, (state, ctx) => {
        for (const m of movesFrom(state, "client", ctx)) {
          if (!m.ok) continue;
          expect(["in_production", "ready", "shipped", "balance_paid", "booked"]).not.toContain(m.to);
        }
      }),
    );
  });
});
