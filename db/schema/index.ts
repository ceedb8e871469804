export * from "./auth";
export * from "./studios";
export * from "./yarns";
export * from "./commissions";
