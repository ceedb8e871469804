// Minutes each member has booked per day and per ISO week, and what is still free.
import { weekStart, weekdayOf } from "./dates";
import type { ScheduleMember } from "./types";

export class CapacityLedger {
  private readonly members = new Map<string, ScheduleMember>();
  private readonly off = new Map<string, Set<number>>();
  private readonly usedDay = new Map<string, Map<number, number>>();
  private readonly usedWeek = new Map<string, Map<number, number>>();

  constructor(members: readonly ScheduleMember[], daysOff: Map<string, Set<number>>) {
    for (const m of members) {
      this.members.set(m.id, m);
      this.off.set(m.id, daysOff.get(m.id) ?? new Set());
      this.usedDay.set(m.id, new Map());
      this.usedWeek.set(m.id, new Map());
    }
  }

  /** The member's minutes on that day before anything is booked (0 on a day off). */
  dayCapacity(memberId: string, day: number): number {
    const m = this.members.get(memberId)!;
    return this.off.get(memberId)!.has(day) ? 0 : m.weekdayMinutes[weekdayOf(day)];
  }

  weekCapacity(memberId: string): number {
    return this.members.get(memberId)!.weeklyCapMinutes ?? Number.POSITIVE_INFINITY;
  }

  bookedOn(memberId: string, day: number): number {
    return this.usedDay.get(memberId)!.get(day) ?? 0;
  }

  bookedInWeek(memberId: string, monday: number): number {
    return this.usedWeek.get(memberId)!.get(monday) ?? 0;
  }

  /** Minutes still free that day, counting the week's cap; `extraWeek` is work planned but not yet booked. */
  freeOn(memberId: string, day: number, extraWeek = 0): number {
    const dayFree = this.dayCapacity(memberId, day) - this.bookedOn(memberId, day);
    const weekFree = this.weekCapacity(memberId) - this.bookedInWeek(memberId, weekStart(day)) - extraWeek;
    return Math.max(0, Math.min(dayFree, weekFree));
  }

  /** Books minutes and returns the minutes already booked that day before them (for indicative times). */
  book(memberId: string, day: number, minutes: number): number {
    const before = this.bookedOn(memberId, day);
    this.usedDay.get(memberId)!.set(day, before + minutes);
    const monday = weekStart(day);
    this.usedWeek.get(memberId)!.set(monday, this.bookedInWeek(memberId, monday) + minutes);
    return before;
  }
}
