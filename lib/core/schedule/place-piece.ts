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

/** Adds (sign 1) or takes back (sign −1) a stage's takes in the piece's pending work. */
function addPending(pending: Pending, memberId: string, takes: Take[], sign: 1 | -1 = 1): void {
  let mine = pending.get(memberId);
  if (!mine) pending.set(memberId, (mine = { day: new Map(), week: new Map() }));
  for (const t of takes) {
    mine.day.set(t.day, (mine.day.get(t.day) ?? 0) + sign * t.minutes);
    const monday = weekStart(t.day);
    mine.week.set(monday, (mine.week.get(monday) ?? 0) + sign * t.minutes);
  }
}

/** Where `minutes` of work would go for one member from `fromDay`, after `pending`, without booking it. */
function simulate(ledger: CapacityLedger, memberId: string, fromDay: number, minutes: number, today: number, pending: Pending): Take[] | null {
  const base = pending.get(memberId);
  const takes: Take[] = [];
  const weekExtra = new Map<number, number>();
  let left = minutes;
  for (let day = fromDay; left > 0; day++) {
    if (day - today > HORIZON_DAYS) return null;
    const monday = weekStart(day);
    const dayFree = ledger.dayCapacity(memberId, day) - ledger.bookedOn(memberId, day) - (base?.day.get(day) ?? 0);
    const weekFree = ledger.weekCapacity(memberId) - ledger.bookedInWeek(memberId, monday) - (base?.week.get(monday) ?? 0) - (weekExtra.get(monday) ?? 0);
    const free = Math.max(0, Math.min(dayFree, weekFree));
    if (free === 0) continue;
    const take = Math.min(free, left);
    takes.push({ day, minutes: take });
    weekExtra.set(monday, (weekExtra.get(monday) ?? 0) + take);
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

  // Depth first over the stages, the member who ends a stage soonest tried first, so the first
  // complete plan is the stage-by-stage one and later ones only replace it when they are better.
  // A branch stops once a stage ends after the best finish so far. Beyond MAX_ASSIGNMENTS ways only
  // that first plan is made.
  const wide = assignments <= MAX_ASSIGNMENTS;
  const dryDays = Math.ceil((piece.dryingHours ?? 0) / 24);
  const pending: Pending = new Map();
  const steps: Trial["steps"] = [];
  const found: { best: Trial | null; stuck: StageName | null } = { best: null, stuck: null };
  const search = (j: number, readyDay: number, lastDay: number, start: number | null, finish: number | null, dryUntil: number | null): void => {
    if (j === WORK_STAGES.length) {
      const t: Trial = { steps: steps.map((x) => ({ ...x })), start, finish, dryUntil, lastDay };
      if (!found.best || better(t, found.best)) found.best = t;
      return;
    }
    const stage = WORK_STAGES[j];
    const next = (ready: number, last: number, st: number | null, fin: number | null) => {
      if (stage === "blocking" && dryDays > 0) {
        // Drying is counted from the end of the day blocking ended, in whole days, so it is never short.
        const until = last + dryDays;
        search(j + 1, until + 1, until, st ?? today, until, until);
      } else {
        search(j + 1, ready, last, st, fin, dryUntil);
      }
    };
    const ids = candidates.get(stage);
    if (!ids) {
      next(readyDay, lastDay, start, finish);
      return;
    }
    const options = ids
      .map((memberId) => ({ memberId, takes: simulate(ledger, memberId, readyDay, piece.stages[stage]!.minutes, today, pending) }))
      .filter((o): o is { memberId: string; takes: Take[] } => o.takes !== null)
      .sort((a, b) => a.takes[a.takes.length - 1].day - b.takes[b.takes.length - 1].day || compareIds(a.memberId, b.memberId));
    if (options.length === 0) found.stuck ??= stage;
    for (const o of wide ? options : options.slice(0, 1)) {
      const first = o.takes[0].day;
      const last = o.takes[o.takes.length - 1].day;
      const bestFinish = found.best?.finish ?? null;
      if (bestFinish !== null && last > bestFinish) continue;
      addPending(pending, o.memberId, o.takes);
      steps.push({ stage, memberId: o.memberId, takes: o.takes });
      next(last + 1, last, start ?? first, last);
      steps.pop();
      addPending(pending, o.memberId, o.takes, -1);
    }
  };
  // "Yesterday" is the last day anything happened when nothing is left before drying.
  search(0, today, today - 1, null, null, null);
  const best = found.best;
  if (!best) throw unplaceable(where, found.stuck ?? [...candidates.keys()][0] ?? "knitting");

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
