// Plain calendar dates as YYYY-MM-DD and whole day numbers, in integer arithmetic (no time zones, no clock).

export const WEEKDAYS = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"] as const;
export type Weekday = (typeof WEEKDAYS)[number];

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Days since 1970-01-01 for a proleptic Gregorian date (civil-from-days, integer only). */
function daysFromCivil(y: number, m: number, d: number): number {
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const mp = (m + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

function civilFromDays(n: number): [number, number, number] {
  const z = n + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const d = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const m = mp < 10 ? mp + 3 : mp - 9;
  return [yoe + era * 400 + (m <= 2 ? 1 : 0), m, d];
}

export function isIsoDate(value: unknown): value is string {
  if (typeof value !== "string") return false;
  const match = ISO_DATE.exec(value);
  if (!match) return false;
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (m < 1 || m > 12 || d < 1) return false;
  const [y2, m2, d2] = civilFromDays(daysFromCivil(y, m, d));
  return y2 === y && m2 === m && d2 === d;
}

/** Day number of an ISO date; throws on anything that is not a real YYYY-MM-DD date. */
export function dayNumber(iso: string): number {
  if (!isIsoDate(iso)) throw new RangeError(`"${iso}" is not a date in the form YYYY-MM-DD`);
  const [y, m, d] = iso.split("-").map(Number);
  return daysFromCivil(y, m, d);
}

export function isoDate(day: number): string {
  const [y, m, d] = civilFromDays(day);
  return `${String(y).padStart(4, "0")}-${String(m).padStart(2, "0")}-${String(d).padStart(2, "0")}`;
}

export function addDays(iso: string, days: number): string {
  return isoDate(dayNumber(iso) + days);
}

/** b − a in days. */
export function daysBetween(a: string, b: string): number {
  return dayNumber(b) - dayNumber(a);
}

/** Monday = 0 … Sunday = 6. Day 0 (1970-01-01) was a Thursday. */
export function weekdayIndex(day: number): number {
  return (((day + 3) % 7) + 7) % 7;
}

export function weekdayOf(day: number): Weekday {
  return WEEKDAYS[weekdayIndex(day)];
}

/** Day number of the Monday that starts the ISO week containing `day`. */
export function weekStart(day: number): number {
  return day - weekdayIndex(day);
}
