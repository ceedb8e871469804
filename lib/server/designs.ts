import "server-only";
// Designs and their versions. Only members of the studio reach these (clients see proofs, which
// are another door). Every save is a new immutable version; a save whose parent is no longer the
// head is kept as a sibling and reported as a conflict, so two tabs never silently overwrite.
import { createHash } from "node:crypto";
import { and, asc, desc, eq, inArray, max } from "drizzle-orm";
import { db } from "@/db";
import { commissions, designs, designVersions, user, yarns, type DesignChartEntry } from "@/db/schema";
import { ChartFormatError, parseChart, serializeChart, type Chart } from "@/lib/core/chart";
import { DesignFormatError, parseDesign, serializeDesign } from "@/lib/core/chart/layered-design";
import type { CreateDesignInput, DesignChartEntryInput, SaveDesignVersionInput } from "@/lib/schemas/designs";
import { assertCan, type Actor } from "./authz";
import { AppError, notFound, type FieldErrors } from "./errors";
import { assertChartsInShape } from "./garment";

/** Stable JSON: object keys sorted at every level, so equal content hashes equally. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
}

export function contentHashOf(charts: DesignChartEntry[]): string {
  return createHash("sha256").update(canonicalJson(charts)).digest("hex");
}

/**
 * Checks every chart with the chart core and returns them normalised (hex upper case, unknown
 * fields dropped). Nothing is written when any chart is at fault: all faults are reported at once.
 */
export function validateDesignCharts(entries: DesignChartEntryInput[]): DesignChartEntry[] {
  const fieldErrors: FieldErrors = {};
  const messages: string[] = [];
  const out: DesignChartEntry[] = [];
  entries.forEach((entry, i) => {
    const where = `charts.${i}`;
    let chart: Chart;
    try {
      chart = parseChart(entry.chart);
    } catch (e) {
      if (!(e instanceof ChartFormatError)) throw e;
      for (const issue of e.issues) (fieldErrors[`${where}.chart${issue.path ? `.${issue.path}` : ""}`] ??= []).push(issue.message);
      messages.push(`${entry.label}: ${e.issues.slice(0, 3).map((x) => x.message).join("; ")}`);
      return;
    }
    const normalised = serializeChart(chart);
    let lettering: unknown[] | undefined;
    if (entry.lettering && entry.lettering.length > 0) {
      try {
        lettering = serializeDesign(parseDesign({ version: 1, chart: normalised, lettering: entry.lettering })).lettering;
      } catch (e) {
        if (!(e instanceof DesignFormatError)) throw e;
        for (const issue of e.issues) (fieldErrors[`${where}.${issue.path}`] ??= []).push(issue.message);
        messages.push(`${entry.label}: ${e.issues[0]?.message ?? "lettering is not valid"}`);
        return;
      }
    }
    out.push({
      area: entry.area,
      label: entry.label,
      chart: normalised,
      ...(lettering ? { lettering } : {}),
      ...(entry.options ? { options: entry.options } : {}),
    });
  });
  if (messages.length > 0) {
    throw new AppError(422, "invalid_chart", messages.join(" · "), fieldErrors);
  }
  return out;
}

/** The chart as knitted for one stored entry (the stored chart already carries its lettering). */
export function entryChart(entry: DesignChartEntry): Chart {
  return parseChart(entry.chart);
}

/** A layered view of an entry, for re-setting its lettering (mirrored pairs). */
export function entryLayers(entry: DesignChartEntry) {
  return parseDesign({ version: 1, chart: entry.chart, lettering: entry.lettering ?? [] });
}

function memberStudioIds(actor: Actor): string[] {
  return actor.memberships.map((m) => m.studioId);
}

const designColumns = {
  id: designs.id,
  studioId: designs.studioId,
  commissionId: designs.commissionId,
  title: designs.title,
  headVersionId: designs.headVersionId,
  lockedVersionId: designs.lockedVersionId,
  createdAt: designs.createdAt,
  updatedAt: designs.updatedAt,
};

