import { mkdirSync } from "node:fs";
import { randomBytes } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { serializeChart } from "@/lib/core/chart";
import { createChart } from "@/lib/core/chart/model";
import { rowShape } from "@/lib/core/design-garment";
import { sizeGarment } from "@/lib/core/sizing";
import { BASE, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";
import { insertDemoCommission, withDb } from "./demo-db";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const GAUGE = { stitchesPer10cm: 32, rowsPer10cm: 36 };
// The demo studio's yarns (db/seed.ts).
const YARN = { white: { name: "Gull white", hex: "#F2EEE4" }, green: { name: "Lichen green", hex: "#6F8A5B" }, red: { name: "Rowanberry", hex: "#A8322D" } };
type Colour = keyof typeof YARN;

/**
 * The motif, stitch by stitch (top row first): Gull white ground, two Lichen green bands and a
 * Rowanberry diamond in the middle; inside the area's shape only (outside it stays Gull white, as
 * the import leaves cells that are never knitted).
 */
function motif(W: number, H: number, inShape: (x: number, rowFromTop: number) => boolean): Colour[][] {
  const out: Colour[][] = [];
  const cx = (W - 1) / 2;
  const cy = Math.floor(H / 2);
  const r = Math.max(3, Math.floor(Math.min(W, H) / 4));
  for (let row = 0; row < H; row++) {
    const line: Colour[] = [];
    for (let x = 0; x < W; x++) {
      let c: Colour = "white";
      if (row === 3 || row === 4 || row === H - 4 || row === H - 5) c = "green";
      if (Math.abs(x - cx) + Math.abs(row - cy) <= r) c = "red";
      line.push(inShape(x, row) ? c : "white");
    }
    out.push(line);
  }
  return out;
}

/** The motif drawn as a photo at the gauge's proportions (a stitch 9:8 wide:tall at 32 sts / 36 rows), with a plain margin on the left to crop away. */
async function motifPng(grid: Colour[][], cell: { w: number; h: number }, margin: number): Promise<Buffer> {
  const H = grid.length;
  const W = grid[0].length;
  const width = margin + W * cell.w;
  const height = H * cell.h;
  const data = Buffer.alloc(width * height * 3);
  const rgb = (hex: string) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
  const marginRgb = rgb("#2E5A7A"); // Loch blue: not among the yarns chosen, so a crop that kept it would show
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const c = x < margin ? marginRgb : rgb(YARN[grid[Math.floor(y / cell.h)][Math.floor((x - margin) / cell.w)]].hex);
      data.set(c, (y * width + x) * 3);
    }
  }
  return sharp(data, { raw: { width, height, channels: 3 } }).png().toBuffer();
}

const head = async (page: Page, designId: string) => {
  const body = await (await page.request.get(`/api/designs/${designId}`)).json();
  return body.head as { id: string; number: number; charts: { chart: { width: number; height: number; palette: { key: string; name: string }[]; rows: string[] } }[] };
};
/** A stored chart as colour names, top row first. */
const names = (chart: { palette: { key: string; name: string }[]; rows: string[] }) =>
  chart.rows.map((row) => Array.from(row, (k) => chart.palette.find((p) => p.key === k)?.name ?? "?"));
const saved = (page: Page) => page.getByTestId("save-state").getAttribute("data-state");

