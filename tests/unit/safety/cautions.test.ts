// The cautions by garment, age band and fibre. Scope facts checked against the published scope
// texts (see lib/core/safety/cautions.ts): EN 14682:2014 excludes gloves, hats, bonnets and scarves;
// ASTM F1816-18 covers hood and neck drawstrings in sizes 2T–12; 16 CFR 1501.3(d) exempts
// children's clothing, so it is cited nowhere; BS 7907:2007 covers attachment strength.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { ACCESSORY_SCOPE, AGE_BANDS, WEARER_BANDS, getAgeBand, getCautions, type AgeBand, type CautionGarment } from "@/lib/core/safety";

const WOOL = ["Wool (100 %, non-superwash)"];
const ids = (garment: CautionGarment, ageBand: AgeBand, fibres: string[]) => getCautions({ garment, ageBand, fibres }).map((c) => c.id);

describe("which cautions appear", () => {
  test.each([
    {
      who: "a baby's mittens in wool",
      garment: "mittens" as const,
      band: "baby" as const,
      fibres: WOOL,
      expected: ["mitten-sleeve-cord", "mitten-floats-baby", "mitten-ends", "attachments", "wool-lanolin", "local-rules"],
    },
    {
      who: "a baby's mittens in mohair",
      garment: "mittens" as const,
      band: "baby" as const,
      fibres: ["Mohair 70 %, silk 30 %"],
      expected: ["mitten-sleeve-cord", "mitten-floats-baby", "mitten-ends", "attachments", "shedding-fibres", "wool-lanolin", "local-rules"],
    },
    {
      who: "a 5-year-old's hat in wool",
      garment: "hat" as const,
      band: "young-child" as const,
      fibres: WOOL,
      expected: ["hat-ties", "hat-braids-pompoms", "attachments", "wool-lanolin", "local-rules"],
    },
    {
      who: "a 10-year-old's pullover in cotton",
      garment: "pullover" as const,
      band: "older-child" as const,
      fibres: ["Organic cotton"],
      expected: ["neck-cords-older", "attachments", "local-rules"],
    },
    {
      who: "a 4-year-old's pullover in wool",
      garment: "pullover" as const,
      band: "young-child" as const,
      fibres: WOOL,
      expected: ["neck-cords-young", "attachments", "wool-lanolin", "local-rules"],
    },
    {
      who: "an adult's mittens in wool",
      garment: "mittens" as const,
      band: "adult" as const,
      fibres: WOOL,
      expected: ["wool-lanolin", "local-rules"],
    },
    {
      who: "an adult's hat in acrylic",
      garment: "hat" as const,
      band: "adult" as const,
      fibres: ["Acrylic"],
      expected: ["local-rules"],
    },
    {
      who: "a baby's hat, fibre not known yet",
      garment: "hat" as const,
      band: "baby" as const,
      fibres: [],
      expected: ["hat-ties", "hat-braids-pompoms", "attachments", "shedding-fibres", "wool-lanolin", "local-rules"],
    },
  ])("$who", ({ garment, band, fibres, expected }) => {
    expect(ids(garment, band, fibres)).toEqual(expected);
  });

  test("the older child's pullover names EN 14682's 7–14 rule and ASTM F1816; the young child's the under-7 rule", () => {
    const older = getCautions({ garment: "pullover", ageBand: "older-child", fibres: WOOL })[0]!;
    expect(older.source).toMatch(/EN 14682:2014, older children \(7 to 14 years\): no free-ended/);
    expect(older.source).toMatch(/ASTM F1816-18/);
    const young = getCautions({ garment: "pullover", ageBand: "young-child", fibres: WOOL })[0]!;
    expect(young.source).toMatch(/up to 7 years/);
    expect(young.source).toMatch(/sizes 2T–12/);
    // ASTM F1816 starts at 2T: for a baby it is not claimed as the rule.
    const baby = getCautions({ garment: "pullover", ageBand: "baby", fibres: WOOL })[0]!;
    expect(baby.source).toMatch(/starts at size 2T, so for baby sizes this is common practice there/);
  });

  test("mittens: clips instead of a cord through the sleeves; attachments cite a code of practice", () => {
    const all = getCautions({ garment: "mittens", ageBand: "young-child", fibres: WOOL });
    expect(all.find((c) => c.id === "mitten-sleeve-cord")!.text).toMatch(/loop behind the neck.*short mitten clips/);
    expect(all.find((c) => c.id === "attachments")!.source).toMatch(/^BS 7907:2007/);
  });
});

