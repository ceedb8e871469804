import type { SeedPart } from "./context";

/** Demo payments and invoices. */
export const seedPayments: SeedPart = async () => {};
