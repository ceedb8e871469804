// Display helpers shared by pages (money in integer minor units; dates as YYYY-MM-DD).
import { formatMoney } from "@/lib/core/pricing/format-money";

export function formatMinor(minor: number | null | undefined, currency: string, locale = "en-GB"): string {
  return minor === null || minor === undefined ? "—" : formatMoney(minor, currency, locale);
}

export function formatDay(iso: string | null | undefined, locale = "en-GB"): string {
  if (!iso) return "—";
  const d = new Date(`${iso.slice(0, 10)}T12:00:00Z`);
  return new Intl.DateTimeFormat(locale, { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" }).format(d);
}

export const GARMENT_LABELS: Record<string, string> = { mittens: "Mittens", hat: "Hat", pullover: "Pullover" };
// The age bands the cautions go by (lib/core/safety WEARER_BANDS), in short.
export const WEARER_LABELS: Record<string, string> = { adult: "Adult", teen: "Older child (7–14)", child: "Young child (1–6)", baby: "Baby (under 1)" };
