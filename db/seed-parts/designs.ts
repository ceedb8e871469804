import type { SeedPart } from "./context";

/** Demo designs and design versions. */
export const seedDesigns: SeedPart = async () => {};
