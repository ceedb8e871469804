// The moves of a commission: which exist, from where, to where and who may make each.
// README.md beside this file explains every row; keep the two in step.
import { commissionReadyWhen, type PieceStage } from "./pieces";
import type { Role } from "./roles";
import { PAUSABLE_STATES, isPausable, type CommissionState } from "./states";

export const MOVES = [
  "start_quote",
  "send_quote",
  "revise_quote",
  "accept_quote",
  "record_deposit",
  "expire_quote",
  "start_design",
  "send_proof",
  "request_changes",
  "approve_proof",
  "reopen_quote",
  "start_production",
  "mark_ready",
  "rework",
  "record_balance",
  "ship",
  "confirm_delivery",
  "close",
  "decline",
  "cancel",
  "pause",
  "resume",
  "reopen_request",
] as const;
export type Move = (typeof MOVES)[number];

/** Button wording. */
export const MOVE_LABELS: Record<Move, string> = {
  start_quote: "Start quote",
  send_quote: "Send quote",
  revise_quote: "Change the quote",
  accept_quote: "Accept quote",
  record_deposit: "Record deposit",
  expire_quote: "Expire quote",
  start_design: "Start design",
  send_proof: "Send proof",
  request_changes: "Ask for changes",
  approve_proof: "Approve proof",
  reopen_quote: "New quote version",
  start_production: "Start production",
  mark_ready: "Mark ready",
  rework: "Back to production",
  record_balance: "Record balance",
  ship: "Mark shipped",
  confirm_delivery: "Confirm delivery",
  close: "Close",
  decline: "Decline",
  cancel: "Cancel commission",
  pause: "Put on hold",
  resume: "Resume",
  reopen_request: "Reopen request",
};

/** Button wording for the client, where the studio's word would read oddly to them. */
export const CLIENT_MOVE_LABELS: Partial<Record<Move, string>> = {
  revise_quote: "Ask for a different quote",
  accept_quote: "Accept the quote",
  request_changes: "Ask for changes to the design",
  approve_proof: "Approve the design",
  confirm_delivery: "It has arrived",
  decline: "Withdraw my request",
  cancel: "Cancel my commission",
};

export function moveLabelFor(move: Move, as: "studio" | "client"): string {
  return (as === "client" ? CLIENT_MOVE_LABELS[move] : undefined) ?? MOVE_LABELS[move];
}

/** What happened, for the timeline ("Quote accepted"), rather than the button that did it. */
export const MOVE_DONE: Record<Move, string> = {
  start_quote: "Quote started",
  send_quote: "Quote sent",
  revise_quote: "Quote reopened for changes",
  accept_quote: "Quote accepted",
  record_deposit: "Deposit received: booked",
  expire_quote: "Quote expired",
  start_design: "Design started",
  send_proof: "Design proof sent",
  request_changes: "Changes asked for",
  approve_proof: "Design approved",
  reopen_quote: "New quote version started",
  start_production: "Knitting started",
  mark_ready: "Ready",
  rework: "Back in production",
  record_balance: "Balance received",
  ship: "Shipped",
  confirm_delivery: "Delivered",
  close: "Closed",
  decline: "Declined",
  cancel: "Cancelled",
  pause: "Put on hold",
  resume: "Resumed",
  reopen_request: "Request reopened",
};

/** What the move does, as it reads after "Only … can" and "Cannot …". */
export const MOVE_PHRASES: Record<Move, string> = {
  start_quote: "start a quote",
  send_quote: "send the quote",
  revise_quote: "reopen a sent quote for changes",
  accept_quote: "accept the quote",
  record_deposit: "book the commission with a deposit",
  expire_quote: "let the quote expire",
  start_design: "start the design",
  send_proof: "send a proof",
  request_changes: "ask for changes to the proof",
  approve_proof: "approve the proof",
  reopen_quote: "start a new quote version",
  start_production: "start production",
  mark_ready: "mark the commission ready",
  rework: "send the commission back to production",
  record_balance: "record the balance payment",
  ship: "mark a commission shipped",
  confirm_delivery: "confirm delivery",
  close: "close the commission",
  decline: "decline the request",
  cancel: "cancel the commission",
  pause: "put the commission on hold",
  resume: "resume the commission",
  reopen_request: "reopen a declined request",
};

/** Facts a guard may need; the database layer fills them from the commission's rows. */
export interface MoveContext {
  /** the client has accepted the current quote version */
  quoteAccepted?: boolean;
  /** a deposit has been received for this commission (any quote version); missing means no */
  depositPaid?: boolean;
  /** the commission's pieces, for mark_ready */
  pieces?: ReadonlyArray<{ stage: PieceStage }>;
  /** the state the commission was in when it was put on hold, for resume */
  pausedFrom?: CommissionState | null;
}

/** `to: "paused_from"` means: back to the state recorded when the commission was put on hold. */
export interface Transition {
  move: Move;
  from: readonly CommissionState[];
  to: CommissionState | "paused_from";
  roles: readonly Role[];
  /** refusal for a role not in `roles`, when the generic "Only … can …" would not help */
  roleReason?: string;
  /** returns a reason when the facts forbid the move, or null */
  guard?: (ctx: MoveContext) => string | null;
}

const PRE_BOOKING = ["enquiry", "quoting", "quote_sent"] as const satisfies readonly CommissionState[];

