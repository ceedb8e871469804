// Cautions for a knitted piece, chosen by garment, the wearer's age band and the yarn's fibre.
// Every caution names its source as it applies, or says "common practice"; what could not be
// checked against a published text says so. These are the only copies of the texts: the care card,
// the sizing page and the request form all show what getCautions returns.
//
// Checked (published scope texts, December 2026): EN 14682:2014 covers cords and drawstrings on
// children's clothing up to 14 years and excludes gloves, hats, bonnets and scarves; its draft
// revision (prEN 14682:2023) asks that those be risk-assessed by the principles of its body zones;
// CEN/TR 16792:2014 gives mechanical-safety guidance for children's clothing up to 14 years, hats and
// gloves included; ASTM F1816-18 allows no hood or neck drawstrings on children's upper outerwear in
// sizes 2T–12; BS 7907:2007 is a code of practice for mechanical safety of children's clothing up to
// 14 years, with removal-force tests for attached components; 16 CFR 1501.3(d) exempts children's
// clothing from the US small-parts rule (so it is not cited here). EN 14682 splits young children
// (up to 7 years) from older children (7 to 14 years).
// From memory: the 134 cm height that goes with 7 years, and that older children may have cords in
// the hood and neck area only without free ends. Not checked: the accessory advice (mitten cords
// through sleeves, floats and loose strands in baby mittens, shedding fibres), given as common
// child-safety advice.
import { hasAnimalFibre, mayShed } from "./fibres";

export type CautionGarment = "mittens" | "hat" | "pullover";
/** baby 0–12 months; young child to 7 years (about 134 cm); older child 7–14 years; adult. */
export type AgeBand = "baby" | "young-child" | "older-child" | "adult";
/** The wearer as a commission stores it. */
export type Wearer = "adult" | "teen" | "child" | "baby";

export const AGE_BANDS: readonly AgeBand[] = ["baby", "young-child", "older-child", "adult"];

/**
 * What each stored wearer stands for, as the request form asks it. "teen" is the older-child band
 * (7–14, where the children's rules stop); older teenagers choose "adult".
 */
export const WEARER_BANDS: Readonly<Record<Wearer, { band: AgeBand; label: string }>> = {
  baby: { band: "baby", label: "A baby (under 1 year)" },
  child: { band: "young-child", label: "A young child (1 to 6 years)" },
  teen: { band: "older-child", label: "An older child (7 to 14 years)" },
  adult: { band: "adult", label: "A teenager over 14, or an adult" },
};

/** Standard size keys (lib/core/sizing) that name a child's size, by the youngest band they can fit. */
const SIZE_BANDS: Readonly<Record<string, AgeBand>> = {
  newborn: "baby",
  baby: "baby",
  toddler: "young-child",
  // Mitten "child" spans 3–14 years and hat "child" 3–10: the stricter band of the two it spans.
  child: "young-child",
  teen: "older-child",
};

/** The age band for cautions: the younger of what the wearer and a standard size say. */
export function getAgeBand(input: { wearer: Wearer | string; sizeKey?: string | null }): AgeBand {
  const fromWearer = (WEARER_BANDS as Record<string, { band: AgeBand } | undefined>)[input.wearer]?.band ?? "adult";
  const fromSize = input.sizeKey ? SIZE_BANDS[input.sizeKey] : undefined;
  if (!fromSize) return fromWearer;
  return AGE_BANDS.indexOf(fromSize) < AGE_BANDS.indexOf(fromWearer) ? fromSize : fromWearer;
}

export type CautionId =
  | "neck-cords-young"
  | "neck-cords-older"
  | "mitten-sleeve-cord"
  | "mitten-floats-baby"
  | "mitten-ends"
  | "hat-ties"
  | "hat-braids-pompoms"
  | "attachments"
  | "shedding-fibres"
  | "wool-lanolin"
  | "local-rules";

export interface Caution {
  id: CautionId;
  /** a few words */
  title: string;
  /** plain words for a parent */
  text: string;
  /** the source as it applies, or "Common practice" */
  source: string;
}

/** How mittens and hats stand with EN 14682: outside its scope, advice by its ideas. */
export const ACCESSORY_SCOPE =
  "EN 14682 does not apply to mittens and hats (its scope excludes gloves, hats, bonnets and scarves); the advice follows its body-zone ideas, as the draft of its revision asks, with CEN/TR 16792:2014 as guidance";
const CHILD_ADVICE = "Common child-safety advice (not checked against a published text)";

const NECK_YOUNG_EU = "EN 14682:2014 (children's clothing up to 14 years): no cords or drawstrings in the hood and neck area for young children, up to 7 years (about 134 cm, the height from memory)";