/** A design in one of the actor's studios, or 404 (clients and other studios alike). */
export async function getDesignFor(actor: Actor, designId: string) {
  const ids = memberStudioIds(actor);
  if (ids.length === 0) throw notFound("That design");
  const [row] = await db
    .select({ ...designColumns, commissionTitle: commissions.title, commissionNumber: commissions.number, garment: commissions.garment })
    .from(designs)
    .leftJoin(commissions, eq(commissions.id, designs.commissionId))
    .where(and(eq(designs.id, designId), inArray(designs.studioId, ids)))
    .limit(1);
  if (!row) throw notFound("That design");
  assertCan(actor, "studio.view", row.studioId);
  return row;
}

export type DesignSummary = Awaited<ReturnType<typeof listDesignsFor>>[number];

export async function listDesignsFor(actor: Actor, opts: { commissionId?: string } = {}) {
  const ids = memberStudioIds(actor);
  if (ids.length === 0) return [];
  const where = opts.commissionId
    ? and(inArray(designs.studioId, ids), eq(designs.commissionId, opts.commissionId))
    : inArray(designs.studioId, ids);
  return db
    .select({ ...designColumns, headNumber: designVersions.number })
    .from(designs)
    .leftJoin(designVersions, eq(designVersions.id, designs.headVersionId))
    .where(where)
    .orderBy(desc(designs.updatedAt));
}

export async function listDesignVersions(actor: Actor, designId: string) {
  const d = await getDesignFor(actor, designId);
  return db
    .select({
      id: designVersions.id,
      number: designVersions.number,
      parentVersionId: designVersions.parentVersionId,
      contentHash: designVersions.contentHash,
      note: designVersions.note,
      createdAt: designVersions.createdAt,
      createdByName: user.name,
    })
    .from(designVersions)
    .leftJoin(user, eq(user.id, designVersions.createdBy))
    .where(eq(designVersions.designId, d.id))
    .orderBy(desc(designVersions.number));
}

export async function getDesignVersion(actor: Actor, designId: string, versionId?: string | null) {
  const d = await getDesignFor(actor, designId);
  const id = versionId ?? d.headVersionId;
  if (!id) throw notFound("That version");
  const [v] = await db
    .select()
    .from(designVersions)
    .where(and(eq(designVersions.designId, d.id), eq(designVersions.id, id)))
    .limit(1);
  if (!v) throw notFound("That version");
  return v;
}

/** The design with its head version and the list of versions, for the editor page and GET. */
export async function getDesignWithHead(actor: Actor, designId: string) {
  const design = await getDesignFor(actor, designId);
  const [head, versions] = await Promise.all([
    design.headVersionId ? getDesignVersion(actor, designId, design.headVersionId) : Promise.resolve(null),
    listDesignVersions(actor, designId),
  ]);
  return { design, head, versions };
}

/** Studio members create a design for one of their commissions, with its first version. */
export async function createDesign(actor: Actor, input: CreateDesignInput) {
  const ids = memberStudioIds(actor);
  const [c] = ids.length
    ? await db
        .select({ id: commissions.id, studioId: commissions.studioId })
        .from(commissions)
        .where(and(eq(commissions.id, input.commissionId), inArray(commissions.studioId, ids)))
        .limit(1)
    : [];
  if (!c) throw notFound("That commission");
  assertCan(actor, "commission.work", c.studioId);
  const charts = validateDesignCharts(input.charts);
  await assertChartsInShape(c.id, charts);
  return db.transaction(async (tx) => {
    const [design] = await tx
      .insert(designs)
      .values({ studioId: c.studioId, commissionId: c.id, title: input.title })
      .returning();
    const [version] = await tx
      .insert(designVersions)
      .values({ designId: design.id, number: 1, parentVersionId: null, charts, contentHash: contentHashOf(charts), note: "First version", createdBy: actor.userId })
      .returning();
    const [updated] = await tx
      .update(designs)
      .set({ headVersionId: version.id })
      .where(eq(designs.id, design.id))
      .returning();
    return { design: updated, version };
  });
}

export type SaveOutcome =
  | { kind: "saved"; version: typeof designVersions.$inferSelect; unchanged: boolean }
  | { kind: "conflict"; version: typeof designVersions.$inferSelect; headVersionId: string | null; headNumber: number | null };

