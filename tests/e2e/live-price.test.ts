import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { randomBytes } from "node:crypto";
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

describe("the live price in the chart editor", () => {
  test("painting a third colour into a row prices the darning in the browser", () =>
    withPage(browser, "live-price", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      // The live price reads the whole garment: a child's pair sized from the brief at the chart's
      // gauge, with a back-of-hand chart at that area's size (stripes inside its shape only).
      const title = `Live price mittens ${randomBytes(3).toString("hex")}`;
      const id = await withDb((c) => insertDemoCommission(c, { clientEmail: "priya@example.test", title, garment: "mittens", brief: { sizeLabel: "child" } }));
      const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
      const back = sizeGarment({ garment: "mitten", size: "child", gauge }).charts.find((a) => a.area === "back of hand")!;
      const W = back.width;
      const H = back.height;
      const chart = createChart(W, H, gauge, [
        { key: "A", name: "Gull white", hex: "#F2EEE4" },
        { key: "B", name: "Lichen green", hex: "#6F8A5B" },
        { key: "C", name: "Rowanberry", hex: "#9E2B25" },
      ]);
      for (let y = 0; y < H; y++) {
        const mask = rowShape(back, y);
        for (let x = 0; x < W; x++) chart.cells[y * W + x] = mask[x] ? x % 2 : 0;
      }
      const res = await page.request.post("/api/designs", {
        data: { commissionId: id, title: `E2E live price ${Date.now()}`, charts: [{ area: "back-of-hand", label: "Back of hand", chart: serializeChart(chart) }] },
      });
      expect(res.status()).toBe(201);
      const designId = (await res.json()).design.id as string;
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
      // The darned stitch is knitted first in the pair (its underlay), so the knitting is unchanged;
      // the chart is worked on both mittens, so it is darned twice, with two ends each.
      await expect.poll(() => change.textContent(), POLL).toMatch(/^Since the version you opened: \+2 duplicate stitches, \+4 ends: \+£\d+\.\d\d$/);
      expect(await page.getByTestId("live-price-total").textContent()).not.toBe(totalBefore);
      await expectAccessible(page);

      // compare from here: the difference starts again from the painted chart
      await page.getByRole("button", { name: "Compare from here" }).click();
      await expect.poll(() => change.textContent(), POLL).toBe("No change since you chose to compare.");

      // Outside the shape (the narrowing top): greyed, and paint there is refused with its place.
      expect(Number(await canvas.getAttribute("data-outside-cells"))).toBeGreaterThan(0);
      await canvas.click({ position: { x: zoom / 2, y: rowPx / 2 } });
      await expect.poll(() => page.getByText(`Not painted: row ${H} from the bottom, stitch ${W} from the right is outside the shape`, { exact: false }).count(), POLL).toBe(1);
      expect(await change.textContent()).toBe("No change since you chose to compare.");

      // Pin a pair for a range of rounds (under the round-by-round table). Rowanberry is darned, so
      // pinning it as knitted is refused, naming the round that holds all three colours.
      await page.getByText("Round by round: what is knitted and what is darned", { exact: false }).click();
      const pinsForm = page.getByTestId("pins-form");
      const last = await pinsForm.getByLabel("To round").getAttribute("max");
      await pinsForm.getByLabel("From round").fill("1");
      await pinsForm.getByLabel("To round").fill(String(last));
      await pinsForm.getByLabel("First colour").selectOption({ label: "Gull white" });
      await pinsForm.getByLabel("Second colour").selectOption({ label: "Rowanberry" });
      await pinsForm.getByRole("button", { name: "Pin this pair" }).click();
      await expect
        .poll(() => page.getByTestId("pin-problem").textContent(), POLL)
        .toMatch(/^Not pinned: Round \d+ of the .+ holds Gull white, Lichen green and Rowanberry: pinning Gull white and Rowanberry there would knit three colours with nothing darned/);
      // Two knitted colours over rounds 1–2: listed, and saved with the next version.
      await pinsForm.getByLabel("To round").fill("2");
      await pinsForm.getByLabel("Second colour").selectOption({ label: "Lichen green" });
      await pinsForm.getByRole("button", { name: "Pin this pair" }).click();
      await expect.poll(() => page.getByTestId("pins-list").textContent(), POLL).toContain("rounds 1–2: Gull white and Lichen green");
      await expectAccessible(page);
      const savedPins = async () => {
        const list = await (await page.request.get(`/api/designs/${designId}/versions`)).json();
        const newest = list.versions[0];
        const one = await (await page.request.get(`/api/designs/${designId}/versions/${newest.id}`)).json();
        // stored as JSON (keys come back in the database's order): compared as values
        const pins = (one.version.charts[0].options?.pins ?? []) as { fromRound: number; toRound: number; pair: string[] }[];
        return pins.map((p) => `${p.fromRound}–${p.toRound} ${p.pair.join("")}`);
      };
      await expect.poll(savedPins, POLL).toEqual(["1–2 AB"]);
    }));
});