describe("sources as they apply", () => {
  const everyCase = AGE_BANDS.flatMap((band) =>
    (["mittens", "hat", "pullover"] as const).flatMap((garment) =>
      [[], WOOL, ["Angora 50 %, wool 50 %"], ["Organic cotton"]].map((fibres) => ({ band, garment, fibres })),
    ),
  );

  test("no EN 14682 claim on hats or mittens: it appears only to say it does not apply", () => {
    for (const { band, garment, fibres } of everyCase.filter((c) => c.garment !== "pullover")) {
      for (const c of getCautions({ garment, ageBand: band, fibres })) {
        const text = `${c.title} ${c.text} ${c.source.split(ACCESSORY_SCOPE).join("")}`;
        expect(text, `${garment}/${band}/${c.id}`).not.toMatch(/14682/);
      }
    }
    expect(ACCESSORY_SCOPE).toMatch(/^EN 14682 does not apply to mittens and hats \(its scope excludes gloves, hats, bonnets and scarves\)/);
    expect(ACCESSORY_SCOPE).toMatch(/CEN\/TR 16792:2014/);
  });

  test("16 CFR 1501 is cited nowhere", () => {
    for (const { band, garment, fibres } of everyCase) {
      const text = JSON.stringify(getCautions({ garment, ageBand: band, fibres }));
      expect(text).not.toMatch(/1501/);
      expect(text).not.toMatch(/CFR/);
    }
  });

  test("every caution has a title, plain words and a source, and the list ends with the local-rules note", () => {
    for (const { band, garment, fibres } of everyCase) {
      const list = getCautions({ garment, ageBand: band, fibres });
      for (const c of list) {
        expect(c.title.length).toBeGreaterThan(0);
        expect(c.title.length).toBeLessThanOrEqual(45);
        expect(c.text.length).toBeGreaterThan(20);
        expect(c.source.length).toBeGreaterThan(0);
      }
      const last = list[list.length - 1]!;
      expect(last.id).toBe("local-rules");
      expect(last.text).toMatch(band === "adult" ? /where the piece is sold and where the wearer lives/ : /where the piece is sold and where the child lives/);
      expect(new Set(list.map((c) => c.id)).size).toBe(list.length);
    }
  });

  test("the shedding-fibre caution is for babies only, and only when the yarn may shed", () => {
    for (const { band, garment, fibres } of everyCase) {
      const has = ids(garment, band, fibres).includes("shedding-fibres");
      const mayShed = fibres.length === 0 || fibres.some((f) => /mohair|angora/i.test(f));
      expect(has).toBe(band === "baby" && mayShed);
    }
  });
});

describe("age bands", () => {
  test.each([
    { wearer: "baby", size: null, band: "baby" },
    { wearer: "child", size: null, band: "young-child" },
    { wearer: "teen", size: null, band: "older-child" },
    { wearer: "adult", size: null, band: "adult" },
    // A standard child's size only makes the band younger, never older.
    { wearer: "adult", size: "toddler", band: "young-child" },
    { wearer: "adult", size: "newborn", band: "baby" },
    { wearer: "teen", size: "child", band: "young-child" },
    { wearer: "baby", size: "teen", band: "baby" },
    { wearer: "adult", size: "women-M", band: "adult" },
    { wearer: "unknown", size: null, band: "adult" },
  ])("$wearer with size $size → $band", ({ wearer, size, band }) => {
    expect(getAgeBand({ wearer, sizeKey: size })).toBe(band);
  });

  test("every stored wearer has a band and a label saying its ages", () => {
    for (const [w, { band, label }] of Object.entries(WEARER_BANDS)) {
      expect(AGE_BANDS).toContain(band);
      expect(label, w).toMatch(/year|adult/);
    }
  });

  test("property: the band is never older than either the wearer's or the size's", () => {
    const wearers = Object.keys(WEARER_BANDS);
    const sizes = ["newborn", "baby", "toddler", "child", "teen", "woman", "man", "women-S", "men-L", ""];
    fc.assert(
      fc.property(fc.constantFrom(...wearers), fc.constantFrom(...sizes), (wearer, size) => {
        const band = getAgeBand({ wearer, sizeKey: size });
        const fromWearer = getAgeBand({ wearer });
        expect(AGE_BANDS.indexOf(band)).toBeLessThanOrEqual(AGE_BANDS.indexOf(fromWearer));
      }),
    );
  });
});
