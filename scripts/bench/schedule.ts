// Schedule benchmark: `npm run bench:schedule`. Plans studios of 1–4 members and 10–120 queued
// pieces (every member eligible for every stage, the widest choice of members a piece can have) and
// prints one JSON line per case with the median and slowest of 7 runs, in ms.
import { planSchedule, type ScheduleMember, type SchedulePiece } from "@/lib/core/schedule";

const NAMES = ["amy", "ines", "jo", "kit"];

function studio(memberCount: number, pieceCount: number): { members: ScheduleMember[]; pieces: SchedulePiece[] } {
  const members = NAMES.slice(0, memberCount).map((id, i) => ({
    id,
    weekdayMinutes: { mon: 240, tue: 240 - i * 30, wed: 180, thu: 240, fri: 120 + i * 20, sat: i % 2 ? 90 : 0, sun: 0 },
    daysOff: [],
    weeklyCapMinutes: 900,
  }));
  const ids = members.map((m) => m.id);
  const pieces = Array.from({ length: pieceCount }, (_, i) => ({
    id: `p${i}`,
    commissionId: `c${i >> 1}`,
    due: `2026-${String(3 + (i % 9)).padStart(2, "0")}-${String(1 + (i % 27)).padStart(2, "0")}`,
    dryingHours: 24,
    stages: {
      knitting: { minutes: 600 + (i % 7) * 60, memberIds: ids },
      embroidery: { minutes: 60 + (i % 5) * 30, memberIds: ids },
      blocking: { minutes: 20, memberIds: ids },
      finishing: { minutes: 45, memberIds: ids },
    },
  }));
  return { members, pieces };
}

for (const members of [1, 2, 3, 4]) {
  for (const count of [10, 40, 120]) {
    const input = { today: "2026-03-02", ...studio(members, count) };
    const times: number[] = [];
    let last = "";
    for (let r = 0; r < 7; r++) {
      const t = performance.now();
      const plan = planSchedule(input);
      times.push(performance.now() - t);
      last = plan.pieces.at(-1)?.finish ?? "";
    }
    times.sort((a, b) => a - b);
    console.log(JSON.stringify({ members, pieces: count, waysPerPiece: members ** 4, medianMs: +times[3].toFixed(1), maxMs: +times[6].toFixed(1), lastFinish: last }));
  }
}
