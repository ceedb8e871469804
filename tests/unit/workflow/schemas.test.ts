// The zod enums carry exactly the names the database stores.
import { expect, test } from "vitest";
import { commissionStateSchema, moveContextSchema, moveSchema, roleSchema, pieceStageSchema } from "@/lib/core/workflow";

test("state, role, move and stage names", () => {
  expect(commissionStateSchema.options).toEqual([
    "enquiry", "quoting", "quote_sent", "booked", "designing", "proof_sent", "proof_approved", "in_production",
    "ready", "balance_paid", "shipped", "delivered", "closed", "declined", "cancelled", "paused",
  ]);
  expect(roleSchema.options).toEqual(["owner", "assistant", "client", "system"]);
  expect(pieceStageSchema.options).toEqual(["queued", "knitting", "embroidery", "blocking", "finishing", "done"]);
  expect(moveSchema.safeParse("ship").success).toBe(true);
  expect(moveSchema.safeParse("teleport").success).toBe(false);
});

test("move context", () => {
  expect(moveContextSchema.parse({ depositPaid: true, pieces: [{ stage: "done" }], pausedFrom: null })).toEqual({
    depositPaid: true,
    pieces: [{ stage: "done" }],
    pausedFrom: null,
  });
  expect(moveContextSchema.safeParse({ pausedFrom: "somewhere" }).success).toBe(false);
});
