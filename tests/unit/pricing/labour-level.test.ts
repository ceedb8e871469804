import { describe, expect, test } from "vitest";
import { buildQuote } from "@/lib/core/pricing/build-quote";
import { labourLevelForStudio, labourLevelNote } from "@/lib/core/pricing/labour-level";

const base = { currency: "GBP", hourlyRateMinor: 1800, labourMinutes: { knitting: { p50Minutes: 200, p80Minutes: 250 } } };

describe("labour level wording", () => {
  test("a P80 quote tells the client it is priced at the time four pieces in five are finished by", () => {
    const q = buildQuote(base);
    expect(q.labourPolicy).toBe("p80");
    expect(labourLevelNote(q)).toBe("Labour is priced at the time we finish four pieces in five by, so the price already allows for a slower knit.");
    expect(labourLevelForStudio(q.labourPolicy)).toMatch(/cautious \(P80\)/);
  });

  test("a P50 quote says half take less and half longer; a quote without labour says nothing", () => {
    expect(labourLevelNote(buildQuote({ ...base, labourPolicy: "p50" }))).toMatch(/about half take less and half take longer/);
    expect(labourLevelNote(buildQuote({ currency: "GBP", hourlyRateMinor: 1800, designFeeMinor: 5000 }))).toBeNull();
    expect(labourLevelForStudio("p50")).toMatch(/typical \(P50\)/);
  });
});
