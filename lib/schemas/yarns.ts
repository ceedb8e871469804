// Zod schemas for the studio's yarn records and dye lots, shared by the forms and the routes.
import { z } from "zod";
import { safeString } from "./common";
import { majorToMinor } from "./money";

const positiveInt = (what: string, max: number) =>
  z.coerce
    .number({ message: `Enter ${what} as a number.` })
    .int(`${what[0].toUpperCase()}${what.slice(1)} must be a whole number.`)
    .min(1, `${what[0].toUpperCase()}${what.slice(1)} must be above 0.`)
    .max(max, `That is more than ${max}; check the unit.`);

export const yarnFields = {
  name: safeString().trim().min(1, "Name the yarn.").max(80),
  colourName: safeString().trim().min(1, "Name the colour.").max(60),
  hex: safeString().trim().regex(/^#[0-9A-Fa-f]{6}$/, "A colour like #A3342A."),
  fibre: safeString().trim().min(2, "Give the fibre, e.g. “Wool (100 %)”.").max(120),
  weightCategory: z.coerce.number().int().min(0, "Category 0–7.").max(7, "Category 0–7."),
  metresPerSkein: positiveInt("metres per skein", 5000),
  gramsPerSkein: positiveInt("grams per skein", 1000),
};

/** The price is typed in the studio's currency ("8.50") and stored in minor units. */
export const priceField = (currency: string) =>
  safeString()
    .trim()
    .min(1, "Enter the price per skein.")
    .transform((v, ctx) => {
      const minor = majorToMinor(v, currency);
      if (minor === null) {
        ctx.addIssue({ code: "custom", message: "A price like 8 or 8.50." });
        return z.NEVER;
      }
      return minor;
    });

export const yarnFormSchema = z.object({ ...yarnFields, price: safeString().trim().min(1, "Enter the price per skein.") });
export type YarnFormInput = z.input<typeof yarnFormSchema>;

export const yarnBodySchema = (currency: string) => z.object({ ...yarnFields, price: priceField(currency) });

export const lotSchema = z.object({
  lotCode: safeString().trim().min(1, "Enter the dye lot code.").max(40),
  stockSkeins: z.coerce.number({ message: "Enter the skeins in stock." }).int("Whole skeins.").min(0, "Stock cannot be negative.").max(10_000),
});
export type LotInput = z.input<typeof lotSchema>;