const TEXTS = {
  "neck-cords-young": {
    title: "No cords at the neck",
    text: "A pullover for a young child has no cord, drawstring or tie at the neck or hood, and none should be added later: a cord can catch on a slide, a cot or a fence and strangle.",
  },
  "neck-cords-older": {
    title: "No loose cord ends at the neck",
    text: "A pullover for an older child has no cord at the neck or hood with free ends, toggles or knots that could catch; we leave such cords out.",
  },
  "mitten-sleeve-cord": {
    title: "No cord through the sleeves",
    text: "Do not join the mittens with a cord run through the coat sleeves: it makes a loop behind the neck that can catch. Use short mitten clips instead, one on each cuff, with only as much strap as reaches the mitten.",
  },
  "mitten-floats-baby": {
    title: "Short floats, or a lining",
    text: "Inside a baby's mittens, long strands of yarn can wrap round a finger and cut off its blood flow. The strands inside are kept short and caught down, or the mitten is lined; look inside before each wear.",
  },
  "mitten-ends": {
    title: "Ends woven in securely",
    text: "Every yarn end is woven in and secured on the inside, so no loose strand can wrap round a finger. If one works loose, trim it rather than pull it.",
  },
  "hat-ties": {
    title: "No ties under the chin",
    text: "The hat has no ties or strings under the chin: they can catch and tighten round the neck. A snug fit, or ear flaps without ties, keeps it on.",
  },
  "hat-braids-pompoms": {
    title: "No braids or pompoms on cords",
    text: "No long braids hang from the ear flaps and no pompom dangles on a cord: they can catch or wrap round the neck. A pompom sits on the crown itself.",
  },
  attachments: {
    title: "Pompoms, buttons and beads fixed firmly",
    text: "Anything attached is sewn on to stand a hard pull. Check it before each wear and stop using the piece if something loosens: a small part that comes off can choke a young child.",
  },
  "shedding-fibres": {
    title: "Smooth yarn for a baby",
    text: "Fluffy yarns such as mohair and angora shed fibres a baby can breathe in or swallow. For a baby choose a smooth yarn; ask before a fluffy one is used.",
  },
  "wool-lanolin": {
    title: "Wool and lanolin",
    text: "Some people find wool itchy, and a few react to lanolin, the natural grease in sheep's wool. If the skin reddens or itches, stop wearing the piece next to the skin and tell the studio: other fibres are possible.",
  },
} as const satisfies Record<Exclude<CautionId, "local-rules">, { title: string; text: string }>;

const isChild = (band: AgeBand) => band !== "adult";

/**
 * The cautions for a piece, most specific first, always ending with the local-rules note.
 * fibres: the fibre texts of its yarns; an empty list is unknown and gets the fibre cautions.
 */
export function getCautions(input: { garment: CautionGarment | "mitten"; ageBand: AgeBand; fibres?: readonly string[] }): Caution[] {
  const garment: CautionGarment = input.garment === "mitten" ? "mittens" : input.garment;
  const band = input.ageBand;
  const fibres = input.fibres ?? [];
  const out: Caution[] = [];
  const add = (id: Exclude<CautionId, "local-rules">, source: string) => out.push({ id, ...TEXTS[id], source });

  if (garment === "pullover") {
    if (band === "baby") {
      add("neck-cords-young", `${NECK_YOUNG_EU}. In the US, ASTM F1816 starts at size 2T, so for baby sizes this is common practice there`);
    } else if (band === "young-child") {
      add("neck-cords-young", `${NECK_YOUNG_EU}. In the US, ASTM F1816-18: no hood or neck drawstrings on children's upper outerwear in sizes 2T–12`);
    } else if (band === "older-child") {
      add(
        "neck-cords-older",
        "EN 14682:2014, older children (7 to 14 years): no free-ended cords or drawstrings in the hood and neck area (the detail from memory). In the US, ASTM F1816-18 allows no hood or neck drawstrings at all on upper outerwear up to size 12",
      );
    }
  }
  if (garment === "mittens" && isChild(band)) {
    add("mitten-sleeve-cord", `${CHILD_ADVICE}. ${ACCESSORY_SCOPE}`);
    if (band === "baby") add("mitten-floats-baby", CHILD_ADVICE);
    add("mitten-ends", "Common practice");
  }
  if (garment === "hat" && isChild(band)) {
    add("hat-ties", `${CHILD_ADVICE}. ${ACCESSORY_SCOPE}`);
    add("hat-braids-pompoms", `${CHILD_ADVICE}. ${ACCESSORY_SCOPE}`);
  }
  if (isChild(band)) {
    add(
      "attachments",
      "BS 7907:2007, UK code of practice for the mechanical safety of children's clothing up to 14 years (security of attached components); CEN/TR 16792:2014 gives the same kind of guidance. That small parts can choke a young child is common child-safety advice",
    );
  }
  if (band === "baby" && mayShed(fibres)) add("shedding-fibres", CHILD_ADVICE);
  if (hasAnimalFibre(fibres)) add("wool-lanolin", "Common practice");

  out.push({
    id: "local-rules",
    title: "Local rules come first",
    text: isChild(band)
      ? "These notes are guidance, not a safety certificate. Follow the regulations where the piece is sold and where the child lives; they come before these notes."
      : "These notes are guidance. Follow the regulations where the piece is sold and where the wearer lives; they come before these notes.",
    source: "Common practice",
  });
  return out;
}
