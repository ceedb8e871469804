// Standard sizes a studio can pick instead of measuring. Every table carries its source so the
// interface can cite it beside the numbers. Ranges are body measurements in inches, as published;
// sizing uses the middle of a range, converted exactly (1 in = 2.54 cm).
import { CM_PER_IN, inToCm } from "./units";

export interface SizeRange {
  min: number;
  max: number;
}

export interface MittenSize {
  key: string;
  label: string;
  /** around the knuckles, thumb excluded */
  knuckleIn: SizeRange;
  /** wrist crease to tip of the middle finger */
  handLengthIn: number;
  handLengthSource: string;
}

export interface HeadSize {
  key: string;
  label: string;
  headIn: SizeRange;
}

export interface BodySize {
  key: string;
  label: string;
  chestIn: SizeRange;
  /** underarm to hem */
  bodyLengthIn: number;
  /** underarm to cuff edge */
  sleeveLengthIn: number;
  /** around the upper arm, where published */
  upperArmIn: number | null;
}

const NASA = "NASA anthropometric survey data (average adult hand length: men 7.6 in, women 6.8 in)";
const MEMORY = "(memory) typical hand length for the age group, not read from a source";

export const MITTEN_SIZES = {
  // Source: mitten sizes by knuckle circumference (thumb excluded) used by designers following the
  // Craft Yarn Council's hand tables; glove size in the Jouvin system equals that circumference in inches.
  source: "Craft Yarn Council hand measurements as used by mitten designers: knuckle circumference, thumb excluded",
  sizes: [
    { key: "baby", label: "Baby", knuckleIn: { min: 3, max: 4 }, handLengthIn: 3.5, handLengthSource: MEMORY },
    { key: "toddler", label: "Toddler", knuckleIn: { min: 4, max: 5.5 }, handLengthIn: 4.5, handLengthSource: MEMORY },
    { key: "child", label: "Child (3–14 years)", knuckleIn: { min: 5.5, max: 6 }, handLengthIn: 6, handLengthSource: MEMORY },
    { key: "woman", label: "Woman", knuckleIn: { min: 6, max: 7.5 }, handLengthIn: 6.8, handLengthSource: NASA },
    { key: "man", label: "Man", knuckleIn: { min: 7.5, max: 9 }, handLengthIn: 7.6, handLengthSource: NASA },
  ] satisfies readonly MittenSize[],
} as const;

export const HEAD_SIZES = {
  // Source: "Typical Head Sizes" table (knittingfiend hat pages, thedietdiary.com), head circumference
  // by age; the same ranges within an inch appear in several crochet and knitting size charts.
  source: "Typical Head Sizes table (knittingfiend hat pages): actual head circumference by age",
  sizes: [
    { key: "newborn", label: "Newborn", headIn: { min: 13, max: 14 } },
    { key: "baby", label: "Baby (3–6 months)", headIn: { min: 14, max: 17 } },
    { key: "toddler", label: "Toddler", headIn: { min: 18, max: 20 } },
    { key: "child", label: "Child (3–10 years)", headIn: { min: 19, max: 20.5 } },
    { key: "teen", label: "Teen", headIn: { min: 20.5, max: 22 } },
    { key: "woman", label: "Woman", headIn: { min: 21, max: 23.5 } },
    { key: "man", label: "Man", headIn: { min: 22, max: 24.5 } },
  ] satisfies readonly HeadSize[],
} as const;

