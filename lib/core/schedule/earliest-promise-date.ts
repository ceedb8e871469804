// The earliest date a new request can be promised, fitted after everything already booked.
import { CapacityLedger } from "./capacity-ledger";
import { isoDate } from "./dates";
import { comparePieces } from "./plan-schedule";
import { placePiece } from "./place-piece";
import type { PromiseInput, PromiseResult } from "./types";
import { checkDayStart, checkDue, checkMembers, checkPieces, checkToday } from "./validate-input";

const NEW_COMMISSION = "(new request)";

export function earliestPromiseDate(input: PromiseInput): PromiseResult {
  const dayStart = checkDayStart(input.dayStartHour);
  const today = checkToday(input.today);
  const members = checkMembers(input.members, dayStart);
  checkDue(input.queue, "queue");
  const ids = new Set<string>();
  checkPieces(input.queue, members, "queue", ids);
  checkPieces(input.newPieces, members, "newPieces", ids);

  const ledger = new CapacityLedger(input.members, members.daysOff);
  // The booked queue keeps its own plan; the new request only gets what is left.
  for (const piece of [...input.queue].sort(comparePieces)) {
    placePiece(ledger, piece, today, dayStart, members.available, `queue ("${piece.id}")`);
  }
  let latest = today;
  const pieces: PromiseResult["pieces"] = input.newPieces.map((p, i) => {
    const commissionId = p.commissionId ?? NEW_COMMISSION;
    const placed = placePiece(ledger, { ...p, commissionId }, today, dayStart, members.available, `newPieces[${i}] ("${p.id}")`);
    if (placed.finish !== null && placed.finish > latest) latest = placed.finish;
    return {
      pieceId: p.id,
      commissionId,
      start: placed.start === null ? null : isoDate(placed.start),
      finish: placed.finish === null ? null : isoDate(placed.finish),
      dryUntil: placed.dryUntil === null ? null : isoDate(placed.dryUntil),
      stages: placed.stages,
    };
  });
  return { date: isoDate(latest), pieces };
}
