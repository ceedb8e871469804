// Which labour figure a quote charges: chosen in the studio's settings (P80 unless chosen), said on
// the quote's PDF in plain words, and priced with the P80 margins of an accepted calibration.
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, test } from "vitest";
import type { Quote } from "@/lib/core/pricing/build-quote";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { renderQuotePdf, saveQuoteDraft, storedInputOf } from "@/lib/server/quotes";
import { loadStudioSettings, updateStudioSettings } from "@/lib/server/settings";
import { makeWorld } from "./helpers";

const draft = () => quoteDraftSchema.parse({ pieces: [{ label: "Hat", plainStitches: 6000, strandedStitches: 4000 }], materials: [], extras: [] });

function pdfText(buf: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), "labour-level-"));
  writeFileSync(path.join(dir, "q.pdf"), buf);
  return execFileSync("pdftotext", ["-layout", path.join(dir, "q.pdf"), "-"]).toString().replace(/\s+/g, " ");
}

describe("labour level on quotes", { timeout: 60_000 }, () => {
  test("P80 by default, said on the PDF; the studio's choice of P50 and its accepted P80 margins price the next version", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    expect((await loadStudioSettings(w.studioId)).pricePolicy).toBe("p80");

    const v1 = await saveQuoteDraft(owner, w.commissionA, draft());
    const q1 = v1.result as unknown as Quote;
    expect(q1.labourPolicy).toBe("p80");
    expect(pdfText(await renderQuotePdf(v1))).toContain("Labour is priced at the time we finish four pieces in five by");

    // An accepted calibration's margin (knitting ×1.1 instead of ×1.25) lowers the P80 it charges.
    await updateStudioSettings(owner, w.studioId, { p80Factors: { knitting: 1.1 } });
    const v2 = await saveQuoteDraft(owner, w.commissionA, draft());
    const q2 = v2.result as unknown as Quote;
    expect(storedInputOf(v2).estimate.p80Minutes).toBeLessThan(storedInputOf(v1).estimate.p80Minutes);
    expect(q2.totalMinor).toBeLessThan(q1.totalMinor);

    await updateStudioSettings(owner, w.studioId, { pricePolicy: "p50" });
    const v3 = await saveQuoteDraft(owner, w.commissionA, draft());
    const q3 = v3.result as unknown as Quote;
    expect(q3.labourPolicy).toBe("p50");
    expect(q3.totalMinor).toBeLessThan(q2.totalMinor);
    expect(pdfText(await renderQuotePdf(v3))).toContain("typically takes us: about half take less and half take longer");
  });

  test("a P80 factor below 1 is refused and the settings keep their margins", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    await expect(updateStudioSettings(owner, w.studioId, { p80Factors: { knitting: 0.8 } })).rejects.toThrow();
    expect((await loadStudioSettings(w.studioId)).p80Factors).toEqual({});
  });
});
