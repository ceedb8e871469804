// The commission states. These names are stored in the database: never rename one.
export const COMMISSION_STATES = [
  "enquiry",
  "quoting",
  "quote_sent",
  "booked",
  "designing",
  "proof_sent",
  "proof_approved",
  "in_production",
  "ready",
  "balance_paid",
  "shipped",
  "delivered",
  "closed",
  "declined",
  "cancelled",
  "paused",
] as const;
export type CommissionState = (typeof COMMISSION_STATES)[number];

/** Wording for people (studio and portal). */
export const STATE_LABELS: Record<CommissionState, string> = {
  enquiry: "Request received",
  quoting: "Preparing quote",
  quote_sent: "Quote sent",
  booked: "Booked",
  designing: "Designing",
  proof_sent: "Proof sent",
  proof_approved: "Proof approved",
  in_production: "In production",
  ready: "Ready, balance due",
  balance_paid: "Paid in full",
  shipped: "Shipped",
  delivered: "Delivered",
  closed: "Closed",
  declined: "Declined",
  cancelled: "Cancelled",
  paused: "On hold",
};

export type StateKind = "active" | "on_hold" | "terminal";

export const STATE_KINDS: Record<CommissionState, StateKind> = {
  enquiry: "active",
  quoting: "active",
  quote_sent: "active",
  booked: "active",
  designing: "active",
  proof_sent: "active",
  proof_approved: "active",
  in_production: "active",
  ready: "active",
  balance_paid: "active",
  shipped: "active",
  delivered: "active",
  closed: "terminal",
  declined: "terminal",
  cancelled: "terminal",
  paused: "on_hold",
};

export const ACTIVE_STATES = COMMISSION_STATES.filter((s) => STATE_KINDS[s] === "active");
export const TERMINAL_STATES = COMMISSION_STATES.filter((s) => STATE_KINDS[s] === "terminal");

/** States a commission can be put on hold from (and so resumed to). */
export const PAUSABLE_STATES = [
  "booked",
  "designing",
  "proof_sent",
  "proof_approved",
  "in_production",
  "ready",
  "balance_paid",
] as const satisfies readonly CommissionState[];

/** States the client sees under their own name; the others are shown as a neighbouring state. */
export const CLIENT_VISIBLE_STATES = COMMISSION_STATES.filter((s) => s !== "quoting");

/** The state the client portal shows: preparing a quote is studio work, so the client still sees their request. */
export function clientFacingState(state: CommissionState): CommissionState {
  return state === "quoting" ? "enquiry" : state;
}

export function isCommissionState(value: unknown): value is CommissionState {
  return typeof value === "string" && (COMMISSION_STATES as readonly string[]).includes(value);
}

export function isTerminal(state: CommissionState): boolean {
  return STATE_KINDS[state] === "terminal";
}

export function isPausable(state: CommissionState): boolean {
  return (PAUSABLE_STATES as readonly CommissionState[]).includes(state);
}
