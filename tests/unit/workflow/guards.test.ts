// Moves whose outcome depends on facts beyond state and role, and the wording people see.
import { describe, expect, test } from "vitest";
import {
  MoveRefusedError,
  PAUSABLE_STATES,
  applyMove,
  canMove,
  movesFrom,
  type CommissionState,
  type Move,
  type MoveContext,
  type Role,
} from "@/lib/core/workflow";

type Row = { state: CommissionState; move: Move; role: Role; ctx: MoveContext; expected: string };

// expected: the target state, or "guard" when the facts refuse the move.
const GUARDED: Row[] = [
  // A deposit books only an accepted quote.
  { state: "quote_sent", move: "record_deposit", role: "system", ctx: { quoteAccepted: true }, expected: "booked" },
  { state: "quote_sent", move: "record_deposit", role: "system", ctx: { quoteAccepted: false }, expected: "guard" },
  { state: "quote_sent", move: "record_deposit", role: "system", ctx: {}, expected: "guard" },
  // Declined means nothing was paid; after a paid deposit a re-quote can only be cancelled.
  { state: "quoting", move: "decline", role: "owner", ctx: { depositPaid: false }, expected: "declined" },
  { state: "quoting", move: "decline", role: "owner", ctx: { depositPaid: true }, expected: "guard" },
  { state: "quote_sent", move: "decline", role: "client", ctx: { depositPaid: true }, expected: "guard" },
  { state: "quote_sent", move: "decline", role: "client", ctx: {}, expected: "declined" },
  { state: "enquiry", move: "decline", role: "client", ctx: { depositPaid: true }, expected: "guard" },
  { state: "quoting", move: "cancel", role: "owner", ctx: { depositPaid: true }, expected: "cancelled" },
  { state: "quote_sent", move: "cancel", role: "client", ctx: { depositPaid: true }, expected: "cancelled" },
  { state: "quote_sent", move: "cancel", role: "client", ctx: {}, expected: "guard" },
  { state: "quote_sent", move: "expire_quote", role: "system", ctx: { depositPaid: false }, expected: "declined" },
  { state: "quote_sent", move: "expire_quote", role: "system", ctx: { depositPaid: true }, expected: "guard" },
  // Ready only when every piece is done, and there is at least one.
  { state: "in_production", move: "mark_ready", role: "assistant", ctx: { pieces: [{ stage: "done" }] }, expected: "ready" },
  { state: "in_production", move: "mark_ready", role: "owner", ctx: { pieces: [{ stage: "done" }, { stage: "finishing" }] }, expected: "guard" },
  { state: "in_production", move: "mark_ready", role: "owner", ctx: { pieces: [] }, expected: "guard" },
  { state: "in_production", move: "mark_ready", role: "owner", ctx: {}, expected: "guard" },
  // Resume goes back to where the hold began, and needs to know where that was.
  { state: "paused", move: "resume", role: "owner", ctx: { pausedFrom: "in_production" }, expected: "in_production" },
  { state: "paused", move: "resume", role: "owner", ctx: { pausedFrom: "booked" }, expected: "booked" },
  { state: "paused", move: "resume", role: "owner", ctx: {}, expected: "guard" },
  { state: "paused", move: "resume", role: "owner", ctx: { pausedFrom: null }, expected: "guard" },
  { state: "paused", move: "resume", role: "owner", ctx: { pausedFrom: "closed" }, expected: "guard" },
  { state: "paused", move: "resume", role: "owner", ctx: { pausedFrom: "paused" }, expected: "guard" },
];

describe("guarded moves", () => {
  test.each(GUARDED)("$state · $move · $role with $ctx → $expected", ({ state, move, role, ctx, expected }) => {
    const r = canMove(state, move, role, ctx);
    if (expected === "guard") {
      expect(r).toMatchObject({ ok: false, code: "guard" });
    } else {
      expect(r).toEqual({ ok: true, to: expected });
    }
  });

  test("the role is checked before the facts: a client hears about the role, not the pieces", () => {
    const r = canMove("in_production", "mark_ready", "client", { pieces: [{ stage: "knitting" }] });
    expect(r).toMatchObject({ ok: false, code: "forbidden" });
  });
});

