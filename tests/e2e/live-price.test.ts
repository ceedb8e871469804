import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, createDesign, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("the live price in the chart editor", () => {
  test("painting a third colour into a row prices the darning in the browser", () =>
    withPage(browser, "live-price", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const W = 12;
      const H = 6;
      const designId = await createDesign(page, "First mittens for Aoife", `E2E live price ${Date.now()}`, {
        width: W,
        height: H,
        palette: [
          { key: "A", name: "Gull white", hex: "#F2EEE4" },
          { key: "B", name: "Lichen green", hex: "#6F8A5B" },
          { key: "C", name: "Rowanberry", hex: "#9E2B25" },
        ],
        rows: Array.from({ length: H }, () => "AB".repeat(W / 2)),
      });
      await page.goto(`/studio/designs/${designId}`);
      const change = page.getByTestId("live-price-change");
      await expect.poll(() => change.textContent(), POLL).toBe("No change since the version you opened.");
      expect(await change.getAttribute("aria-live")).toBe("polite");
      const totalBefore = await page.getByTestId("live-price-total").textContent();
      expect(totalBefore).toMatch(/^£/);
      await expectAccessible(page);

      // one stitch of a third colour: darned afterwards, with its two ends
      await page.locator("#colour-C").check();
      await page.getByRole("button", { name: "Paint", exact: true }).click();
      const canvas = page.getByTestId("chart-canvas");
      const zoom = Number(await canvas.getAttribute("data-zoom"));
      const rowPx = Number(await canvas.getAttribute("data-row-px"));
      await canvas.click({ position: { x: 2 * zoom + zoom / 2, y: (H - 1) * rowPx + rowPx / 2 } });
      // The darned stitch is knitted first in the pair (its underlay), so the knitting is unchanged.
      await expect.poll(() => change.textContent(), POLL).toMatch(/^Since the version you opened: \+1 duplicate stitch, \+2 ends: \+£\d+\.\d\d$/);
      expect(await page.getByTestId("live-price-total").textContent()).not.toBe(totalBefore);
      await expectAccessible(page);

      // compare from here: the difference starts again from the painted chart
      await page.getByRole("button", { name: "Compare from here" }).click();
      await expect.poll(() => change.textContent(), POLL).toBe("No change since you chose to compare.");
    }));
});
