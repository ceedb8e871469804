import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, createDesign, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

interface CommissionRow {
  id: string;
  title: string;
}

async function commissionId(page: Page, title: string): Promise<string> {
  const res = await page.request.get("/api/commissions");
  const list = (await res.json()).commissions as CommissionRow[];
  const found = list.find((c) => c.title === title);
  if (!found) throw new Error(`no demo commission "${title}"`);
  return found.id;
}

/** Clicks the middle of a stitch given in core coordinates (x from the left, y from the bottom). */
async function clickStitch(page: Page, x: number, y: number, height: number) {
  const canvas = page.getByTestId("chart-canvas");
  const zoom = Number(await canvas.getAttribute("data-zoom"));
  const rowPx = Number(await canvas.getAttribute("data-row-px"));
  await canvas.click({ position: { x: x * zoom + zoom / 2, y: (height - 1 - y) * rowPx + rowPx / 2 } });
}

const count = async (page: Page, key: string) => Number(((await page.getByTestId(`count-${key}`).textContent()) ?? "").replace(/\D+/g, ""));
const counts = async (page: Page) => ({ A: await count(page, "A"), B: await count(page, "B"), C: await count(page, "C") });
const saved = (page: Page) => page.getByTestId("save-state").getAttribute("data-state");

describe("the chart editor", () => {
  test("the commission page links to its design; the seeded design opens with its colour plan", () =>
    withPage(browser, "design-open-seeded", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const id = await commissionId(page, "Snowflake mittens with P·O");
      await page.goto(`/studio/commissions/${id}`);
      await expect.poll(() => page.getByRole("heading", { name: "Design", exact: true }).count(), POLL).toBe(1);
      await expectAccessible(page);
      await page.getByRole("link", { name: "Open the design" }).click();
      await page.waitForURL(/\/studio\/designs\/[0-9a-f-]{36}$/);
      await expect.poll(() => page.getByTestId("plan-knit").textContent(), POLL).toContain("Gull white");
      expect(await page.getByRole("button", { name: "Back of hand (right)" }).count()).toBe(1);
      await expectAccessible(page);
      await page.goto("/studio/designs");
      await expect.poll(() => page.getByRole("link", { name: "Snowflake mittens with P·O" }).count(), POLL).toBe(1);
      await expectAccessible(page);
      // starting a design: chart sizes offered from the sizing core for a baby mitten
      const baby = await commissionId(page, "First mittens for Aoife");
      await page.goto(`/studio/designs/new?commission=${baby}`);
      await expect.poll(() => page.getByRole("heading", { level: 1 }).count(), POLL).toBe(1);
      await expectAccessible(page);
    }));

  test("paint, fill, initials and a motif, undo, reload: the chart is as saved", () =>
    withPage(browser, "design-edit", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      // A design of our own on a demo commission no other test looks at for designs.
      const W = 20;
      const H = 16;
      const designId = await createDesign(page, "First mittens for Aoife", `E2E editor ${Date.now()}`, {
        width: W,
        height: H,
        palette: [
          { key: "A", name: "Gull white", hex: "#F2EEE4" },
          { key: "B", name: "Lichen green", hex: "#6F8A5B" },
        ],
        rows: Array.from({ length: H }, () => "A".repeat(W)),
      });
      await page.goto(`/studio/designs/${designId}`);
      await expect.poll(() => page.getByTestId("plan-panel").count(), POLL).toBe(1);
      await expectAccessible(page);
      expect(await count(page, "A")).toBe(W * H);

      // paint one stitch in B
      await page.locator("#colour-B").check();
      await page.getByRole("button", { name: "Paint", exact: true }).click();
      await clickStitch(page, 1, 1, H);
      await expect.poll(() => count(page, "B"), POLL).toBe(1);

      // add Gorse from the studio's yarns and fill the background with it
      await page.getByLabel("Add a studio yarn").selectOption({ label: "Gorse (Skerry 4-ply)" });
      await page.getByRole("button", { name: "Add", exact: true }).click();
      await expect.poll(() => page.getByTestId("count-C").count(), POLL).toBe(1);
      await page.getByRole("button", { name: "Fill", exact: true }).click();
      await clickStitch(page, 10, 10, H);
      await expect.poll(() => count(page, "C"), POLL).toBe(W * H - 1);

      // initials: B ink on an A box, centred on the chart
      await page.locator("#colour-B").check();
      await page.getByLabel("Background (moves, resizes, lettering box)").selectOption({ label: "A · Gull white" });
      await page.getByLabel("Lettering", { exact: true }).fill("PO");
      await page.getByRole("button", { name: "Place lettering" }).click();
      await expect.poll(() => count(page, "A"), POLL).toBeGreaterThan(0);
      const afterLettering = await counts(page);
      expect(afterLettering.B).toBeGreaterThan(10);

      // a motif at the bottom-left corner
      await page.getByRole("combobox", { name: /^Motif/ }).selectOption("heart");
      await page.getByRole("button", { name: "Place motif" }).click();
      await clickStitch(page, 0, 0, H);
      await expect.poll(async () => JSON.stringify(await counts(page)), POLL).not.toBe(JSON.stringify(afterLettering));

      // undo the motif with the keyboard
      await page.getByTestId("chart-canvas").focus();
      await page.keyboard.press("Control+z");
      await expect.poll(async () => JSON.stringify(await counts(page)), POLL).toBe(JSON.stringify(afterLettering));

      // autosave, then reload: the chart is as saved
      await expect.poll(() => saved(page), POLL).toBe("saved");
      await page.reload();
      await expect.poll(() => page.getByTestId("count-C").count(), POLL).toBe(1);
      expect(await counts(page)).toEqual(afterLettering);
      await expect.poll(() => page.getByTestId("version-list").locator("li").count(), POLL).toBeGreaterThanOrEqual(2);
      await expect.poll(() => page.getByTestId("plan-knit").count(), POLL).toBe(1);
      await expectAccessible(page);
      await page.screenshot({ path: "test-results/e2e/design-editor.png", fullPage: true });
    }));

  test("a save that races another tab is kept as its own version and the editor says so", () =>
    withPage(browser, "design-conflict", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const cid = await commissionId(page, "First mittens for Aoife");
      const chart = {
        version: 1,
        width: 8,
        height: 6,
        gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 },
        palette: [
          { key: "A", name: "Gull white", hex: "#F2EEE4" },
          { key: "B", name: "Lichen green", hex: "#6F8A5B" },
        ],
        rows: Array.from({ length: 6 }, () => "AAAAAAAA"),
      };
      const res = await page.request.post("/api/designs", {
        data: { commissionId: cid, title: `E2E race ${Date.now()}`, charts: [{ area: "cuff", label: "Cuff", chart }] },
      });
      const { design, version } = await res.json();
      await page.goto(`/studio/designs/${design.id}`);
      await expect.poll(() => page.getByTestId("plan-panel").count(), POLL).toBe(1);
      // "another tab" saves first, from the same version
      const other = await page.request.post(`/api/designs/${design.id}/versions`, {
        data: { parentVersionId: version.id, charts: [{ area: "cuff", label: "Cuff", chart: { ...chart, rows: ["BBBBBBBB", ...chart.rows.slice(1)] } }] },
      });
      expect(other.status()).toBe(201);
      await page.locator("#colour-B").check();
      await clickStitch(page, 0, 0, 6);
      await expect.poll(() => saved(page), POLL).toBe("conflict");
      expect(await page.getByText(/Yours is kept as version 3/).count()).toBe(1);
      await expectAccessible(page);
      await page.getByRole("button", { name: /Keep mine \(version 3\) as current/ }).click();
      await expect.poll(() => saved(page), POLL).toBe("saved");
      await page.reload();
      await expect.poll(() => count(page, "B"), POLL).toBe(1);
    }));
});