describe("reasons a person can act on", () => {
  test.each([
    ["balance_paid", "ship", "assistant", "Only the studio owner can mark a commission shipped."],
    ["balance_paid", "ship", "client", "Only the studio owner can mark a commission shipped."],
    ["booked", "cancel", "assistant", "Only the studio owner or the client can cancel the commission."],
    ["shipped", "confirm_delivery", "assistant", "Only the client or the studio owner can confirm delivery."],
    ["enquiry", "start_quote", "client", "Only the studio owner or a studio assistant can start a quote."],
    [
      "in_production",
      "cancel",
      "client",
      "Production has started, so only the studio owner can cancel this commission now; please contact the studio.",
    ],
    [
      "quote_sent",
      "record_deposit",
      "owner",
      "A commission is booked only when the payment provider confirms the deposit; it cannot be booked by hand.",
    ],
    ["proof_sent", "approve_proof", "owner", "Only the client can approve a proof; send it to them from the commission page."],
    [
      "quote_sent",
      "send_proof",
      "owner",
      'Cannot send a proof while the commission is "Quote sent"; that is possible only when it is "Designing".',
    ],
    [
      "enquiry",
      "pause",
      "owner",
      'Cannot put the commission on hold while the commission is "Request received"; that is possible only when it is "Booked", "Designing", "Proof sent", "Proof approved", "In production", "Ready, balance due" or "Paid in full".',
    ],
    ["closed", "reopen_request", "owner", "This commission is closed, so nothing more can be done with it."],
    ["cancelled", "resume", "owner", "This commission is cancelled, so nothing more can be done with it."],
    ["declined", "start_quote", "owner", "This request was declined; the studio owner can reopen it as a new request first."],
  ] as const)("%s · %s · %s", (state, move, role, reason) => {
    expect(canMove(state, move, role, {})).toMatchObject({ ok: false, reason });
  });

  test("mark_ready counts the pieces still to finish", () => {
    const r = canMove("in_production", "mark_ready", "owner", {
      pieces: [{ stage: "done" }, { stage: "blocking" }, { stage: "knitting" }],
    });
    expect(r).toMatchObject({
      ok: false,
      reason: "2 of 3 pieces are not done yet; finish them before marking the commission ready.",
    });
  });

  test("names that are not in the machine are refused as unknown", () => {
    expect(canMove("archived" as CommissionState, "close", "owner")).toMatchObject({ ok: false, code: "unknown" });
    expect(canMove("delivered", "archive" as Move, "owner")).toMatchObject({ ok: false, code: "unknown" });
    expect(canMove("delivered", "close", "admin" as Role)).toMatchObject({ ok: false, code: "unknown" });
  });
});

describe("movesFrom and applyMove", () => {
  test("buttons for the client on a sent quote, in the machine's order", () => {
    expect(movesFrom("quote_sent", "client", { quoteAccepted: false, depositPaid: false })).toEqual([
      { move: "revise_quote", label: "Change the quote", ok: true, to: "quoting" },
      { move: "accept_quote", label: "Accept quote", ok: true, to: "quote_sent" },
      { move: "decline", label: "Decline", ok: true, to: "declined" },
      {
        move: "cancel",
        label: "Cancel commission",
        ok: false,
        reason: "Nothing has been paid yet, so there is nothing to cancel; decline the request instead.",
      },
    ]);
  });

  test("a guard-blocked button comes with its reason; a forbidden one is left out", () => {
    const owner = movesFrom("in_production", "owner", { pieces: [{ stage: "knitting" }] });
    expect(owner.map((m) => [m.move, m.ok])).toEqual([
      ["mark_ready", false],
      ["cancel", true],
      ["pause", true],
    ]);
    expect(movesFrom("in_production", "client", {})).toEqual([]);
  });

  test("applyMove returns the audit row", () => {
    expect(applyMove("balance_paid", "ship", "owner")).toEqual({
      from: "balance_paid",
      to: "shipped",
      move: "ship",
      role: "owner",
    });
    expect(applyMove("paused", "resume", "owner", { pausedFrom: "proof_sent" })).toEqual({
      from: "paused",
      to: "proof_sent",
      move: "resume",
      role: "owner",
    });
  });

  test("applyMove throws the refusal with its code", () => {
    let caught: unknown;
    try {
      applyMove("balance_paid", "ship", "assistant");
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(MoveRefusedError);
    expect((caught as MoveRefusedError).code).toBe("forbidden");
    expect((caught as MoveRefusedError).message).toBe("Only the studio owner can mark a commission shipped.");
  });

  test("every pausable state can be paused by the owner", () => {
    for (const s of PAUSABLE_STATES) expect(canMove(s, "pause", "owner")).toEqual({ ok: true, to: "paused" });
  });
});

describe("the transition table", () => {
  test("no move is declared twice from the same state", async () => {
    const { TRANSITIONS } = await import("@/lib/core/workflow");
    const pairs = TRANSITIONS.flatMap((t) => t.from.map((f) => `${t.move}@${f}`));
    expect(new Set(pairs).size).toBe(pairs.length);
  });
});