export const BODY_SIZES = {
  // Chest/bust ranges: Craft Yarn Council women's and men's size charts (attribution from memory;
  // the women's ranges appear in cm in published pattern-book specifications). Body and sleeve
  // lengths and upper arms are (memory) typical values, not read from a source.
  source:
    "Craft Yarn Council women's bust and men's chest size ranges (attribution from memory); lengths and upper arm (memory)",
  sizes: [
    { key: "women-XS", label: "Women's XS", chestIn: { min: 28, max: 30 }, bodyLengthIn: 13.5, sleeveLengthIn: 16.5, upperArmIn: 9.75 },
    { key: "women-S", label: "Women's S", chestIn: { min: 32, max: 34 }, bodyLengthIn: 14, sleeveLengthIn: 17, upperArmIn: 10.25 },
    { key: "women-M", label: "Women's M", chestIn: { min: 36, max: 38 }, bodyLengthIn: 14.5, sleeveLengthIn: 17, upperArmIn: 11 },
    { key: "women-L", label: "Women's L", chestIn: { min: 40, max: 42 }, bodyLengthIn: 15, sleeveLengthIn: 17.5, upperArmIn: 12 },
    { key: "women-1X", label: "Women's 1X", chestIn: { min: 44, max: 46 }, bodyLengthIn: 15.5, sleeveLengthIn: 17.5, upperArmIn: 13.5 },
    { key: "women-2X", label: "Women's 2X", chestIn: { min: 48, max: 50 }, bodyLengthIn: 16, sleeveLengthIn: 18, upperArmIn: 15.5 },
    { key: "women-3X", label: "Women's 3X", chestIn: { min: 52, max: 54 }, bodyLengthIn: 16, sleeveLengthIn: 18, upperArmIn: 17 },
    { key: "women-4X", label: "Women's 4X", chestIn: { min: 56, max: 58 }, bodyLengthIn: 16.5, sleeveLengthIn: 18.5, upperArmIn: 18.5 },
    { key: "women-5X", label: "Women's 5X", chestIn: { min: 60, max: 62 }, bodyLengthIn: 16.5, sleeveLengthIn: 18.5, upperArmIn: 19.5 },
    { key: "men-S", label: "Men's S", chestIn: { min: 34, max: 36 }, bodyLengthIn: 16, sleeveLengthIn: 18, upperArmIn: null },
    { key: "men-M", label: "Men's M", chestIn: { min: 38, max: 40 }, bodyLengthIn: 16.5, sleeveLengthIn: 18.5, upperArmIn: null },
    { key: "men-L", label: "Men's L", chestIn: { min: 42, max: 44 }, bodyLengthIn: 17, sleeveLengthIn: 19.5, upperArmIn: null },
    { key: "men-XL", label: "Men's XL", chestIn: { min: 46, max: 48 }, bodyLengthIn: 17.5, sleeveLengthIn: 20, upperArmIn: null },
    { key: "men-2XL", label: "Men's 2XL", chestIn: { min: 50, max: 52 }, bodyLengthIn: 18, sleeveLengthIn: 20.5, upperArmIn: null },
  ] satisfies readonly BodySize[],
} as const;

export const STANDARD_SIZES = { mitten: MITTEN_SIZES, hat: HEAD_SIZES, pullover: BODY_SIZES } as const;

type GarmentKind = keyof typeof STANDARD_SIZES;

export function middleCm(range: SizeRange): number {
  return inToCm((range.min + range.max) / 2);
}

/** Standard size keys for one garment, for messages and pickers. */
export function getSizeKeys(garment: GarmentKind): string[] {
  return STANDARD_SIZES[garment].sizes.map((s) => s.key);
}

/** Body measurements (cm) a standard size stands for, under the names the measurements use. */
export function getStandardMeasurements(garment: GarmentKind, key: string): Record<string, number> | null {
  if (garment === "mitten") {
    const s = MITTEN_SIZES.sizes.find((x) => x.key === key);
    return s ? { handCircumferenceCm: middleCm(s.knuckleIn), handLengthCm: inToCm(s.handLengthIn) } : null;
  }
  if (garment === "hat") {
    const s = HEAD_SIZES.sizes.find((x) => x.key === key);
    return s ? { headCircumferenceCm: middleCm(s.headIn) } : null;
  }
  const s: BodySize | undefined = BODY_SIZES.sizes.find((x) => x.key === key);
  if (!s) return null;
  const out: Record<string, number> = {
    chestCm: middleCm(s.chestIn),
    bodyLengthCm: inToCm(s.bodyLengthIn),
    sleeveLengthCm: inToCm(s.sleeveLengthIn),
  };
  if (s.upperArmIn !== null) out.upperArmCm = inToCm(s.upperArmIn);
  return out;
}

