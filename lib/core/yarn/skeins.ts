// Skeins for a length of yarn, from the studio's yarn record, with a note on dye lots.

/** Metres in one yard: exact by the international yard (0.9144 m). */
export const METRES_PER_YARD = 0.9144;

export interface YarnRecord {
  key: string;
  name: string;
  metresPerSkein: number;
  gramsPerSkein: number;
  /** skeins in stock, taken to be one dye lot */
  stockSkeins?: number;
  /** skeins in stock by dye lot, when the studio records lots */
  lots?: { lot: string; skeins: number }[];
}

export interface SkeinNeed {
  yarn: string;
  skeins: number;
  grams: number;
  /** null when stock covers the need from one dye lot, or stock is not recorded */
  note: string | null;
  secondDyeLot: boolean;
  shortBy: number;
}

// Binary fractions: 200.00000001 skeins' worth is still 200 skeins' worth of yarn.
const EPS = 1e-9;
const skeinWord = (n: number) => `${n} skein${n === 1 ? "" : "s"}`;

/** Skeins and grams for `cm` of yarn (both rounded up), and whether one dye lot in stock covers it. */
export function getSkeinNeed(cm: number, yarn: YarnRecord): SkeinNeed {
  const skeinCm = yarn.metresPerSkein * 100;
  const exact = cm / skeinCm;
  const skeins = Math.max(cm > 0 ? 1 : 0, Math.ceil(exact - EPS));
  const grams = Math.max(0, Math.ceil(exact * yarn.gramsPerSkein - EPS));
  let note: string | null = null;
  let secondDyeLot = false;
  let shortBy = 0;
  const lots = yarn.lots ?? (yarn.stockSkeins !== undefined ? [{ lot: "in stock", skeins: yarn.stockSkeins }] : null);
  if (lots) {
    const total = lots.reduce((s, l) => s + l.skeins, 0);
    const largest = lots.reduce((best, l) => (l.skeins > best.skeins ? l : best), { lot: "", skeins: 0 });
    if (skeins > total) {
      shortBy = skeins - total;
      secondDyeLot = true;
      note = `needs ${skeinWord(skeins)} of ${yarn.name}; ${total} in stock: order ${shortBy} more, from the same dye lot if it can still be had, or plan for a second dye lot (alternate the lots every few rounds so the change does not show)`;
    } else if (skeins > largest.skeins) {
      secondDyeLot = true;
      note = `needs ${skeinWord(skeins)} of ${yarn.name}; the largest dye lot in stock${yarn.lots ? ` (${largest.lot})` : ""} has ${largest.skeins}: a second dye lot is needed (alternate the lots every few rounds so the change does not show)`;
    }
  }
  return { yarn: yarn.name, skeins, grams, note, secondDyeLot, shortBy };
}
