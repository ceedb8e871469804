// Chart editor feedback: a motif that would reach past the chart is refused with a message, and a
// locked (approved) design shows its tools off while its version list stays reachable by keyboard.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, createDesign, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";
import { withDb } from "./demo-db";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const W = 20;
const H = 16;
const chart = {
  width: W,
  height: H,
  palette: [
    { key: "A", name: "Gull white", hex: "#F2EEE4" },
    { key: "B", name: "Lichen green", hex: "#6F8A5B" },
  ],
  rows: Array.from({ length: H }, () => "A".repeat(W)),
};

async function clickStitch(page: Page, x: number, y: number) {
  const canvas = page.getByTestId("chart-canvas");
  const zoom = Number(await canvas.getAttribute("data-zoom"));
  const rowPx = Number(await canvas.getAttribute("data-row-px"));
  await canvas.click({ position: { x: x * zoom + zoom / 2, y: (H - 1 - y) * rowPx + rowPx / 2 } });
}

const countOf = async (page: Page, key: string) => Number(((await page.getByTestId(`count-${key}`).textContent()) ?? "").replace(/\D+/g, ""));

describe("chart editor feedback", () => {
  test("a motif placed partly off the chart is refused with a message; placed inside, it lands", () =>
    withPage(browser, "editor-off-chart", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const designId = await createDesign(page, "First mittens for Aoife", `E2E off-chart ${Date.now()}`, chart);
      await page.goto(`/studio/designs/${designId}`);
      await expect.poll(() => page.getByTestId("plan-panel").count(), POLL).toBe(1);
      await page.locator("#colour-B").check();
      await page.getByRole("combobox", { name: /^Motif/ }).selectOption("heart");
      await page.getByRole("button", { name: "Place motif" }).click();
      // The heart is 9 × 9: its bottom-left at x = 15 reaches 4 stitches past the left edge.
      await clickStitch(page, 15, 2);
      await expect.poll(() => page.getByText(/Not placed: the motif “Heart” \(9 × 9\) would reach 4 stitches past the left edge/).count(), POLL).toBe(1);
      expect(await countOf(page, "B")).toBe(0);
      await expectAccessible(page);
      await clickStitch(page, 2, 2);
      await expect.poll(() => countOf(page, "B"), POLL).toBeGreaterThan(0);
      expect(await page.getByText(/Not placed/).count()).toBe(0);
    }));

  test("a locked design shows its tools off and its version list is reached and scrolled by keyboard", () =>
    withPage(browser, "editor-locked", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const designId = await createDesign(page, "First mittens for Aoife", `E2E locked ${Date.now()}`, chart);
      await withDb((c) => c.query("update designs set locked_version_id = head_version_id where id = $1", [designId]));
      await page.goto(`/studio/designs/${designId}`);
      await expect.poll(() => page.getByTestId("save-state").getAttribute("data-state"), POLL).toBe("locked");
      const paint = page.getByRole("button", { name: "Paint", exact: true });
      expect(await paint.isDisabled()).toBe(true);
      expect(await paint.getAttribute("aria-pressed")).toBe("false");
      expect(await page.getByRole("button", { name: "Pan", exact: true }).isDisabled()).toBe(false);
      await expect.poll(() => page.getByTestId("version-list").locator("li").count(), POLL).toBeGreaterThanOrEqual(1);
      // Tab from the top of the page until the version list has the focus.
      await page.locator("body").focus();
      let reached = false;
      for (let i = 0; i < 150 && !reached; i++) {
        await page.keyboard.press("Tab");
        reached = await page.evaluate(() => document.activeElement?.getAttribute("data-testid") === "version-list");
      }
      expect(reached, "the version list is reachable with Tab").toBe(true);
      await expectAccessible(page);
    }));

  test("the board offers moving a commission's pieces together, and stays accessible", () =>
    withPage(browser, "board-together", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto("/studio/board");
      await expect.poll(() => page.getByRole("heading", { name: "Production board" }).count(), POLL).toBe(1);
      await expectAccessible(page);
    }));
});
