import { describe, expect, it } from "vitest";
import { quoteBuilderFieldName } from "@/components/quotes/quote-field-names";
import { emptyRequest, parseDraftLeniently } from "@/lib/schemas/request";

describe("parseDraftLeniently", () => {
  it("keeps each valid field and reports each invalid one by its form path", () => {
    const r = parseDraftLeniently({
      ...emptyRequest("hat"),
      sizeLabel: "Woman M",
      lettering: "A<B>",
      budget: "a lot",
      measurements: { headCircumference: "56", handLength: "9".repeat(20) },
      unknownKey: "dropped",
    });
    expect(r.data).toMatchObject({ garment: "hat", sizeLabel: "Woman M", measurements: { headCircumference: "56" } });
    expect(r.data).not.toHaveProperty("lettering");
    expect(r.data).not.toHaveProperty("budget");
    expect(r.data).not.toHaveProperty("unknownKey");
    expect(Object.keys(r.invalid).sort()).toEqual(["budget", "lettering", "measurements.handLength"]);
    expect(r.invalid.lettering?.[0]).toMatch(/Use letters, numbers/);
  });
  it("reads anything that is not an object as an empty draft", () => {
    for (const v of [null, 3, "x", [1, 2]]) expect(parseDraftLeniently(v)).toEqual({ data: {}, invalid: {} });
  });
  it("reports a refused character (NUL) on its field and keeps the rest", () => {
    const r = parseDraftLeniently({ notes: "a\u0000b", sizeLabel: "Child 6" });
    expect(r.data).toEqual({ sizeLabel: "Child 6" });
    expect(Object.keys(r.invalid)).toEqual(["notes"]);
  });
});

describe("quoteBuilderFieldName", () => {
  it.each([
    ["messageToClient", "the message to the client"],
    ["discountMinor", "the discount"],
    ["pieces.1.ends", "piece 2: ends to weave in"],
    ["pieces.0.label", "the name of piece 1"],
    ["materials.2.skeins", "the skeins of yarn 3"],
    ["extras.0.amountMinor", "the price of extra 1"],
    ["somethingElse", "a field"],
  ])("%s → %s", (path, words) => {
    expect(quoteBuilderFieldName(path)).toBe(words);
  });
});
