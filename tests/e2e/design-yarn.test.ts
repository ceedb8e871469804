// The quote builder shows the yarn the demo hat's design needs per studio yarn, and its button
// copies those skeins into the quote's yarn lines (nothing is saved here).
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";
import { withDb } from "./demo-db";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const demoCommission = (title: string) =>
  withDb(async (client) => {
    const r = await client.query<{ id: string }>("select c.id from commissions c join studios s on s.id = c.studio_id where s.slug = 'hollin-knitworks' and c.title = $1", [title]);
    return r.rows[0].id;
  });

describe("yarn from the design", () => {
  test("the hat's colours are matched to the studio's yarns, with metres and skeins, and can fill the quote", async () => {
    const id = await demoCommission("Watch cap with E.B. band");
    await withPage(browser, "design-yarn-quote", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto(`/studio/commissions/${id}/quote`);
      const panel = page.getByRole("region", { name: /Yarn from the design/ });
      await expect.poll(() => panel.count(), POLL).toBe(1);
      await expectAccessible(page);
      const table = panel.getByRole("table", { name: "Yarn per colour from the design" });
      // Peat brown carries the band's ground and the plain brim and crown. The letters' rounds hold
      // only Peat brown and Rowanberry, so the garment knits Rowanberry (two colours a round) instead
      // of darning it as the single-pair plan of the chart alone did.
      const brown = table.getByRole("row", { name: /Skerry 4-ply, Peat brown/ });
      await expect.poll(() => brown.count(), POLL).toBe(1);
      expect(await brown.textContent()).toMatch(/knitted/);
      expect(await table.getByRole("row", { name: /Rowanberry/ }).textContent()).toMatch(/knitted/);
      expect(await panel.textContent()).toMatch(/Every stitch of the hat \(.*\), sized from the brief's measurements/);
      // Remove every yarn line, then let the design fill them back in.
      while ((await page.getByRole("button", { name: /^Remove yarn/ }).count()) > 0) {
        await page.getByRole("button", { name: /^Remove yarn/ }).first().click();
      }
      await panel.getByRole("button", { name: "Use these skeins" }).click();
      await expect.poll(() => page.getByRole("button", { name: /^Remove yarn/ }).count(), POLL).toBe(3);
      await expect.poll(() => page.getByLabel("Yarn 1", { exact: true }).locator("option:checked").textContent(), POLL).toMatch(/Peat brown/);
      expect(await page.getByLabel("Skeins of yarn 1").inputValue()).toBe("1");
    });
  });
});
