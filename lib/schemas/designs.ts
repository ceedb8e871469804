// Designs: request bodies shared by the editor, the route handlers and the server layer.
// Charts are checked twice on purpose: loosely here (shape), strictly by the chart core
// (parseChart / parseDesign), whose messages name the row and stitch in trade numbering.
import { z } from "zod";
import { safeString } from "./common";

export const designIdSchema = z.string().uuid("Not a design id");

/** One decorated piece's chart as the editor sends it (format v1 plus lettering layers). */
export const designChartEntrySchema = z.object({
  area: safeString()
    .trim()
    .min(1, "Name the area (for example back-of-hand).")
    .max(60, "Keep the area name under 60 characters.")
    .regex(/^[a-z0-9][a-z0-9-]*$/, "Use lower-case letters, digits and dashes for the area (for example hat-band)."),
  label: safeString().trim().min(1, "Give the chart a label.").max(80, "Keep the label under 80 characters."),
  chart: z.unknown().refine((v) => v !== undefined && v !== null, "The chart is missing."),
  lettering: z.array(z.unknown()).max(20, "At most 20 lettering layers per chart.").optional(),
  options: z.record(safeString().max(60), z.unknown()).optional(),
});

export const designChartsSchema = z
  .array(designChartEntrySchema)
  .min(1, "A design needs at least one chart.")
  .max(12, "A design holds at most 12 charts.")
  .superRefine((entries, ctx) => {
    const seen = new Set<string>();
    entries.forEach((e, i) => {
      if (seen.has(e.area)) ctx.addIssue({ code: "custom", path: [i, "area"], message: `The area "${e.area}" is used twice.` });
      seen.add(e.area);
    });
  });

export const createDesignSchema = z.object({
  commissionId: z.string().uuid("Not a commission id"),
  title: safeString().trim().min(1, "Give the design a title.").max(120, "Keep the title under 120 characters."),
  charts: designChartsSchema,
});

export const saveDesignVersionSchema = z.object({
  /** the version the editor started from; null only when the design has no version yet */
  parentVersionId: z.string().uuid("Not a version id").nullable(),
  charts: designChartsSchema,
  note: safeString().trim().max(200, "Keep the note under 200 characters.").optional(),
});

export const listDesignsQuerySchema = z.object({
  commissionId: z.string().uuid("Not a commission id").optional(),
});

export type DesignChartEntryInput = z.infer<typeof designChartEntrySchema>;
export type CreateDesignInput = z.infer<typeof createDesignSchema>;
export type SaveDesignVersionInput = z.infer<typeof saveDesignVersionSchema>;
