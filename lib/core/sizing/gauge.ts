// Gauge in any of the forms knitters write it, turned into stitches and rows per 10 cm.
// Per 4 in is converted exactly (4 in = 10.16 cm), although yarn labels often treat the two alike.
import type { Gauge } from "../chart/model";
import { SizingError } from "./sizing-error";
import { CM_PER_IN, roundTo } from "./units";

export interface GaugeInput {
  stitchesPer10cm?: number;
  rowsPer10cm?: number;
  stitchesPer4in?: number;
  rowsPer4in?: number;
  stitchesPerIn?: number;
  rowsPerIn?: number;
  /** a swatch count: `stitches` (and `rows`) over `overCm` or `overIn` */
  stitches?: number;
  rows?: number;
  overCm?: number;
  overIn?: number;
}

// Plain-knit loop geometry after Munden (J. Textile Institute, 1959) with the fully relaxed values of
// later work (e.g. Knapton et al., 1968, as quoted in textile-engineering texts): wales/cm × loop
// length ≈ 4.2, courses/cm × loop length ≈ 5.5, so rows ≈ stitches × 5.5 / 4.2 when no row gauge is
// known. (Munden's own 1959 figures: about 3.8 / 5.0 dry-relaxed, 4.1 / 5.3 wet-relaxed; from memory.)
export const ROWS_PER_STITCH_RELAXED = 5.5 / 4.2;

/** Limits: finer than lace or coarser than jumbo is a slip, not a yarn (our own bounds). */
const STITCH_LIMIT_PER_10CM = { min: 2, max: 80 };
const ROW_LIMIT_PER_10CM = { min: 2, max: 120 };

export interface ResolvedGauge {
  gauge: Gauge;
  /** the stitch gauge in the unit it was given: per 10 cm (per 10 cm, or a swatch in cm) or per 4 in
   * (per 4 in, per inch × 4, or a swatch in inches), for comparisons with tables published in both */
  given: { per: "10cm" | "4in"; stitches: number };
  rowsDerived: boolean;
  warnings: string[];
}

function positive(field: string, v: number | undefined, what: string): number | undefined {
  if (v === undefined) return undefined;
  if (!Number.isFinite(v) || v <= 0) {
    throw new SizingError(field, `must be more than 0 (${what}; got ${String(v)})`);
  }
  return v;
}

