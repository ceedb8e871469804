import { describe, expect, it } from "vitest";
import { piecePath } from "@/lib/core/workflow/pieces";

const ctx = { commissionState: "in_production" as const };

describe("piecePath", () => {
  it("passes every stage between, in order, going forward", () => {
    expect(piecePath("queued", "done", "owner", ctx)).toEqual({ ok: true, steps: ["knitting", "embroidery", "blocking", "finishing", "done"] });
    expect(piecePath("blocking", "finishing", "assistant", ctx)).toEqual({ ok: true, steps: ["finishing"] });
  });
  it("goes back only the one rework step the rules allow", () => {
    expect(piecePath("finishing", "blocking", "owner", ctx)).toEqual({ ok: true, steps: ["blocking"] });
    const r = piecePath("finishing", "knitting", "owner", ctx);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/back only one stage/);
  });
  it("refuses with the core's reason for a client, a paused commission or the same stage", () => {
    expect(piecePath("queued", "done", "client", ctx)).toMatchObject({ ok: false, code: "forbidden" });
    expect(piecePath("queued", "done", "owner", { commissionState: "paused" })).toMatchObject({ ok: false, code: "not_in_production" });
    expect(piecePath("done", "done", "owner", ctx)).toMatchObject({ ok: false, code: "same_stage" });
  });
});