describe("import from a photo", () => {
  test("a reference photo is cropped, quantised in the studio's yarns, previewed and accepted as a new version; undo restores the old chart", () =>
    withPage(browser, "photo-import", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const title = `Photo import mittens ${randomBytes(3).toString("hex")}`;
      const commissionId = await withDb((c) => insertDemoCommission(c, { clientEmail: "priya@example.test", title, garment: "mittens", brief: { sizeLabel: "child" } }));
      const back = sizeGarment({ garment: "mitten", size: "child", gauge: GAUGE }).charts.find((a) => a.area === "back of hand")!;
      const W = back.width;
      const H = back.height;
      // the design as it was: plain stripes
      const before = createChart(W, H, GAUGE, [
        { key: "A", name: YARN.white.name, hex: YARN.white.hex },
        { key: "B", name: YARN.green.name, hex: YARN.green.hex },
      ]);
      for (let y = 0; y < H; y++) {
        const mask = rowShape(back, y);
        for (let x = 0; x < W; x++) before.cells[y * W + x] = mask[x] && y % 4 === 0 ? 1 : 0;
      }
      const res = await page.request.post("/api/designs", {
        data: { commissionId, title: `E2E photo import ${Date.now()}`, charts: [{ area: "back-of-hand", label: "Back of hand", chart: serializeChart(before) }] },
      });
      expect(res.status()).toBe(201);
      const designId = (await res.json()).design.id as string;
      const original = await head(page, designId);

      // The client's reference photo: the motif at the gauge's proportions, with a margin to crop off.
      const expected = motif(W, H, (x, rowFromTop) => rowShape(back, H - 1 - rowFromTop)[x]);
      const k = Math.max(1, Math.floor(1400 / Math.max(W * 9, H * 8)));
      const cell = { w: 9 * k, h: 8 * k };
      const margin = 12 * k;
      const png = await motifPng(expected, cell, margin);
      const up = await page.request.post(`/api/commissions/${commissionId}/uploads`, { multipart: { file: { name: "reference.png", mimeType: "image/png", buffer: png } } });
      expect(up.status()).toBe(201);
      const uploadId = (await up.json()).upload.id as string;
      // Reference photos arrive with the request form (a draft's photos, attached to the commission
      // when it is made); here the stored photo is marked as one the same way.
      await withDb((c) => c.query("update uploads set kind = 'reference' where id = $1", [uploadId]));

      await page.goto(`/studio/designs/${designId}`);
      await expect.poll(() => page.getByTestId("plan-panel").count(), POLL).toBe(1);
      await expectAccessible(page);
      const dialog = page.getByRole("dialog", { name: "Import from a photo" });

      // Bad files are refused on the field, in words, before anything is decoded.
      await page.getByRole("button", { name: "Import from a photo…" }).click();
      const fileInput = dialog.getByLabel(/Or choose a file/);
      await fileInput.setInputFiles({ name: "notes.png", mimeType: "image/png", buffer: Buffer.from("not a picture at all") });
      await expect.poll(() => dialog.getByRole("alert").textContent(), POLL).toContain("not a JPEG, PNG or WebP photo");
      const huge = Buffer.alloc(64);
      huge.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
      huge.writeUInt32BE(20_000, 16);
      huge.writeUInt32BE(20_000, 20);
      await fileInput.setInputFiles({ name: "huge.png", mimeType: "image/png", buffer: huge });
      await expect.poll(() => dialog.getByRole("alert").textContent(), POLL).toContain("20000 × 20000 pixels");
      expect(await fileInput.getAttribute("aria-invalid")).toBe("true");

      // A picked file, made into a chart and cancelled: the design is as it was.
      await fileInput.setInputFiles({ name: "reference.png", mimeType: "image/png", buffer: png });
      await expect.poll(() => dialog.getByTestId("crop-box").count(), POLL).toBe(1);
      await dialog.getByRole("button", { name: "Make the chart" }).click();
      await expect.poll(() => dialog.getByTestId("photo-import-preview").count(), POLL).toBe(1);
      await dialog.getByRole("button", { name: "Cancel" }).last().click();
      await expect.poll(() => dialog.isVisible(), POLL).toBe(false);
      expect(await saved(page)).toBe("saved");
      expect((await head(page, designId)).id).toBe(original.id);

      // The reference photo: pick it, crop the margin off with the keyboard, the studio's yarns.
      await page.getByRole("button", { name: "Import from a photo…" }).click();
      await dialog.getByRole("radio", { name: /Reference photo 1/ }).check();
      const box = dialog.getByTestId("crop-box");
      await expect.poll(async () => (await box.getAttribute("data-image")) ?? "", POLL).toBe(`${margin + W * cell.w},${H * cell.h}`);
      // The box starts centred at the area's true proportions (here the motif's own size).
      const [, , bw, bh] = ((await box.getAttribute("data-box")) ?? "").split(",").map(Number);
      expect(Math.abs(bw - W * cell.w)).toBeLessThanOrEqual(1);
      expect(Math.abs(bh - H * cell.h)).toBeLessThanOrEqual(1);
      await box.focus();
      for (let i = 0; i < 10; i++) await page.keyboard.press("ArrowRight");
      await expect.poll(async () => (await box.getAttribute("data-box"))?.split(",")[0], POLL).toBe(String(margin + W * cell.w - bw));
      expect(await dialog.getByRole("radio", { name: /The garment's back of hand/ }).isChecked()).toBe(true);
      for (const cb of await dialog.getByRole("checkbox").all()) {
        const label = (await cb.evaluate((el) => el.closest("label")?.textContent ?? "")) || "";
        const want = [YARN.white.name, YARN.green.name, YARN.red.name].some((n) => label.startsWith(n));
        if (/^ ?Clean up/.test(label)) continue;
        await cb.setChecked(want);
      }
      await dialog.getByRole("button", { name: "Make the chart" }).click();
      const preview = dialog.getByTestId("photo-import-preview");
      await expect.poll(() => preview.count(), POLL).toBe(1);
      await expect.poll(() => dialog.getByTestId("photo-import-plan").count(), POLL).toBe(1);
      await expect.poll(() => dialog.getByTestId("photo-import-price").textContent(), POLL).toMatch(/Price change: [+-]?£|No change to the price/);
      const table = await dialog.getByTestId("photo-import-colours").textContent();
      for (const n of [YARN.white.name, YARN.green.name, YARN.red.name]) expect(table).toContain(n);
      await expectAccessible(page);
      mkdirSync("test-results/e2e", { recursive: true });
      await preview.screenshot({ path: "test-results/e2e/photo-import-preview.png" });

      // Accept: a new version whose chart is the motif, stitch for stitch.
      await dialog.getByRole("button", { name: "Accept as a new version" }).click();
      await expect.poll(() => dialog.isVisible(), POLL).toBe(false);
      await expect.poll(async () => (await head(page, designId)).number, POLL).toBeGreaterThan(original.number);
      await expect.poll(() => saved(page), POLL).toBe("saved");
      const imported = (await head(page, designId)).charts[0].chart;
      expect([imported.width, imported.height]).toEqual([W, H]);
      expect(names(imported)).toEqual(expected.map((row) => row.map((c) => YARN[c].name)));

      // Undo brings the old chart back (saved as the next version).
      const importedNumber = (await head(page, designId)).number;
      await page.getByRole("button", { name: "Undo", exact: true }).click();
      await expect.poll(async () => (await head(page, designId)).number, POLL).toBeGreaterThan(importedNumber);
      await expect.poll(() => saved(page), POLL).toBe("saved");
      const restored = (await head(page, designId)).charts[0].chart;
      expect(names(restored)).toEqual(names(original.charts[0].chart));
      await expectAccessible(page);

      // An approved (locked) design cannot import.
      const last = await head(page, designId);
      await withDb((c) => c.query("update designs set locked_version_id = $1 where id = $2", [last.id, designId]));
      await page.reload();
      const button = page.getByRole("button", { name: "Import from a photo…" });
      await expect.poll(() => button.count(), POLL).toBe(1);
      expect(await button.isDisabled()).toBe(true);
      expect(await page.getByText("an approved design cannot import a photo").count()).toBe(1);
    }, { viewport: { width: 1400, height: 2000 } }));
});
