// Production helpers: piece layouts per garment and the rules for logged time.
export * from "./piece-layouts";
export * from "./time-entries";
export * from "./timeline";
export * from "./care";
