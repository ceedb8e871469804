import "server-only";
// Chart sizes a commission's garment needs, from the sizing core, when the brief says enough.
import type { CommissionBrief, GarmentKind } from "@/db/schema";
import { getSizeKeys, sizeGarment } from "@/lib/core/sizing";

export interface SizeOffer {
  area: string;
  label: string;
  width: number;
  height: number;
  note: string;
}

/** Default stranded gauge for fingering-weight mittens and hats (CYC category 1 range, firm end). */
export const DEFAULT_GAUGE = { stitchesPer10cm: 32, rowsPer10cm: 36 };

export function getSizeOffers(
  garment: GarmentKind,
  brief: CommissionBrief,
  gauge = DEFAULT_GAUGE,
): { offers: SizeOffer[]; size: string | null; reason: string | null } {
  const kind = garment === "mittens" ? "mitten" : garment;
  const keys = getSizeKeys(kind);
  const words = (brief.sizeLabel ?? "").toLowerCase().split(/[^a-z0-9-]+/).filter(Boolean);
  const size = keys.find((k) => words.includes(k.toLowerCase())) ?? null;
  const measurements = brief.measurements ?? {};
  if (!size && Object.keys(measurements).length === 0) {
    return { offers: [], size: null, reason: "The brief has no size or measurements yet, so choose the chart size by hand." };
  }
  try {
    const result = sizeGarment({ garment: kind, ...(size ? { size } : {}), ...(Object.keys(measurements).length ? { measurements } : {}), gauge });
    return {
      size: result.size,
      reason: null,
      offers: result.charts
        .filter((c) => c.width <= 400 && c.height <= 400)
        .map((c) => ({
          area: c.area.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, ""),
          label: c.area.charAt(0).toUpperCase() + c.area.slice(1),
          width: c.width,
          height: c.height,
          note: c.note,
        })),
    };
  } catch (e) {
    return { offers: [], size, reason: `Sizing could not use the brief (${(e as Error).message}); choose the chart size by hand.` };
  }
}
