// Places one piece's remaining stages, in order, on the members' free minutes.
import { isoDate, weekStart } from "./dates";
import type { CapacityLedger } from "./capacity-ledger";
import { ScheduleInputError, WORK_STAGES, type ScheduleBlock, type SchedulePiece, type StagePlan } from "./types";

type StageName = (typeof WORK_STAGES)[number];

/** Work that cannot be placed within this many days of today is reported as bad input. */
export const HORIZON_DAYS = 3653;

interface Take {
  day: number;
  minutes: number;
}

export interface PlacedPiece {
  start: number | null;
  finish: number | null;
  dryUntil: number | null;
  stages: StagePlan[];
  blocks: ScheduleBlock[];
}

/** Work chosen for the piece but not yet booked, per member: minutes by day and by ISO week. */
type Pending = Map<string, { day: Map<number, number>; week: Map<number, number> }>;

function freeWith(ledger: CapacityLedger, memberId: string, day: number, pending: Pending): number {
  const mine = pending.get(memberId);
  const monday = weekStart(day);
  const dayFree = ledger.dayCapacity(memberId, day) - ledger.bookedOn(memberId, day) - (mine?.day.get(day) ?? 0);
  const weekFree = ledger.weekCapacity(memberId) - ledger.bookedInWeek(memberId, monday) - (mine?.week.get(monday) ?? 0);
  return Math.max(0, Math.min(dayFree, weekFree));
}

function addPending(pending: Pending, memberId: string, takes: Take[]): void {
  let mine = pending.get(memberId);
  if (!mine) pending.set(memberId, (mine = { day: new Map(), week: new Map() }));
  for (const t of takes) {
    mine.day.set(t.day, (mine.day.get(t.day) ?? 0) + t.minutes);
    const monday = weekStart(t.day);
    mine.week.set(monday, (mine.week.get(monday) ?? 0) + t.minutes);
  }
}

/** Where `minutes` of work would go for one member from `fromDay`, without booking it. */
function simulate(ledger: CapacityLedger, memberId: string, fromDay: number, minutes: number, today: number, pending: Pending): Take[] | null {
  const takes: Take[] = [];
  const mine: Pending = new Map(pending);
  mine.set(memberId, { day: new Map(pending.get(memberId)?.day), week: new Map(pending.get(memberId)?.week) });
  let left = minutes;
  for (let day = fromDay; left > 0; day++) {
    if (day - today > HORIZON_DAYS) return null;
    const free = freeWith(ledger, memberId, day, mine);
    if (free === 0) continue;
    const take = Math.min(free, left);
    takes.push({ day, minutes: take });
    addPending(mine, memberId, [{ day, minutes: take }]);
    left -= take;
  }
  return takes;
}

interface Trial {
  /** per stage with work, in order */
  steps: { stage: StageName; memberId: string; takes: Take[] }[];
  start: number | null;
  finish: number | null;
  dryUntil: number | null;
  lastDay: number;
}

/**
 * Works the piece through its stages with one member per stage from `pick`, on the free minutes
 * left after what the earlier stages of this piece take. Null when a stage cannot be placed.
 */
function trial(
  ledger: CapacityLedger,
  piece: Pick<SchedulePiece, "stages" | "dryingHours">,
  today: number,
  pick: (stage: StageName, readyDay: number, pending: Pending) => { memberId: string; takes: Take[] } | null,
): Trial | null {
  const pending: Pending = new Map();
  let readyDay = today;
  // The last day anything happened to the piece; "yesterday" when nothing is left before drying.
  let lastDay = today - 1;
  let start: number | null = null;
  let finish: number | null = null;
  let dryUntil: number | null = null;
  const steps: Trial["steps"] = [];
  for (const stage of WORK_STAGES) {
    const work = piece.stages[stage];
    if (work && work.minutes > 0) {
      const chosen = pick(stage, readyDay, pending);
      if (!chosen) return null;
      addPending(pending, chosen.memberId, chosen.takes);
      steps.push({ stage, ...chosen });
      const first = chosen.takes[0].day;
      const last = chosen.takes[chosen.takes.length - 1].day;
      start ??= first;
      finish = last;
      lastDay = last;
      readyDay = last + 1;
    }
    if (stage === "blocking" && (piece.dryingHours ?? 0) > 0) {
      // Drying is counted from the end of the day blocking ended, in whole days, so it is never short.
      const dryDays = Math.ceil((piece.dryingHours ?? 0) / 24);
      dryUntil = lastDay + dryDays;
      start ??= today;
      finish = dryUntil;
      lastDay = dryUntil;
      readyDay = dryUntil + 1;
    }
  }
  return { steps, start, finish, dryUntil, lastDay };
}