/**
 * Saves a new version edited from `parentVersionId`. When the head has moved past the parent
 * (another tab saved first), the new version is still stored, as a sibling, and the outcome is a
 * conflict naming both versions; the head stays where the other save put it.
 */
export async function saveDesignVersion(actor: Actor, designId: string, input: SaveDesignVersionInput): Promise<SaveOutcome> {
  const d = await getDesignFor(actor, designId);
  assertCan(actor, "commission.work", d.studioId);
  const charts = validateDesignCharts(input.charts);
  await assertChartsInShape(d.commissionId, charts);
  const hash = contentHashOf(charts);
  return db.transaction(async (tx) => {
    // One save at a time per design: the row lock orders racing tabs.
    const [locked] = await tx.select().from(designs).where(eq(designs.id, d.id)).for("update");
    if (locked.lockedVersionId) {
      throw new AppError(
        409,
        "design_locked",
        "The client approved this design, so it is locked. Changes now need a change request and a new quote version.",
      );
    }
    let parentHash: string | null = null;
    if (input.parentVersionId) {
      const [parent] = await tx
        .select({ id: designVersions.id, contentHash: designVersions.contentHash })
        .from(designVersions)
        .where(and(eq(designVersions.id, input.parentVersionId), eq(designVersions.designId, d.id)));
      if (!parent) throw new AppError(422, "invalid_input", "The version this edit started from is not part of this design.", { parentVersionId: ["Not a version of this design."] });
      parentHash = parent.contentHash;
    }
    const headIsParent = locked.headVersionId === (input.parentVersionId ?? null);
    if (headIsParent && parentHash === hash && input.parentVersionId) {
      const [same] = await tx.select().from(designVersions).where(eq(designVersions.id, input.parentVersionId));
      return { kind: "saved", version: same, unchanged: true };
    }
    const [{ top }] = await tx
      .select({ top: max(designVersions.number) })
      .from(designVersions)
      .where(eq(designVersions.designId, d.id));
    const [version] = await tx
      .insert(designVersions)
      .values({
        designId: d.id,
        number: (top ?? 0) + 1,
        parentVersionId: input.parentVersionId,
        charts,
        contentHash: hash,
        note: input.note ?? "",
        createdBy: actor.userId,
      })
      .returning();
    if (headIsParent) {
      await tx.update(designs).set({ headVersionId: version.id, updatedAt: new Date() }).where(eq(designs.id, d.id));
      return { kind: "saved", version, unchanged: false };
    }
    await tx.update(designs).set({ updatedAt: new Date() }).where(eq(designs.id, d.id));
    const [head] = locked.headVersionId
      ? await tx.select({ number: designVersions.number }).from(designVersions).where(eq(designVersions.id, locked.headVersionId))
      : [];
    return { kind: "conflict", version, headVersionId: locked.headVersionId, headNumber: head?.number ?? null };
  });
}

/** Make a kept version the head again (after a conflict the maker picks theirs). */
export async function restoreDesignVersion(actor: Actor, designId: string, versionId: string) {
  const d = await getDesignFor(actor, designId);
  assertCan(actor, "commission.work", d.studioId);
  const v = await getDesignVersion(actor, designId, versionId);
  if (d.lockedVersionId) {
    throw new AppError(409, "design_locked", "The client approved this design, so it is locked.");
  }
  await db.update(designs).set({ headVersionId: v.id, updatedAt: new Date() }).where(eq(designs.id, d.id));
  return v;
}

/** The studio's yarn colours, for the editor's palette. */
export async function listStudioYarnColours(actor: Actor, studioId: string) {
  assertCan(actor, "studio.view", studioId);
  return db
    .select({ id: yarns.id, name: yarns.name, colourName: yarns.colourName, hex: yarns.hex })
    .from(yarns)
    .where(eq(yarns.studioId, studioId))
    .orderBy(asc(yarns.createdAt), asc(yarns.colourName));
}

/** The design of a commission, if any (for the commission page's Design section). */
export async function getCommissionDesign(actor: Actor, commissionId: string) {
  const list = await listDesignsFor(actor, { commissionId });
  return list[0] ?? null;
}
