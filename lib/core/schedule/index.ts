export * from "./dates";
export * from "./types";
export { planSchedule, comparePieces } from "./plan-schedule";
export { earliestPromiseDate } from "./earliest-promise-date";
export { HORIZON_DAYS } from "./place-piece";
export { DEFAULT_DAY_START_HOUR } from "./validate-input";
export * from "./schemas";
