// A studio quotes a child's mitten pair from its design and starts production: the quote's knitting
// hours are the production board's estimate for the same pieces (both read the commission's garment).
import { randomBytes } from "node:crypto";
import type { Browser, Page } from "playwright-core";
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

/** "3 h 05 min" / "45 min" → minutes. */
function minutesOf(text: string): number {
  const m = /^(?:(\d+) h )?(\d+) min$/.exec(text.trim());
  if (!m) throw new Error(`not a duration: "${text}"`);
  return Number(m[1] ?? 0) * 60 + Number(m[2]);
}

const totalIn = async (page: Page, testId: string) => {
  const text = (await page.getByTestId(testId).textContent()) ?? "";
  const m = /\(total ([^)]+)\)/.exec(text);
  return m ? minutesOf(m[1]) : NaN;
};

describe("a mitten-pair quote from the design, then production", () => {
  test("the quote's knitting hours equal the board's estimate for the same pieces", async () => {
    const title = `Garment mittens ${randomBytes(3).toString("hex")}`;
    const id = await withDb((c) => insertDemoCommission(c, { clientEmail: "priya@example.test", title, garment: "mittens", brief: { sizeLabel: "child" } }));
    // The app sizes the brief at the chart's gauge; the chart is made at the back of hand's size for that sizing.
    const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
    const back = sizeGarment({ garment: "mitten", size: "child", gauge }).charts.find((a) => a.area === "back of hand")!;
    const chart = createChart(back.width, back.height, gauge, [
      { key: "A", name: "Gull white", hex: "#F2EEE4" },
      { key: "B", name: "Lichen green", hex: "#6F8A5B" },
    ]);
    for (let y = 0; y < back.height; y++) {
      const mask = rowShape(back, y);
      for (let x = 0; x < back.width; x++) if (mask[x] && (x + y) % 4 === 0) chart.cells[y * back.width + x] = 1;
    }

    await withPage(browser, "garment-quote", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      const res = await page.request.post("/api/designs", {
        data: { commissionId: id, title: `${title} design`, charts: [{ area: "back-of-hand", label: "Back of hand", chart: serializeChart(chart) }] },
      });
      expect(res.status()).toBe(201);

      // The quote builder's first draft: the garment's two mittens, one by one.
      await page.goto(`/studio/commissions/${id}/quote`);
      await expect.poll(() => page.getByTestId("quote-knitting").count(), POLL).toBe(1);
      expect(await page.getByRole("group", { name: "left mitten" }).count()).toBe(1);
      expect(await page.getByRole("group", { name: "right mitten" }).count()).toBe(1);
      expect(await page.getByTestId("garment-problems").count()).toBe(0);
      await expectAccessible(page);
      const quoteKnitting = await totalIn(page, "quote-knitting");
      expect(quoteKnitting).toBeGreaterThan(60);
      await page.getByRole("button", { name: "Save draft" }).click();
      await expect.poll(() => page.getByText("Draft version 1 saved.").count(), POLL).toBe(1);

      // Proof approved (the money and proof steps are covered elsewhere): the board offers the garment's pieces.
      await withDb((c) => c.query("update commissions set state = 'proof_approved' where id = $1", [id]));
      await page.goto("/studio/board");
      await expect.poll(() => page.getByRole("form", { name: `Pieces for ${title}` }).count(), POLL).toBe(1);
      const form = page.getByRole("form", { name: `Pieces for ${title}` });
      const waiting = form.locator("xpath=..");
      expect(minutesOf(/\(total ([^)]+)\)/.exec((await waiting.getByTestId("garment-estimate").textContent()) ?? "")![1])).toBe(quoteKnitting);
      await expectAccessible(page);
      await form.getByRole("button", { name: "Start production" }).click();
      await expect.poll(() => page.getByRole("form", { name: `Pieces for ${title}` }).count(), POLL).toBe(0);

      // Each piece's own page: its knitting estimate; together they are the quote's knitting.
      const pieces = await withDb(async (c) => (await c.query<{ id: string; name: string }>("select id, name from pieces where commission_id = $1 order by position", [id])).rows);
      expect(pieces.map((p) => p.name)).toEqual(["Left mitten", "Right mitten"]);
      let board = 0;
      for (const p of pieces) {
        await page.goto(`/studio/pieces/${p.id}`);
        const row = page.getByRole("row", { name: /^Knitting/ });
        await expect.poll(() => row.count(), POLL).toBe(1);
        board += minutesOf((await row.locator("td").first().textContent()) ?? "");
      }
      await expectAccessible(page);
      expect(board).toBe(quoteKnitting);
    });
  });
});
