// What the care card says for a finished piece: washing and drying by fibre, re-blocking, and for
// children's pieces the safety cautions. Sources for the cautions are named in the text itself;
// the washing advice is common practice for hand-knitted, wet-blocked pieces (no single standard).

export type FibreFamily = "wool" | "superwash_wool" | "plant" | "synthetic_blend";
export type Wearer = "adult" | "teen" | "child" | "baby";

export interface CareSection {
  heading: string;
  lines: string[];
}

export interface CareCard {
  fibreFamily: FibreFamily;
  sections: CareSection[];
}

const ANIMAL = /\b(wool|merino|alpaca|mohair|cashmere|yak|angora|camel|lambswool|shetland|llama|qiviut)\b/i;
const PLANT = /\b(cotton|linen|flax|hemp|bamboo|viscose|lyocell|modal)\b/i;
const SYNTHETIC = /\b(nylon|polyamide|acrylic|polyester|elastane)\b/i;

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

export const CHILD_SAFETY: string[] = [
  "No cords, drawstrings or ties at the neck or hood: do not add any (EN 14682 forbids them on children's clothing up to 7 years; ASTM F1816 on sizes 2T–12).",
  "Nothing that can come off and be swallowed: check pompoms, buttons, beads and embroidered details before each wear, and stop using the piece if anything loosens (small parts are a choking hazard for children under 3).",
  "Do not leave a baby or small child asleep or unattended with loose knitted items such as mittens on cords or scarves.",
  "Follow the rules where you live (for example EN 14682 in Europe, ASTM F1816 and 16 CFR 1501 in the United States); they take precedence over this card.",
];

const WOOL_NOTE = "About wool: some people find wool itchy or react to lanolin. If the wearer's skin reddens or itches, stop wearing the piece next to the skin and let us know.";

export function getCareCard(input: { fibres: string[]; wearer: Wearer }): CareCard {
  const families = input.fibres.length ? input.fibres.map(getFibreFamily) : (["wool"] as FibreFamily[]);
  // The most delicate fibre in the piece decides.
  const order: FibreFamily[] = ["wool", "superwash_wool", "synthetic_blend", "plant"];
  const fibreFamily = order.find((f) => families.includes(f)) ?? "wool";
  const sections: CareSection[] = [
    { heading: "Washing and drying", lines: WASH[fibreFamily] },
    { heading: "Re-blocking", lines: REBLOCK },
  ];
  if (input.wearer === "child" || input.wearer === "baby") sections.push({ heading: "Safety for children", lines: CHILD_SAFETY });
  if (families.some((f) => f === "wool" || f === "superwash_wool")) sections.push({ heading: "Wool and skin", lines: [WOOL_NOTE] });
  return { fibreFamily, sections };
}
