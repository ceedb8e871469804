import type { SeedPart } from "./context";

/** Demo proofs, messages and uploads. */
export const seedJourney: SeedPart = async () => {};
