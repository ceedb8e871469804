// letter: { "text", "font": "5x7" | "3x5", "box": { "width", "height" }, "palette"?, "gauge"? } → chart v1.
import { z } from "zod";
import { chartV1Schema, serializeChart } from "@/lib/core/chart/format";
import { FONT_IDS, letter } from "@/lib/core/chart/lettering/letter";
import type { FontId } from "@/lib/core/chart/lettering/pixel-font";
import { MAX_HEIGHT, MAX_WIDTH } from "@/lib/core/chart/model";
import { numberField, parseWithMessages } from "@/lib/core/chart/zod-messages";

const side = (field: string, max: number) =>
  numberField(`box.${field}`)
    .int({ error: `box.${field} must be a whole number of stitches` })
    .min(1, { error: `box.${field} must be at least 1` })
    .max(max, { error: `box.${field} must be at most ${max}` });

const requestSchema = z.object({
  text: z.string({ error: "text must be a string" }).min(1, { error: "text must not be empty" }).max(60, { error: "text must be at most 60 characters" }),
  font: z.enum(FONT_IDS as [FontId, ...FontId[]], { error: `font must be ${FONT_IDS.map((f) => `"${f}"`).join(" or ")}` }),
  box: z.object({ width: side("width", MAX_WIDTH), height: side("height", MAX_HEIGHT) }, { error: "box must be an object with width and height" }),
  // Colour 0 is the background and colour 1 the ink; the shapes are the chart format's own.
  palette: chartV1Schema.shape.palette.min(2, { error: "palette must have at least two colours (background, then ink)" }).optional(),
  gauge: chartV1Schema.shape.gauge.optional(),
});

export function run(input: unknown): unknown {
  const req = parseWithMessages(requestSchema, input, "letter input");
  const keys = new Set<string>();
  for (const colour of req.palette ?? []) {
    if (keys.has(colour.key)) throw new Error(`letter input: palette key '${colour.key}' is used twice`);
    keys.add(colour.key);
  }
  const palette = req.palette?.map((c) => ({ ...c, hex: c.hex.toUpperCase() }));
  return serializeChart(letter(req.text, req.font, req.box, { palette, gauge: req.gauge }));
}
