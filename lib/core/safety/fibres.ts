// Reading a yarn's fibre text ("Wool (100 %, non-superwash)", "Mohair 70 % / silk 30 %") for what
// decides care and cautions. One place, so the care card and the cautions read fibres alike.

/** Animal fibres: washed as wool, and the ones that can itch. */
export const ANIMAL_FIBRE = /\b(wool|merino|alpaca|mohair|cashmere|yak|angora|camel|lambswool|shetland|llama|qiviut)\b/i;
export const PLANT_FIBRE = /\b(cotton|linen|flax|hemp|bamboo|viscose|lyocell|modal)\b/i;
export const SYNTHETIC_FIBRE = /\b(nylon|polyamide|acrylic|polyester|elastane)\b/i;
/** Fluffy, haloed fibres that shed loose hairs (common practice names these two first). */
export const SHEDDING_FIBRE = /\b(mohair|angora)\b/i;

/** True when any fibre text names an animal fibre; an empty list is unknown, treated as wool. */
export function hasAnimalFibre(fibres: readonly string[]): boolean {
  return fibres.length === 0 || fibres.some((f) => ANIMAL_FIBRE.test(f));
}

/** True when any fibre text names a shedding fibre; an empty list is unknown, treated as possible. */
export function mayShed(fibres: readonly string[]): boolean {
  return fibres.length === 0 || fibres.some((f) => SHEDDING_FIBRE.test(f));
}
