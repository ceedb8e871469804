import type { SeedPart } from "./context";

/** Demo quote versions. */
export const seedQuotes: SeedPart = async () => {};
