import type { SeedPart } from "./context";

/** Demo pieces, time entries and availability. */
export const seedProduction: SeedPart = async () => {};
