import "server-only";
// A commission's sizing: the studio's measurements, ease, measured gauge and repeat, kept on the
// commission, so the chart sizes of a new design and the yarn estimate use the studio's own numbers.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { commissions, type CommissionBrief, type GarmentKind } from "@/db/schema";
import { getSizeKeys, type SizingResult } from "@/lib/core/sizing";
import { DEFAULT_SIZING_GAUGE, coreGarment, defaultSizingForm, sizeForm, sizingFormSchema, type SizingFormValues } from "@/lib/schemas/sizing";
import { assertCan, type Actor } from "./authz";
import { sizeFromBrief } from "./design-sizes";
import { getCommissionFibres } from "./shipping";
import { AppError, validationError } from "./errors";
import { getCommissionFor } from "./queries/commissions";

/** The saved form, or null when none is saved or it no longer reads. */
export function savedSizingForm(raw: unknown): SizingFormValues | null {
  if (!raw) return null;
  const parsed = sizingFormSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
}

/** The sizing result of a commission's saved sizing, or null (nothing saved, or it no longer sizes). */
export function sizedCommission(c: { garment: GarmentKind; sizing: unknown }): SizingResult | null {
  const values = savedSizingForm(c.sizing);
  if (!values) return null;
  return sizeForm(c.garment, values).result;
}

/**
 * What a commission's garment sizes to: the studio's saved sizing (its measured gauge) when there
 * is one that sizes, else the brief at `briefGauge`, else why neither does.
 */
export function resolveSizing(
  c: { garment: GarmentKind; brief: CommissionBrief | null; sizing: unknown },
  briefGauge: { stitchesPer10cm: number; rowsPer10cm: number } = DEFAULT_SIZING_GAUGE,
): { result: SizingResult | null; saved: boolean; reason: string | null } {
  const saved = sizedCommission(c);
  if (saved) return { result: saved, saved: true, reason: null };
  const { result, reason } = sizeFromBrief(c.garment, c.brief ?? {}, briefGauge);
  return { result, saved: false, reason };
}

/** The commission's saved sizing form as stored (no permission check: callers read the commission first). */
export async function loadSizing(commissionId: string): Promise<unknown> {
  const [row] = await db.select({ sizing: commissions.sizing }).from(commissions).where(eq(commissions.id, commissionId));
  return row?.sizing ?? null;
}

/** Studio members: the saved form, or a first one from the brief. Clients never see it. */
export async function getCommissionSizing(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "studio.view", c.studioId);
  const raw = await loadSizing(c.id);
  const saved = savedSizingForm(raw);
  const values = saved ?? defaultSizingForm(c.garment, (c.brief ?? {}) as CommissionBrief, getSizeKeys(coreGarment(c.garment)));
  const { fibres } = await getCommissionFibres(c);
  return { commission: c, values, saved: saved !== null, fibres };
}

/** Owner or assistant: saves the form once it sizes a garment; otherwise 422 with the field's message. */
export async function saveCommissionSizing(actor: Actor, commissionId: string, raw: unknown) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "commission.work", c.studioId);
  const parsed = sizingFormSchema.safeParse(raw);
  if (!parsed.success) throw validationError(parsed.error);
  const sized = sizeForm(c.garment, parsed.data);
  if (!sized.result) throw new AppError(422, "invalid_sizing", "Some fields need attention; nothing was saved.", sized.fieldErrors);
  await db.update(commissions).set({ sizing: parsed.data, updatedAt: new Date() }).where(eq(commissions.id, c.id));
  return { sizing: parsed.data, result: sized.result };
}