export function resolveGauge(input: GaugeInput, prefix = "gauge"): ResolvedGauge {
  const f = (k: keyof GaugeInput) => `${prefix}.${k}`;
  const forms: [string, number | undefined, number | undefined, ResolvedGauge["given"] | undefined][] = [];
  const s10 = positive(f("stitchesPer10cm"), input.stitchesPer10cm, "stitches counted over 10 cm of stockinette");
  const r10 = positive(f("rowsPer10cm"), input.rowsPer10cm, "rows counted over 10 cm of stockinette");
  const s4 = positive(f("stitchesPer4in"), input.stitchesPer4in, "stitches counted over 4 in of stockinette");
  const r4 = positive(f("rowsPer4in"), input.rowsPer4in, "rows counted over 4 in of stockinette");
  const s1 = positive(f("stitchesPerIn"), input.stitchesPerIn, "stitches in 1 in of stockinette");
  const r1 = positive(f("rowsPerIn"), input.rowsPerIn, "rows in 1 in of stockinette");
  const sw = positive(f("stitches"), input.stitches, "stitches counted across the swatch");
  const rw = positive(f("rows"), input.rows, "rows counted up the swatch");
  const overCm = positive(f("overCm"), input.overCm, "the swatch width the stitches were counted over");
  const overIn = positive(f("overIn"), input.overIn, "the swatch width the stitches were counted over");

  if (s10 !== undefined || r10 !== undefined) forms.push(["per 10 cm", s10, r10, s10 === undefined ? undefined : { per: "10cm", stitches: s10 }]);
  if (s4 !== undefined || r4 !== undefined) {
    forms.push(["per 4 in", s4 && (s4 * 10) / (4 * CM_PER_IN), r4 && (r4 * 10) / (4 * CM_PER_IN), s4 === undefined ? undefined : { per: "4in", stitches: s4 }]);
  }
  if (s1 !== undefined || r1 !== undefined) {
    forms.push(["per inch", s1 && (s1 * 10) / CM_PER_IN, r1 && (r1 * 10) / CM_PER_IN, s1 === undefined ? undefined : { per: "4in", stitches: s1 * 4 }]);
  }
  if (sw !== undefined || rw !== undefined || overCm !== undefined || overIn !== undefined) {
    if (overCm !== undefined && overIn !== undefined) throw new SizingError(f("overCm"), "give overCm or overIn, not both");
    const over = overCm ?? (overIn !== undefined ? overIn * CM_PER_IN : undefined);
    if (over === undefined) throw new SizingError(f("overCm"), "a swatch count needs the width it was counted over (overCm or overIn)");
    const given: ResolvedGauge["given"] | undefined =
      sw === undefined ? undefined : overCm !== undefined ? { per: "10cm", stitches: (sw * 10) / overCm } : { per: "4in", stitches: (sw * 4) / (overIn as number) };
    forms.push(["swatch", sw && (sw * 10) / over, rw && (rw * 10) / over, given]);
  }
  if (forms.length === 0) {
    throw new SizingError(prefix, "is missing: give stitchesPer10cm and rowsPer10cm (or per 4 in, per inch, or a swatch count)");
  }
  if (forms.length > 1) {
    throw new SizingError(prefix, `give the gauge one way only (got ${forms.map((x) => x[0]).join(" and ")})`);
  }
  const [form, stitches, rowsGiven, given] = forms[0];
  if (stitches === undefined || given === undefined) throw new SizingError(prefix, `has rows ${form} but no stitches ${form}`);

  const warnings: string[] = [];
  if (stitches < STITCH_LIMIT_PER_10CM.min || stitches > STITCH_LIMIT_PER_10CM.max) {
    throw new SizingError(
      prefix,
      `${roundTo(stitches, 0.1)} stitches per 10 cm is outside any knitting yarn (${STITCH_LIMIT_PER_10CM.min}–${STITCH_LIMIT_PER_10CM.max} per 10 cm)`,
    );
  }
  if (form === "per 10 cm" && stitches < 8) {
    warnings.push(
      `${roundTo(stitches, 0.1)} stitches per 10 cm is a jumbo yarn; if you counted per inch, ${roundTo(stitches, 0.1)} per inch = ${roundTo((stitches * 10) / CM_PER_IN, 0.1)} per 10 cm (send it as stitchesPerIn)`,
    );
  }
  let rows = rowsGiven;
  const rowsDerived = rows === undefined;
  if (rows === undefined) {
    rows = stitches * ROWS_PER_STITCH_RELAXED;
    warnings.push(
      `no row gauge given: assumed ${roundTo(rows, 0.1)} rows per 10 cm from fully relaxed stockinette proportions (Knapton et al. 1968, after Munden 1959); measure it for row counts you can trust`,
    );
  } else if (rows < ROW_LIMIT_PER_10CM.min || rows > ROW_LIMIT_PER_10CM.max) {
    throw new SizingError(
      prefix,
      `${roundTo(rows, 0.1)} rows per 10 cm is outside any knitted fabric (${ROW_LIMIT_PER_10CM.min}–${ROW_LIMIT_PER_10CM.max} per 10 cm)`,
    );
  }
  return { gauge: { stitchesPer10cm: stitches, rowsPer10cm: rows }, given, rowsDerived, warnings };
}

export function stitchesPerCm(g: Pick<Gauge, "stitchesPer10cm">): number {
  return g.stitchesPer10cm / 10;
}

export function rowsPerCm(g: Pick<Gauge, "rowsPer10cm">): number {
  return g.rowsPer10cm / 10;
}
