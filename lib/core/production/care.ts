// What the care card says for a finished piece: washing and drying by fibre, re-blocking, and the
// cautions for its garment, wearer and fibre (from lib/core/safety, each with its source). The
// washing advice is common practice for hand-knitted, wet-blocked pieces (no single standard).
import { ANIMAL_FIBRE as ANIMAL, PLANT_FIBRE as PLANT, SYNTHETIC_FIBRE as SYNTHETIC } from "../safety/fibres";
import { getAgeBand, getCautions, type AgeBand, type Caution, type CautionGarment, type Wearer } from "../safety/cautions";

export type FibreFamily = "wool" | "superwash_wool" | "plant" | "synthetic_blend";
export type { Wearer };

export interface CareSection {
  heading: string;
  lines: string[];
}

export interface CareCard {
  fibreFamily: FibreFamily;
  sections: CareSection[];
  ageBand: AgeBand;
  /** what applies to this garment, wearer and fibre; always ends with the local-rules note */
  cautions: Caution[];
}

/** The fibre family that decides the washing advice, from a yarn's fibre text ("Wool (100 %, non-superwash)"). */
export function getFibreFamily(fibre: string): FibreFamily {
  const f = fibre.toLowerCase();
  if (ANIMAL.test(f)) {
    if (/superwash/.test(f) && !/non[- ]?superwash/.test(f)) return "superwash_wool";
    return "wool";
  }
  if (PLANT.test(f)) return "plant";
  if (SYNTHETIC.test(f)) return "synthetic_blend";
  // When in doubt, the gentlest advice.
  return "wool";
}

const WASH: Record<FibreFamily, string[]> = {
  wool: [
    "Hand wash only, in cool water (30 °C at most) with a little wool wash.",
    "Do not rub, twist or agitate the piece: wool felts with heat and movement. Let it soak, then squeeze gently.",
    "Do not wring. Roll it in a towel to press the water out.",
    "Dry flat, away from radiators and direct sun. Never tumble dry.",
  ],
  superwash_wool: [
    "Hand washing in cool water (30 °C at most) keeps it best; a machine wool cycle at 30 °C is tolerated.",
    "Use a wool wash and no fabric conditioner; do not wring.",
    "Roll in a towel to press the water out, then dry flat away from direct heat. Never tumble dry.",
  ],
  plant: [
    "Hand wash in cool to lukewarm water (30 °C at most) with a mild detergent.",
    "Squeeze gently; do not wring, as wet plant fibres stretch.",
    "Dry flat, shaped to size, away from direct heat.",
  ],
  synthetic_blend: [
    "Hand wash in cool water (30 °C at most) with a mild detergent; no agitation.",
    "Roll in a towel to press the water out; do not wring.",
    "Dry flat, away from direct heat. Never tumble dry.",
  ],
};

const REBLOCK: string[] = [
  "To refresh the shape (re-block): soak the piece in cool water with a little wool wash for 15–30 minutes.",
  "Press the water out in a towel, lay the piece flat and ease it to its measurements; pin the edges if they curl.",
  "Leave it flat until fully dry, a day or two; turn it over halfway through.",
];

/**
 * The care card of a piece: washing by its most delicate fibre, re-blocking, and the cautions for
 * its garment, wearer and fibre (lib/core/safety, the one copy of those texts).
 */
export function getCareCard(input: { fibres: string[]; wearer: Wearer | string; garment: CautionGarment; sizeKey?: string | null }): CareCard {
  const families = input.fibres.length ? input.fibres.map(getFibreFamily) : (["wool"] as FibreFamily[]);
  // The most delicate fibre in the piece decides.
  const order: FibreFamily[] = ["wool", "superwash_wool", "synthetic_blend", "plant"];
  const fibreFamily = order.find((f) => families.includes(f)) ?? "wool";
  const sections: CareSection[] = [
    { heading: "Washing and drying", lines: WASH[fibreFamily] },
    { heading: "Re-blocking", lines: REBLOCK },
  ];
  const ageBand = getAgeBand({ wearer: input.wearer, sizeKey: input.sizeKey });
  return { fibreFamily, sections, ageBand, cautions: getCautions({ garment: input.garment, ageBand, fibres: input.fibres }) };
}
