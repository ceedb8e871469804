// Every state × every move × every role, against a matrix written out by hand from the README table.
import { describe, expect, test } from "vitest";
import {
  COMMISSION_STATES,
  MOVES,
  ROLES,
  canMove,
  type CommissionState,
  type Move,
  type MoveContext,
  type Role,
} from "@/lib/core/workflow";

// Each entry is "oacs target": one column per role in the order owner, assistant, client, system.
// A letter means allowed, "-" refused for that role, "?" the role may but the guard refuses with CTX.
// A move missing from a state's row does not exist from that state.
const CTX: MoveContext = {
  quoteAccepted: true,
  depositPaid: false,
  pieces: [{ stage: "done" }, { stage: "done" }],
  pausedFrom: "designing",
};

const MATRIX: Record<CommissionState, Partial<Record<Move, string>>> = {
  enquiry: { start_quote: "oa-- quoting", decline: "o-c- declined" },
  quoting: { send_quote: "o--- quote_sent", decline: "o-c- declined", cancel: "?-?- cancelled" },
  quote_sent: {
    revise_quote: "o-c- quoting",
    accept_quote: "--c- quote_sent",
    record_deposit: "---s booked",
    expire_quote: "---s declined",
    decline: "o-c- declined",
    cancel: "?-?- cancelled",
  },
  booked: { start_design: "oa-- designing", cancel: "o-c- cancelled", pause: "o--- paused" },
  designing: {
    send_proof: "o--- proof_sent",
    reopen_quote: "o--- quoting",
    cancel: "o-c- cancelled",
    pause: "o--- paused",
  },
  proof_sent: {
    request_changes: "o-c- designing",
    approve_proof: "--c- proof_approved",
    reopen_quote: "o--- quoting",
    cancel: "o-c- cancelled",
    pause: "o--- paused",
  },
  proof_approved: {
    reopen_quote: "o--- quoting",
    start_production: "oa-- in_production",
    cancel: "o-c- cancelled",
    pause: "o--- paused",
  },
  in_production: { mark_ready: "oa-- ready", cancel: "o--- cancelled", pause: "o--- paused" },
  ready: {
    rework: "o--- in_production",
    record_balance: "---s balance_paid",
    cancel: "o--- cancelled",
    pause: "o--- paused",
  },
  balance_paid: { ship: "o--- shipped", cancel: "o--- cancelled", pause: "o--- paused" },
  shipped: { confirm_delivery: "o-cs delivered" },
  delivered: { close: "o--s closed" },
  closed: {},
  declined: { reopen_request: "o--- enquiry" },
  cancelled: {},
  paused: { resume: "o--- designing", cancel: "o--- cancelled" },
};

type Expected = { kind: "ok"; to: CommissionState } | { kind: "not_from_state" | "forbidden" | "guard" };

function expectedFor(state: CommissionState, move: Move, role: Role): Expected {
  const entry = MATRIX[state][move];
  if (!entry) return { kind: "not_from_state" };
  const [cols, to] = entry.split(" ");
  const mark = cols[ROLES.indexOf(role)];
  if (mark === "-") return { kind: "forbidden" };
  if (mark === "?") return { kind: "guard" };
  return { kind: "ok", to: to as CommissionState };
}

const CASES = COMMISSION_STATES.flatMap((state) =>
  MOVES.flatMap((move) => ROLES.map((role) => ({ state, move, role, expected: expectedFor(state, move, role) }))),
);

describe("commission moves: full matrix", () => {
  test("the matrix has a row for every state and names only declared moves and states", () => {
    expect(Object.keys(MATRIX).sort()).toEqual([...COMMISSION_STATES].sort());
    for (const row of Object.values(MATRIX)) {
      for (const [move, entry] of Object.entries(row)) {
        expect(MOVES).toContain(move);
        const [cols, to] = entry!.split(" ");
        expect(cols).toMatch(/^[o-][a-][c-][s-]$|^[o?-][a?-][c?-][s?-]$/);
        expect(COMMISSION_STATES).toContain(to);
      }
    }
  });

  test(`covers ${COMMISSION_STATES.length} states × ${MOVES.length} moves × ${ROLES.length} roles`, () => {
    expect(CASES).toHaveLength(COMMISSION_STATES.length * MOVES.length * ROLES.length);
  });

  test.each(CASES)("$state · $move · $role", ({ state, move, role, expected }) => {
    const r = canMove(state, move, role, CTX);
    if (expected.kind === "ok") {
      expect(r).toEqual({ ok: true, to: expected.to });
    } else {
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.code).toBe(expected.kind);
      expect(r.reason.length).toBeGreaterThan(20);
      expect(r.reason).not.toMatch(/undefined|null|\$\{/);
      expect(r.reason).toMatch(/[.]$/);
    }
  });
});
