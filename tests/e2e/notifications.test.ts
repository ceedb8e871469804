// The studio is told in Chromium: the maker sends a quote on a commission of this file's own, the
// client accepts it and pays the deposit on the local payments page; the maker's header count rises
// by two, the list shows both, and each item opens the commission (and is then read).
import { randomBytes } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";
import { insertDemoCommission, withDb } from "./demo-db";

const MAIL_API = process.env.LOCAL_MAIL_API ?? "http://127.0.0.1:2580";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function freshCommission(title: string): Promise<string> {
  return withDb(async (client) => {
    await client.query("begin");
    const id = await insertDemoCommission(client, { clientEmail: "priya@example.test", title, garment: "hat", state: "enquiry", neededBy: "2027-06-01" });
    await client.query("commit");
    return id;
  });
}

async function signInTo(page: Page, email: string) {
  await signInAs(page, email);
  const studio = email.endsWith("@hollin.test");
  await page.waitForURL(`${BASE}${studio ? "/studio" : "/portal"}`);
  await expect.poll(() => page.getByRole("heading", { level: 1, name: studio ? "Commissions" : "My commissions" }).count(), POLL).toBe(1);
  await page.waitForLoadState("networkidle");
}

/** The number in the header link's name ("Notifications, 3 unread", read from its text). */
async function unread(page: Page): Promise<number> {
  const label = (await page.getByTestId("studio-notifications").textContent())?.trim();
  const m = /^(?:Studio )?[Nn]otifications, (\d+) unread$/.exec(label ?? "");
  if (!m) throw new Error(`unexpected header label: ${label}`);
  return Number(m[1]);
}

describe("notifications", () => {
  test("the studio is told of an acceptance and of a payment; each item opens the commission", async () => {
    const title = `Told hat ${randomBytes(3).toString("hex")}`;
    const id = await freshCommission(title);
    let before = 0;

    await withPage(browser, "notify-maker-sends", async (page) => {
      await signInTo(page, "maren@hollin.test");
      before = await unread(page);
      await page.goto(`/studio/commissions/${id}`);
      await page.getByRole("link", { name: "Build a quote" }).click();
      await page.waitForURL(`${BASE}/studio/commissions/${id}/quote`);
      await page.getByLabel("Shipping").fill("4.50");
      await page.getByRole("button", { name: "Save and send to the client" }).click();
      await expect.poll(() => page.getByText("Version 1 sent to the client.").count(), POLL).toBe(1);
    });

    await withPage(browser, "notify-client-accepts-and-pays", async (page) => {
      await signInTo(page, "priya@example.test");
      // The client was told of the quote: their list links to it.
      await page.goto("/portal/notifications");
      await expectAccessible(page);
      await page.getByRole("link", { name: new RegExp(`sent you a quote for ${title}`) }).click();
      await page.waitForURL(new RegExp(`/portal/commissions/${id}#quote$`));
      await expect.poll(() => page.getByRole("heading", { name: "Quote (version 1)" }).count(), POLL).toBe(1);
      await page.getByLabel("Your full name").fill("Priya Okafor");
      await page.getByRole("checkbox", { name: /I accept this quote/ }).check();
      await page.getByRole("button", { name: "Accept the quote" }).click();
      await expect.poll(() => page.getByText("You accepted this quote").count(), POLL).toBe(1);
      await page.reload();
      await page.getByRole("button", { name: "Pay the deposit" }).click();
      await page.waitForURL(/\/pay\/cs_test_/);
      await page.getByRole("button", { name: /^Pay / }).click();
      await page.waitForURL(new RegExp(`/portal/commissions/${id}\\?paid=deposit`));
    });

    await withPage(browser, "notify-maker-is-told", async (page) => {
      await signInTo(page, "maren@hollin.test");
      // The payment is told once the signed webhook has reached the app.
      await expect
        .poll(async () => {
          await page.reload();
          return unread(page);
        }, { timeout: 30_000, interval: 500 })
        .toBe(before + 2);
      await page.getByTestId("studio-notifications").click();
      await page.waitForURL(`${BASE}/studio/notifications`);
      await expectAccessible(page);
      const accepted = page.getByRole("link", { name: new RegExp(`accepted the quote for ${title}`) });
      const paid = page.getByRole("link", { name: new RegExp(`paid the deposit for ${title}`) });
      expect(await accepted.count()).toBe(1);
      expect(await paid.count()).toBe(1);
      await accepted.click();
      await page.waitForURL(new RegExp(`/studio/commissions/${id}#quote-and-payments$`));
      expect(await unread(page)).toBe(before + 1);
      await page.goto("/studio/notifications");
      await paid.click();
      await page.waitForURL(new RegExp(`/studio/commissions/${id}#quote-and-payments$`));
      expect(await unread(page)).toBe(before);
    });

    // And by mail, to the studio's address.
    await expect
      .poll(async () => {
        const list = (await (await fetch(`${MAIL_API}/messages?to=${encodeURIComponent("maren@hollin.test")}`)).json()) as { subject: string }[];
        return ["accepted the quote", "paid the deposit"].every((s) => list.some((m) => m.subject.includes(s) && m.subject.includes(title)));
      }, { timeout: 30_000, interval: 250 })
      .toBe(true);
  });
});