function noDepositYet(ctx: MoveContext): string | null {
  return ctx.depositPaid === true
    ? "A deposit has been paid, so this commission cannot be declined; cancel it instead (the deposit terms apply)."
    : null;
}

function depositTaken(ctx: MoveContext): string | null {
  return ctx.depositPaid === true
    ? null
    : "Nothing has been paid yet, so there is nothing to cancel; decline the request instead.";
}

function piecesDone(ctx: MoveContext): string | null {
  const check = commissionReadyWhen(ctx.pieces ?? []);
  if (check.ready) return null;
  if (check.total === 0) return "This commission has no pieces recorded yet, so it cannot be ready.";
  const noun = check.notDone === 1 ? "piece is" : "pieces are";
  return `${check.notDone} of ${check.total} ${noun} not done yet; finish them before marking the commission ready.`;
}

export const TRANSITIONS: readonly Transition[] = [
  { move: "start_quote", from: ["enquiry"], to: "quoting", roles: ["owner", "assistant"] },
  { move: "send_quote", from: ["quoting"], to: "quote_sent", roles: ["owner"] },
  { move: "revise_quote", from: ["quote_sent"], to: "quoting", roles: ["owner", "client"] },
  // Accepting does not book: it opens the deposit payment; the audit row records the acceptance.
  { move: "accept_quote", from: ["quote_sent"], to: "quote_sent", roles: ["client"] },
  {
    move: "record_deposit",
    from: ["quote_sent"],
    to: "booked",
    roles: ["system"],
    roleReason:
      "A commission is booked only when the payment provider confirms the deposit; it cannot be booked by hand.",
    guard: (ctx) =>
      ctx.quoteAccepted === true
        ? null
        : "The client has not accepted this quote yet; a deposit can book only an accepted quote.",
  },
  {
    move: "expire_quote",
    from: ["quote_sent"],
    to: "declined",
    roles: ["system"],
    roleReason: "Quotes expire on their own when their validity runs out; to end this one now, decline it.",
    guard: (ctx) =>
      ctx.depositPaid === true
        ? "A deposit has been paid, so this quote does not expire; revise it or cancel the commission."
        : null,
  },
  { move: "start_design", from: ["booked"], to: "designing", roles: ["owner", "assistant"] },
  { move: "send_proof", from: ["designing"], to: "proof_sent", roles: ["owner"] },
  { move: "request_changes", from: ["proof_sent"], to: "designing", roles: ["client", "owner"] },
  // Approval locks the design version, so it is the client's own act.
  {
    move: "approve_proof",
    from: ["proof_sent"],
    to: "proof_approved",
    roles: ["client"],
    roleReason: "Only the client can approve a proof; send it to them from the commission page.",
  },
  // A change that alters the price or an approved design needs a new quote version.
  { move: "reopen_quote", from: ["designing", "proof_sent", "proof_approved"], to: "quoting", roles: ["owner"] },
  { move: "start_production", from: ["proof_approved"], to: "in_production", roles: ["owner", "assistant"] },
  { move: "mark_ready", from: ["in_production"], to: "ready", roles: ["owner", "assistant"], guard: piecesDone },
  { move: "rework", from: ["ready"], to: "in_production", roles: ["owner"] },
  {
    move: "record_balance",
    from: ["ready"],
    to: "balance_paid",
    roles: ["system"],
    roleReason:
      "The balance is recorded only when the payment provider confirms the payment; it cannot be marked paid by hand.",
  },
  { move: "ship", from: ["balance_paid"], to: "shipped", roles: ["owner"] },
  { move: "confirm_delivery", from: ["shipped"], to: "delivered", roles: ["client", "owner", "system"] },
  { move: "close", from: ["delivered"], to: "closed", roles: ["owner", "system"] },
  { move: "decline", from: PRE_BOOKING, to: "declined", roles: ["owner", "client"], guard: noDepositYet },
  // Before booking a commission is declined, not cancelled, unless a re-quote follows a paid deposit.
  {
    move: "cancel",
    from: ["quoting", "quote_sent"],
    to: "cancelled",
    roles: ["owner", "client"],
    guard: depositTaken,
  },
  { move: "cancel", from: ["booked", "designing", "proof_sent", "proof_approved"], to: "cancelled", roles: ["owner", "client"] },
  {
    move: "cancel",
    from: ["in_production", "ready", "balance_paid"],
    to: "cancelled",
    roles: ["owner"],
    roleReason: "Production has started, so only the studio owner can cancel this commission now; please contact the studio.",
  },
  {
    move: "cancel",
    from: ["paused"],
    to: "cancelled",
    roles: ["owner"],
    roleReason: "While the commission is on hold only the studio owner can cancel it; please contact the studio.",
  },
  { move: "pause", from: PAUSABLE_STATES, to: "paused", roles: ["owner"] },
  {
    move: "resume",
    from: ["paused"],
    to: "paused_from",
    roles: ["owner"],
    guard: (ctx) =>
      ctx.pausedFrom != null && isPausable(ctx.pausedFrom)
        ? null
        : "The step this commission was at before the hold is not recorded, so it cannot be resumed; check its history.",
  },
  // The only move out of an ending state: an expired or declined request that comes back.
  { move: "reopen_request", from: ["declined"], to: "enquiry", roles: ["owner"] },
];