/**
 * The head a pullover's neck must pass over when none is measured: the middle of the Typical Head
 * Sizes row for the wearer (HEAD_SIZES' source): a men's size → man (22–24.5 in), a women's size or a
 * measured adult chest → woman (21–23.5 in). For a measured chest under 71 cm (28 in, the smallest
 * adult chest in BODY_SIZES) a child's (19–20.5 in), under 56 cm (22 in) a toddler's (18–20 in):
 * those two chest bounds are ours (memory), not read from a source.
 */
export function getAssumedHead(sizeKey: string | undefined, chestCm: number): { cm: number; label: string } {
  const row = (key: string) => HEAD_SIZES.sizes.find((h) => h.key === key) as HeadSize;
  let key: string;
  if (sizeKey?.startsWith("men-")) key = "man";
  else if (sizeKey?.startsWith("women-")) key = "woman";
  else if (chestCm >= inToCm(28)) key = "woman";
  else if (chestCm >= inToCm(22)) key = "child";
  else key = "toddler";
  const h = row(key);
  return { cm: middleCm(h.headIn), label: `${h.label.toLowerCase()}'s` };
}

/**
 * A wrist for a size when none is measured, to hold the percentage method's cuff to the body at large
 * sizes: (memory) typical adult wrists, not read from a source: women's 5¾ in at a 29 in bust, men's
 * 6½ in at a 35 in chest, each ¼ in more for every 4 in of chest (a child's in proportion below the
 * smallest size). Men's sizes use the men's line; women's sizes and measured chests the women's.
 */
export function getWristEstimateCm(sizeKey: string | undefined, chestCm: number): number {
  const chestIn = chestCm / CM_PER_IN;
  const [base, at] = sizeKey?.startsWith("men-") ? [6.5, 35] : [5.75, 29];
  const wristIn = chestIn >= at ? base + (chestIn - at) / 16 : (base * chestIn) / at;
  return inToCm(wristIn);
}

/**
 * The most a yoke should rise from the underarm to the neck for a chest, to hold the percentage
 * method's depth (a share of the finished chest) to the body at large sizes: the armhole depth of the
 * Craft Yarn Council women's size chart (memory: 7–7.5 in at a 36–38 in bust, ½ in more a size, i.e.
 * 2⅝ in + bust ÷ 8) plus 1¾ in for the front neck to drop below the back (ours).
 */
export function getYokeDepthCapCm(chestCm: number): number {
  return inToCm(2.625 + chestCm / CM_PER_IN / 8 + 1.75);
}

export const HAT_HEIGHTS = {
  // Source: Craft Yarn Council head and hat-height chart, as reproduced on public pattern pages:
  // brim to crown for a hat with some slouch or a folded brim (TRADE-REFERENCES.md).
  source: "Craft Yarn Council hat heights (brim to crown, a hat with some slouch or a folded brim): child 8.5 in, teen 10, woman 11, man 11.5",
  heightsIn: { child: 8.5, teen: 10, woman: 11, man: 11.5 } as Record<string, number>,
} as const;

/**
 * The standard's hat height for a size; for a head measured (or a size the chart has no row for), read
 * between the rows at the middles of their head ranges (child 19.75 in → 8.5 in … man 23.25 in → 11.5),
 * in proportion below the child's and no taller than the man's (ours: the chart gives rows, not a curve).
 */
export function getHatHeightCm(sizeKey: string | undefined, headCm: number): number {
  const table = HAT_HEIGHTS.heightsIn;
  if (sizeKey !== undefined && table[sizeKey] !== undefined) return inToCm(table[sizeKey]);
  const points = HEAD_SIZES.sizes
    .filter((h) => table[h.key] !== undefined)
    .map((h) => ({ head: (h.headIn.min + h.headIn.max) / 2, height: table[h.key] }));
  const headIn = headCm / CM_PER_IN;
  const [lo, hi] = [points[0], points[points.length - 1]];
  if (headIn <= lo.head) return inToCm((lo.height * headIn) / lo.head);
  if (headIn >= hi.head) return inToCm(hi.height);
  const j = points.findIndex((p) => p.head >= headIn);
  const a = points[j - 1];
  const b = points[j];
  return inToCm(a.height + ((b.height - a.height) * (headIn - a.head)) / (b.head - a.head));
}
