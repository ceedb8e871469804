// Chart exchange format, version 1 (documented in FORMAT.md).
// Rows are written top row first, as a chart is read on paper; every message a person sees uses
// trade numbering: rows counted from the bottom, stitches from the right, both from 1.
import { z } from "zod";
import { MAX_HEIGHT, MAX_PALETTE, MAX_WIDTH, type Chart } from "./model";
import { fieldErrorMap, joinIssues, numberField, toFieldIssues, type FieldIssue } from "./zod-messages";

/** At most this many misplaced-key issues are listed one by one; the rest are counted. */
const MAX_CELL_ISSUES = 50;

const KEY_RE = /^[\p{L}\p{N}\p{P}\p{S}]$/u;
const HEX_RE = /^#[0-9A-Fa-f]{6}$/;

/** Letters, digits, punctuation or symbols: one code point that prints as a visible mark. */
export function isPaletteKey(key: string): boolean {
  return KEY_RE.test(key);
}

/** How a key is shown in a message: quoted if it prints, its code point if it does not. */
export function showKey(ch: string): string {
  if (isPaletteKey(ch)) return `'${ch}'`;
  const cp = ch.codePointAt(0) ?? 0;
  return `U+${cp.toString(16).toUpperCase().padStart(4, "0")}`;
}

const dimension = (field: string, max: number) =>
  numberField(field)
    .int({ error: (iss) => `${field} must be a whole number of stitches (got ${String(iss.input)})` })
    .min(1, { error: (iss) => `${field} must be at least 1 (got ${String(iss.input)})` })
    .max(max, { error: (iss) => `${field} must be at most ${max} (got ${String(iss.input)})` });

const gaugeValue = (field: string) =>
  numberField(`gauge.${field}`)
    .gt(0, { error: (iss) => `gauge.${field} must be more than 0 (got ${String(iss.input)})` });

const colourV1Schema = z.object({
  key: z.string().refine(isPaletteKey, {
    error: (iss) => `key ${JSON.stringify(iss.input)} must be a single printable character (a letter, digit, punctuation mark or symbol)`,
  }),
  name: z
    .string()
    .refine((n) => n.trim().length > 0, { error: "name must not be blank" })
    .refine((n) => n.length <= 80, { error: "name must be at most 80 characters" }),
  hex: z.string().regex(HEX_RE, { error: (iss) => `hex ${JSON.stringify(iss.input)} is not a colour of the form #RRGGBB` }),
});

export const chartV1Schema = z
  .object({
    version: z.literal(1, { error: (iss) => `version must be 1 (got ${JSON.stringify(iss.input) ?? "nothing"})` }),
    width: dimension("width", MAX_WIDTH),
    height: dimension("height", MAX_HEIGHT),
    gauge: z.object({ stitchesPer10cm: gaugeValue("stitchesPer10cm"), rowsPer10cm: gaugeValue("rowsPer10cm") }),
    palette: z
      .array(colourV1Schema)
      .min(1, { error: "palette must have at least one colour" })
      .max(MAX_PALETTE, {
        error: (iss) => `palette has ${(iss.input as unknown[]).length} colours; at most ${MAX_PALETTE} are allowed`,
      }),
    rows: z.array(z.string({ error: "each row must be a string of palette keys" })),
  })
  .superRefine((doc, ctx) => {
    const keys = new Map<string, number>();
    doc.palette.forEach((colour, i) => {
      const first = keys.get(colour.key);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["palette", i, "key"],
          message: `palette key '${colour.key}' is used twice (by '${doc.palette[first].name}' and '${colour.name}')`,
        });
      } else keys.set(colour.key, i);
    });

    if (doc.rows.length !== doc.height) {
      ctx.addIssue({
        code: "custom",
        path: ["rows"],
        message: `the chart has ${doc.rows.length} row${doc.rows.length === 1 ? "" : "s"}, expected ${doc.height} (its height)`,
      });
    }

    let cellIssues = 0;
    doc.rows.forEach((text, i) => {
      const row = doc.rows.length - i; // rows[0] is the top row
      const stitches = Array.from(text);
      if (stitches.length !== doc.width) {
        ctx.addIssue({
          code: "custom",
          path: ["rows", i],
          params: { row },
          message: `row ${row} has ${stitches.length} stitch${stitches.length === 1 ? "" : "es"}, expected ${doc.width}`,
        });
        return; // stitch numbers from the right mean nothing on a row of the wrong length
      }
      stitches.forEach((ch, x) => {
        if (keys.has(ch)) return;
        cellIssues += 1;
        if (cellIssues > MAX_CELL_ISSUES) return;
        const stitch = doc.width - x;
        ctx.addIssue({
          code: "custom",
          path: ["rows", i],
          params: { row, stitch },
          message: `row ${row}, stitch ${stitch}: key ${showKey(ch)} is not in the palette`,
        });
      });
    });
    if (cellIssues > MAX_CELL_ISSUES) {
      ctx.addIssue({
        code: "custom",
        path: ["rows"],
        message: `${cellIssues - MAX_CELL_ISSUES} more stitches use keys that are not in the palette`,
      });
    }
  });

export type ChartV1 = z.infer<typeof chartV1Schema>;

export type ChartFormatIssue = FieldIssue;

export class ChartFormatError extends Error {
  readonly issues: ChartFormatIssue[];
  constructor(issues: ChartFormatIssue[]) {
    super(`chart is not valid: ${joinIssues(issues)}`);
    this.name = "ChartFormatError";
    this.issues = issues;
  }
}

/** Validates an exchange-format document and builds the in-memory chart (hex upper-cased). */
export function parseChart(input: unknown): Chart {
  const result = chartV1Schema.safeParse(input, { error: fieldErrorMap() });
  if (!result.success) throw new ChartFormatError(toFieldIssues(result.error.issues));
  const doc = result.data;
  const index = new Map(doc.palette.map((c, i) => [c.key, i]));
  const cells = new Uint8Array(doc.width * doc.height);
  doc.rows.forEach((text, i) => {
    const y = doc.height - 1 - i;
    let x = 0;
    for (const ch of text) cells[y * doc.width + x++] = index.get(ch) ?? 0;
  });
  return {
    width: doc.width,
    height: doc.height,
    gauge: { stitchesPer10cm: doc.gauge.stitchesPer10cm, rowsPer10cm: doc.gauge.rowsPer10cm },
    palette: doc.palette.map((c) => ({ key: c.key, name: c.name, hex: c.hex.toUpperCase() })),
    cells,
  };
}

/** The exchange-format document for a chart; throws if a cell names a colour the palette lacks. */
export function serializeChart(chart: Chart): ChartV1 {
  const keys = chart.palette.map((c) => c.key);
  const rows: string[] = [];
  for (let y = chart.height - 1; y >= 0; y--) {
    let text = "";
    for (let x = 0; x < chart.width; x++) {
      const colour = chart.cells[y * chart.width + x];
      const key = keys[colour];
      if (key === undefined) {
        throw new RangeError(`row ${y + 1}, stitch ${chart.width - x}: colour ${colour} is not in the palette`);
      }
      text += key;
    }
    rows.push(text);
  }
  return {
    version: 1,
    width: chart.width,
    height: chart.height,
    gauge: { stitchesPer10cm: chart.gauge.stitchesPer10cm, rowsPer10cm: chart.gauge.rowsPer10cm },
    palette: chart.palette.map((c) => ({ key: c.key, name: c.name, hex: c.hex })),
    rows,
  };
}
