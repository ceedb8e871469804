// Asking the commission state machine: may this role make this move now, and where does it lead?
import { MOVES, MOVE_LABELS, MOVE_PHRASES, TRANSITIONS, type Move, type MoveContext, type Transition } from "./moves";
import { ROLE_NAMES, isRole, type Role } from "./roles";
import { STATE_LABELS, isCommissionState, isTerminal, type CommissionState } from "./states";

/**
 * Why a move was refused: `not_from_state` and `guard` are conflicts with the commission as it is (409),
 * `forbidden` is the wrong person (403), `unknown` is a name the machine does not have (422).
 */
export type RefusalCode = "not_from_state" | "forbidden" | "guard" | "unknown";

export type MoveResult =
  | { ok: true; to: CommissionState }
  | { ok: false; code: RefusalCode; reason: string };

export interface AuditMove {
  from: CommissionState;
  to: CommissionState;
  move: Move;
  role: Role;
}

export class MoveRefusedError extends Error {
  readonly code: RefusalCode;
  constructor(code: RefusalCode, reason: string) {
    super(reason);
    this.name = "MoveRefusedError";
    this.code = code;
  }
}

export function isMove(value: unknown): value is Move {
  return typeof value === "string" && (MOVES as readonly string[]).includes(value);
}

function findTransition(state: CommissionState, move: Move): Transition | undefined {
  return TRANSITIONS.find((t) => t.move === move && t.from.includes(state));
}

function listLabels(states: readonly CommissionState[]): string {
  const quoted = states.map((s) => `"${STATE_LABELS[s]}"`);
  if (quoted.length <= 1) return quoted.join("");
  return `${quoted.slice(0, -1).join(", ")} or ${quoted[quoted.length - 1]}`;
}

function notFromStateReason(state: CommissionState, move: Move): string {
  const phrase = MOVE_PHRASES[move];
  const sources = TRANSITIONS.filter((t) => t.move === move).flatMap((t) => t.from);
  if (isTerminal(state) && state !== "declined") {
    return `This commission is ${STATE_LABELS[state].toLowerCase()}, so nothing more can be done with it.`;
  }
  if (state === "declined") {
    return `This request was declined; the studio owner can reopen it as a new request first.`;
  }
  return `Cannot ${phrase} while the commission is "${STATE_LABELS[state]}"; that is possible only when it is ${listLabels(sources)}.`;
}

function roleReason(t: Transition): string {
  if (t.roleReason) return t.roleReason;
  // The system is named by the move's own wording, so list only people here.
  const people = t.roles.filter((r) => r !== "system").map((r) => ROLE_NAMES[r]);
  const who = people.length <= 1 ? people.join("") : `${people.slice(0, -1).join(", ")} or ${people[people.length - 1]}`;
  const sentence = `Only ${who} can ${MOVE_PHRASES[t.move]}.`;
  return sentence.charAt(0).toUpperCase() + sentence.slice(1);
}

/** May `role` make `move` on a commission in `state`? `ctx` carries the facts some moves need. */
export function canMove(state: CommissionState, move: Move, role: Role, ctx: MoveContext = {}): MoveResult {
  if (!isCommissionState(state)) return { ok: false, code: "unknown", reason: `Unknown commission state "${String(state)}".` };
  if (!isMove(move)) return { ok: false, code: "unknown", reason: `Unknown move "${String(move)}".` };
  if (!isRole(role)) return { ok: false, code: "unknown", reason: `Unknown role "${String(role)}".` };
  const t = findTransition(state, move);
  if (!t) return { ok: false, code: "not_from_state", reason: notFromStateReason(state, move) };
  if (!t.roles.includes(role)) return { ok: false, code: "forbidden", reason: roleReason(t) };
  const blocked = t.guard?.(ctx) ?? null;
  if (blocked) return { ok: false, code: "guard", reason: blocked };
  // The resume guard has checked pausedFrom.
  const to = t.to === "paused_from" ? (ctx.pausedFrom as CommissionState) : t.to;
  return { ok: true, to };
}

export type AvailableMove =
  | { move: Move; label: string; ok: true; to: CommissionState }
  | { move: Move; label: string; ok: false; reason: string };

/**
 * The moves `role` has from `state`, for buttons: the ones a guard blocks come with the reason,
 * so the page can show a disabled button that says why.
 */
export function movesFrom(state: CommissionState, role: Role, ctx: MoveContext = {}): AvailableMove[] {
  const out: AvailableMove[] = [];
  for (const move of MOVES) {
    const r = canMove(state, move, role, ctx);
    if (r.ok) out.push({ move, label: MOVE_LABELS[move], ok: true, to: r.to });
    else if (r.code === "guard") out.push({ move, label: MOVE_LABELS[move], ok: false, reason: r.reason });
  }
  return out;
}

/** The audit row for a move, or a MoveRefusedError carrying the reason. */
export function applyMove(state: CommissionState, move: Move, role: Role, ctx: MoveContext = {}): AuditMove {
  const r = canMove(state, move, role, ctx);
  if (!r.ok) throw new MoveRefusedError(r.code, r.reason);
  return { from: state, to: r.to, move, role };
}
