// The sizing page in Chromium: the brief's head size opens it, an inch value typed in the cm field
// is caught and the inches suggested, the cast-on and recipe follow the gauge as it is typed, the
// saved sizing shows on the commission page and opens a new design at its chart sizes.
import { randomBytes } from "node:crypto";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, PHONE, POLL, signInAs, withPage } from "./browser";
import { insertDemoCommission, withDb } from "./demo-db";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** A hat commission of this file's own for Elias at the demo studio, with a 57 cm head in the brief. */
const freshHat = (title: string) =>
  withDb((client) => insertDemoCommission(client, { clientEmail: "elias@example.test", title, state: "quoting", brief: { measurements: { headCircumferenceCm: 57 } } }));

describe("sizing a commission", () => {
  test("measurements and gauge give the cast-on and recipe live; the saved sizing sizes the design", async () => {
    const id = await freshHat(`Sized hat ${randomBytes(3).toString("hex")}`);
    await withPage(browser, "sizing-hat", async (page) => {
      await signInAs(page, "tobias@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto(`/studio/commissions/${id}`);
      await page.getByRole("link", { name: "Work out the sizing" }).click();
      await page.waitForURL(`${BASE}/studio/commissions/${id}/sizing`);
      const head = page.getByLabel(/^Head \(cm\)/);
      expect(await head.inputValue()).toBe("57");
      const castOn = page.getByTestId("sizing-cast-on");
      await expect.poll(() => castOn.textContent(), POLL).toMatch(/Cast on \d+ sts/);
      await expectAccessible(page);

      // An inch value in the cm field: caught, the inches suggested, nothing sized.
      await head.fill("22");
      await expect.poll(() => page.getByText(/did you mean 22 in = 55\.9 cm\? Switch the units to inches\./).count(), POLL).toBe(1);
      expect(await castOn.count()).toBe(0);
      await page.getByRole("radio", { name: "Inches" }).check();
      await page.getByLabel(/^Head \(in\)/).fill("22");
      await expect.poll(() => castOn.textContent(), POLL).toMatch(/Cast on \d+ sts/);

      // A looser gauge casts on fewer stitches, at once.
      const before = Number((await castOn.textContent())!.match(/\d+/)![0]);
      await page.getByLabel(/^Stitches over 10 cm/).fill("28");
      await page.getByLabel(/^Rounds over 10 cm/).fill("32");
      await expect.poll(async () => Number((await castOn.textContent())!.match(/\d+/)![0]), POLL).toBeLessThan(before);
      const count = Number((await castOn.textContent())!.match(/\d+/)![0]);
      expect(await page.getByTestId("sizing-recipe").textContent()).toContain(`Cast on ${count} sts`);
      // The recipe is in inches now; the metric one is a click away.
      expect(await page.getByTestId("sizing-recipe").textContent()).toMatch(/ in\b/);

      await page.getByRole("button", { name: "Save this sizing" }).click();
      await expect.poll(() => page.getByText(/Sizing saved/).count(), POLL).toBe(1);

      await page.goto(`/studio/commissions/${id}`);
      await expect.poll(() => page.getByText(new RegExp(`Cast on ${count} sts at 28 sts and 32 rnds per 10 cm`)).count(), POLL).toBe(1);
      await page.getByRole("link", { name: "Start the design" }).click();
      await expect.poll(() => page.getByText(/Chart sizes from the commission's saved sizing at 28 sts and 32 rows per 10 cm/).count(), POLL).toBe(1);
      await expect.poll(() => page.getByText(new RegExp(`Band: ${count} stitches × \\d+ rows`)).count(), POLL).toBe(1);
    });
  });

  test("on a phone the page reads in one column and passes the accessibility check", async () => {
    const id = await freshHat(`Phone hat ${randomBytes(3).toString("hex")}`);
    await withPage(
      browser,
      "sizing-phone",
      async (page) => {
        await signInAs(page, "maren@hollin.test");
        await page.waitForURL(`${BASE}/studio`);
        await page.goto(`/studio/commissions/${id}/sizing`);
        await expect.poll(() => page.getByTestId("sizing-cast-on").count(), POLL).toBe(1);
        await expectAccessible(page);
        const width = await page.evaluate(() => document.documentElement.scrollWidth);
        expect(width).toBeLessThanOrEqual(PHONE.viewport.width + 1);
      },
      PHONE,
    );
  });
});
