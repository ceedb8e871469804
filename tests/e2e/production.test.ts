// Production in Chromium: the assistant times a stage on a phone, the owner sees the hours on the
// board and in the insights table view. Uses the demo "Watch cap" piece (only this file logs on it).
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, PHONE, POLL, signInAs, withPage } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function hatHours(page: Page): Promise<string> {
  const card = page.locator("li", { has: page.getByRole("link", { name: "Hat", exact: true }) });
  return (await card.getByTestId("piece-hours").textContent()) ?? "";
}

async function insightsTable(page: Page): Promise<string> {
  await page.goto("/studio/insights");
  await page.getByText("Table view: hours per stage per month").click();
  const table = page.getByRole("table", { name: "hours per stage per month" });
  await table.waitFor();
  return (await table.textContent()) ?? "";
}

describe("logging hours", () => {
  test("the assistant starts and stops a timer on a phone; the owner sees the hours on the board and in insights", async () => {
    let boardBefore = "";
    let insightsBefore = "";
    await withPage(browser, "production-owner-before", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto("/studio/board");
      await expectAccessible(page);
      boardBefore = await hatHours(page);
      expect(boardBefore).toMatch(/^Logged /);
      insightsBefore = await insightsTable(page);
      await expectAccessible(page);
      await page.goto("/studio/schedule");
      await expect.poll(() => page.getByRole("heading", { name: "Timeline per person" }).count(), POLL).toBe(1);
      await expectAccessible(page);
      await page.goto("/studio/yarns");
      await expect.poll(() => page.getByRole("heading", { name: "To buy" }).count(), POLL).toBe(1);
      await expectAccessible(page);
    });

    await withPage(
      browser,
      "production-assistant-phone",
      async (page) => {
        await signInAs(page, "tobias@hollin.test");
        await page.waitForURL(`${BASE}/studio`);
        await page.goto("/studio/log");
        await expectAccessible(page);
        // A run that failed half-way may have left a timer: stop it first.
        if (await page.getByRole("button", { name: "Stop and log" }).count()) {
          await page.getByRole("button", { name: "Stop and log" }).click();
          await expect.poll(() => page.getByRole("heading", { name: "Start a timer" }).count(), POLL).toBe(1);
        }
        await page.getByRole("button", { name: /^Start knitting: Hat/ }).click();
        await expect.poll(() => page.getByRole("heading", { name: /Running: Knitting/ }).count(), POLL).toBe(1);
        await expectAccessible(page);
        // The timer lives on the server: a reload still shows it.
        await page.reload();
        await expect.poll(() => page.getByRole("button", { name: "Pause" }).count(), POLL).toBe(1);
        await page.getByRole("button", { name: "Pause" }).click();
        await expect.poll(() => page.getByRole("heading", { name: /Paused: Knitting/ }).count(), POLL).toBe(1);
        await page.getByRole("button", { name: "Resume knitting" }).click();
        await expect.poll(() => page.getByRole("heading", { name: /Running: Knitting/ }).count(), POLL).toBe(1);
        // Let the clock count a few seconds, so the stop records a minute (a started timer logs at least one).
        await expect.poll(async () => (await page.getByTestId("timer-clock").textContent())?.trim(), POLL).toMatch(/^0:00:(0[3-9]|[1-5]\d)$/);
        await page.getByRole("button", { name: "Stop and log" }).click();
        await expect.poll(() => page.getByText(/^Stopped: \d+ min logged\./).count(), POLL).toBe(1);
        await expectAccessible(page);
      },
      PHONE,
    );

    await withPage(browser, "production-owner-after", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto("/studio/board");
      await expect.poll(() => hatHours(page), POLL).not.toBe(boardBefore);
      await expectAccessible(page);
      expect(await insightsTable(page)).not.toBe(insightsBefore);
      // The piece page shows the assistant's entry.
      await page.goto("/studio/board");
      await page.getByRole("link", { name: "Hat", exact: true }).click();
      await page.waitForURL(/\/studio\/pieces\//);
      await expect.poll(() => page.getByText("Tobias Venn", { exact: false }).count(), POLL).toBeGreaterThan(0);
      await expectAccessible(page);
    });

    // On the phone, a refused correction is shown at the entry, on screen, not at the top of the page.
    await withPage(
      browser,
      "production-correction-phone",
      async (page) => {
        await signInAs(page, "tobias@hollin.test");
        await page.waitForURL(`${BASE}/studio`);
        await page.goto("/studio/board");
        await page.getByRole("link", { name: "Hat", exact: true }).first().click();
        await page.waitForURL(/\/studio\/pieces\//);
        const entry = page.locator("li", { has: page.getByRole("button", { name: "Save correction" }) }).first();
        await entry.scrollIntoViewIfNeeded();
        // The timer entry just logged ended a moment ago: ten hours more would end in the future.
        await entry.getByLabel("Minutes").fill("600");
        await entry.getByRole("button", { name: "Save correction" }).click();
        const message = entry.getByTestId("entry-error");
        await expect.poll(() => message.textContent(), POLL).toMatch(/future|overlaps/i);
        await expect.poll(async () => {
          const box = await message.boundingBox();
          return box !== null && box.y >= 0 && box.y + box.height <= 844;
        }, POLL).toBe(true);
        await page.screenshot({ path: "test-results/e2e/correction-refused-phone.png" });
        await expectAccessible(page);
      },
      PHONE,
    );
  });
});
