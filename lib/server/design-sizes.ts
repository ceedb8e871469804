import "server-only";
// Chart sizes a commission's garment needs, from the sizing core, when the brief says enough.
import type { CommissionBrief, GarmentKind } from "@/db/schema";
import { getSizeKeys, sizeGarment, type SizingResult } from "@/lib/core/sizing";
import { DEFAULT_SIZING_GAUGE, sizeKeyFromLabel } from "@/lib/schemas/sizing";

export interface SizeOffer {
  area: string;
  label: string;
  width: number;
  height: number;
  note: string;
}

/** The sizing core's answer for a commission's brief at a gauge, or why it has none. */
export function sizeFromBrief(
  garment: GarmentKind,
  brief: CommissionBrief,
  gauge: { stitchesPer10cm: number; rowsPer10cm: number } = DEFAULT_SIZING_GAUGE,
): { result: SizingResult | null; size: string | null; reason: string | null } {
  const kind = garment === "mittens" ? "mitten" : garment;
  const keys = getSizeKeys(kind);
  const size = sizeKeyFromLabel(brief.sizeLabel, keys) || null;
  const measurements = brief.measurements ?? {};
  if (!size && Object.keys(measurements).length === 0) {
    return { result: null, size: null, reason: "The brief has no size or measurements yet" };
  }
  try {
    const result = sizeGarment({ garment: kind, ...(size ? { size } : {}), ...(Object.keys(measurements).length ? { measurements } : {}), gauge });
    return { result, size: result.size, reason: null };
  } catch (e) {
    return { result: null, size, reason: `Sizing could not use the brief (${(e as Error).message})` };
  }
}

/** A chart area's slug, as design chart entries name their area ("back of hand" → "back-of-hand"). */
export function areaSlug(area: string): string {
  return area.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "");
}

/** Chart sizes a sizing result offers a new design (areas a chart can hold). */
export function offersFrom(result: SizingResult): SizeOffer[] {
  return result.charts
    .filter((c) => c.width <= 400 && c.height <= 400)
    .map((c) => ({
      area: areaSlug(c.area),
      label: c.area.charAt(0).toUpperCase() + c.area.slice(1),
      width: c.width,
      height: c.height,
      note: c.note,
    }));
}
