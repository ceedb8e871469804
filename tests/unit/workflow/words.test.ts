// The words people read for moves: the client's buttons and the timeline's past tense.
import { describe, expect, test } from "vitest";
import { MOVES, MOVE_DONE, MOVE_LABELS, moveLabelFor } from "@/lib/core/workflow";

describe("move words", () => {
  test.each([
    ["decline", "client", "Withdraw my request"],
    ["decline", "studio", "Decline"],
    ["accept_quote", "client", "Accept the quote"],
    ["send_quote", "client", "Send quote"], // no client wording needed: never offered to a client
    ["cancel", "client", "Cancel my commission"],
  ] as const)("%s for the %s reads %s", (move, as, words) => {
    expect(moveLabelFor(move, as)).toBe(words);
  });

  test("every move has a timeline phrase, and none is a button label with an arrow", () => {
    for (const m of MOVES) {
      expect(MOVE_DONE[m]).toMatch(/^[A-Z]/);
      expect(MOVE_DONE[m]).not.toMatch(/→|_/);
    }
    // What happened reads differently from the button that does it (a past tense, not an order).
    expect(MOVES.filter((m) => MOVE_DONE[m] === MOVE_LABELS[m])).toEqual(["pause"]);
  });
});