/** Earlier piece finish first; then earlier stage finishes in order; then lower member ids in order. */
function better(a: Trial, b: Trial): boolean {
  const fa = a.finish ?? -Infinity;
  const fb = b.finish ?? -Infinity;
  if (fa !== fb) return fa < fb;
  for (let i = 0; i < a.steps.length; i++) {
    const da = a.steps[i].takes[a.steps[i].takes.length - 1].day;
    const db = b.steps[i].takes[b.steps[i].takes.length - 1].day;
    if (da !== db) return da < db;
  }
  for (let i = 0; i < a.steps.length; i++) {
    const c = compareIds(a.steps[i].memberId, b.steps[i].memberId);
    if (c !== 0) return c < 0;
  }
  return false;
}

/** Every way of giving each stage to one of its members, up to this many; beyond it, stage by stage. */
const MAX_ASSIGNMENTS = 1024;

function clock(day: number, minuteOfDay: number): string {
  const h = Math.floor(minuteOfDay / 60);
  const m = minuteOfDay % 60;
  return `${isoDate(day)}T${String(h).padStart(2, "0")}:${String(m).padStart(2, "0")}`;
}

/**
 * Each stage goes to one member (a piece is knitted by one pair of hands, so its tension is even).
 * The members are chosen for the whole piece: of every way to give each stage to one of its
 * eligible members, the one that finishes the piece first (then its stages first, then the lower
 * ids). Choosing stage by stage can do worse: a member who ends one stage a day sooner may hold up
 * the next stage more. A stage starts no earlier than the day after the previous stage's last day;
 * drying after blocking adds whole calendar days.
 */
export function placePiece(
  ledger: CapacityLedger,
  piece: Pick<SchedulePiece, "id" | "stages" | "dryingHours"> & { commissionId: string },
  today: number,
  dayStartHour: number,
  available: Set<string>,
  where: string,
): PlacedPiece {
  const candidates = new Map<StageName, string[]>();
  let assignments = 1;
  for (const stage of WORK_STAGES) {
    const work = piece.stages[stage];
    if (!work || work.minutes <= 0) continue;
    const ids = [...new Set(work.memberIds)].filter((id) => available.has(id)).sort(compareIds);
    if (ids.length === 0) throw unplaceable(where, stage);
    candidates.set(stage, ids);
    assignments *= ids.length;
  }

  // Stage by stage: the member who would finish this stage first, the lower id on a tie.
  const greedy = (stage: StageName, readyDay: number, pending: Pending) => {
    let best: { memberId: string; takes: Take[] } | null = null;
    for (const memberId of candidates.get(stage)!) {
      const takes = simulate(ledger, memberId, readyDay, piece.stages[stage]!.minutes, today, pending);
      if (!takes) continue;
      if (!best || takes[takes.length - 1].day < best.takes[best.takes.length - 1].day) best = { memberId, takes };
    }
    return best;
  };
  let best = trial(ledger, piece, today, greedy);
  if (assignments > 1 && assignments <= MAX_ASSIGNMENTS) {
    const stages = [...candidates.keys()];
    const choice = new Array<number>(stages.length).fill(0);
    for (let n = 0; n < assignments; n++) {
      let k = n;
      for (let i = stages.length - 1; i >= 0; i--) {
        const size = candidates.get(stages[i])!.length;
        choice[i] = k % size;
        k = Math.floor(k / size);
      }
      const fixed = (stage: StageName, readyDay: number, pending: Pending) => {
        const memberId = candidates.get(stage)![choice[stages.indexOf(stage)]];
        const takes = simulate(ledger, memberId, readyDay, piece.stages[stage]!.minutes, today, pending);
        return takes ? { memberId, takes } : null;
      };
      const t = trial(ledger, piece, today, fixed);
      if (t && (!best || better(t, best))) best = t;
    }
  }
  if (!best) throw unplaceable(where, [...candidates.keys()][0] ?? "knitting");

  const stages: StagePlan[] = [];
  const blocks: ScheduleBlock[] = [];
  for (const step of best.steps) {
    for (const t of step.takes) {
      const before = ledger.book(step.memberId, t.day, t.minutes);
      const from = dayStartHour * 60 + before;
      blocks.push({
        memberId: step.memberId,
        pieceId: piece.id,
        commissionId: piece.commissionId,
        stage: step.stage,
        date: isoDate(t.day),
        minutes: t.minutes,
        start: clock(t.day, from),
        end: clock(t.day, from + t.minutes),
      });
    }
    const first = step.takes[0].day;
    const last = step.takes[step.takes.length - 1].day;
    stages.push({ stage: step.stage, memberId: step.memberId, minutes: piece.stages[step.stage]!.minutes, start: isoDate(first), finish: isoDate(last) });
  }
  return { start: best.start, finish: best.finish, dryUntil: best.dryUntil, stages, blocks };
}

function unplaceable(where: string, stage: string): ScheduleInputError {
  return new ScheduleInputError(`${where}.stages.${stage}: cannot be placed within ${HORIZON_DAYS} days of today; check the members' hours and days off`);
}

/** Plain code-unit order, the same in every locale. */
export function compareIds(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
