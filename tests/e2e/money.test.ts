// Quote → acceptance → deposit in Chromium: the maker prices a commission of this file's own with
// the live price, sends it (the PDF downloads, the e-mail arrives), the client accepts it in the
// portal, pays the deposit on the local payments page, sees the commission booked (the signed
// webhook reached the app) and downloads the receipt; the maker invoices the balance when the piece
// is ready, the client pays it, and the maker sees both payments in the table.
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

/** A fresh commission for Priya at the demo studio, in "Request received". */
async function freshCommission(title: string): Promise<string> {
  return withDb(async (client) => {
    await client.query("begin");
    const id = await insertDemoCommission(client, { clientEmail: "priya@example.test", title, garment: "hat", state: "enquiry", neededBy: "2027-06-01" });
    await client.query("commit");
    return id;
  });
}

/** Production belongs to another area (and its own tests): here the piece is put at "Ready" directly. */
async function markReady(commissionId: string) {
  await withDb((client) => client.query("update commissions set state = 'ready' where id = $1 and state = 'booked'", [commissionId]));
}

async function payOnHostedPage(page: Page, id: string, kind: "deposit" | "balance") {
  await page.getByRole("button", { name: `Pay the ${kind}` }).click();
  await page.waitForURL(/\/pay\/cs_test_/);
  await expectAccessible(page);
  await page.getByRole("button", { name: /^Pay / }).click();
  await page.waitForURL(new RegExp(`/portal/commissions/${id}\\?paid=${kind}`));
  // Back from paying, the page does not offer to pay again while it waits for the confirmation.
  expect(await page.getByRole("button", { name: `Pay the ${kind}` }).count()).toBe(0);
  // Paid only once the signed webhook has reached the app (the return address proves nothing); the
  // page asks the server by itself and refreshes when it has, with no reload.
  await expect
    .poll(() => page.getByText(new RegExp(`${kind === "deposit" ? "Deposit" : "Balance"}: .* — paid`)).count(), { timeout: 30_000, interval: 500 })
    .toBe(1);
}

/** Signs in and waits until the home page has settled, so the next navigation is not cut short. */
async function signInTo(page: Page, email: string) {
  await signInAs(page, email);
  const studio = email.endsWith("@hollin.test");
  await page.waitForURL(`${BASE}${studio ? "/studio" : "/portal"}`);
  await expect.poll(() => page.getByRole("heading", { level: 1, name: studio ? "Commissions" : "My commissions" }).count(), POLL).toBe(1);
  await page.waitForLoadState("networkidle");
}

async function expectPdf(page: Page, href: string) {
  const res = await page.request.get(new URL(href, BASE).toString());
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toBe("application/pdf");
  expect((await res.body()).subarray(0, 5).toString()).toBe("%PDF-");
}

describe("quote, acceptance and deposit", () => {
  test("the maker quotes, the client accepts and pays the deposit, the commission is booked", async () => {
    const title = `Gift hat ${randomBytes(3).toString("hex")}`;
    const id = await freshCommission(title);

    await withPage(browser, "money-maker-quotes", async (page) => {
      await signInTo(page, "maren@hollin.test");
      await page.goto(`/studio/commissions/${id}`);
      await page.getByRole("link", { name: "Build a quote" }).click();
      await page.waitForURL(`${BASE}/studio/commissions/${id}/quote`);
      await expectAccessible(page);
      const total = page.getByTestId("quote-total");
      const before = await total.textContent();
      // The live price follows the inputs in the browser, with no round trip.
      await page.getByLabel("Duplicate stitches").first().fill("400");
      await expect.poll(() => total.textContent(), POLL).not.toBe(before);
      await page.getByLabel("Shipping").fill("4.50");
      await page.getByRole("button", { name: "Save and send to the client" }).click();
      await expect.poll(() => page.getByText("Version 1 sent to the client.").count(), POLL).toBe(1);
      await page.reload();
      const pdf = page.getByRole("link", { name: "Quote version 1 (PDF)" });
      await expect.poll(() => pdf.count(), POLL).toBe(1);
      await expectPdf(page, (await pdf.getAttribute("href"))!);
      // Editing again shows what changed against the sent version.
      await page.getByLabel("Ends to weave in").first().fill("20");
      await expect.poll(() => page.getByTestId("price-change").textContent(), POLL).toMatch(/ends: \+£/);
    });

    await expect
      .poll(async () => {
        const list = (await (await fetch(`${MAIL_API}/messages?to=${encodeURIComponent("priya@example.test")}`)).json()) as { subject: string; attachments: { contentType: string }[] }[];
        return list.some((m) => m.subject.includes(title) && m.attachments.some((a) => a.contentType === "application/pdf"));
      }, { timeout: 30_000, interval: 250 })
      .toBe(true);

    await withPage(browser, "money-client-accepts-and-pays", async (page) => {
      await signInTo(page, "priya@example.test");
      await page.goto(`/portal/commissions/${id}`);
      await expect.poll(() => page.getByRole("heading", { name: "Quote (version 1)" }).count(), POLL).toBe(1);
      await expectAccessible(page);
      // Accepting without the tick is refused and keeps the typed name.
      await page.getByLabel("Your full name").fill("Priya Okafor");
      await page.getByRole("button", { name: "Accept the quote" }).click();
      await expect.poll(() => page.getByText("Tick the box to accept").count(), POLL).toBe(1);
      expect(await page.getByLabel("Your full name").inputValue()).toBe("Priya Okafor");
      await page.getByRole("checkbox", { name: /I accept this quote/ }).check();
      await page.getByRole("button", { name: "Accept the quote" }).click();
      await expect.poll(() => page.getByText("You accepted this quote").count(), POLL).toBe(1);
      await page.reload();
      await payOnHostedPage(page, id, "deposit");
      await expect.poll(() => page.getByText("Booked").count(), POLL).toBeGreaterThan(0);
      await expectAccessible(page);
      const receipt = page.getByRole("link", { name: /^Receipt RCT-\d+ \(PDF\)$/ });
      await expect.poll(() => receipt.count(), POLL).toBe(1);
      await expectPdf(page, (await receipt.getAttribute("href"))!);
    });

    await markReady(id);
    await withPage(browser, "money-maker-invoices-balance", async (page) => {
      await signInTo(page, "maren@hollin.test");
      await page.goto(`/studio/commissions/${id}`);
      await page.getByRole("button", { name: "Send the balance invoice" }).click();
      // The invoice is listed once issued (the button goes: the balance has been asked for).
      await expect.poll(() => page.getByRole("link", { name: /^Invoice INV-\d+ \(PDF\)$/ }).count(), POLL).toBe(1);
      await expectAccessible(page);
    });

    await withPage(browser, "money-client-pays-balance", async (page) => {
      await signInTo(page, "priya@example.test");
      await page.goto(`/portal/commissions/${id}`);
      await payOnHostedPage(page, id, "balance");
      await expect.poll(() => page.getByText("Paid in full").count(), POLL).toBeGreaterThan(0);
      await expect.poll(() => page.getByRole("link", { name: /^Invoice INV-\d+ \(PDF\)$/ }).count(), POLL).toBe(1);
    });

    await withPage(browser, "money-maker-sees-payment", async (page) => {
      await signInTo(page, "maren@hollin.test");
      await page.goto("/studio/payments?status=paid");
      await expect.poll(() => page.getByRole("link", { name: new RegExp(title) }).count(), POLL).toBe(2);
      await expectAccessible(page);
      const res = await page.request.get(`${BASE}/api/payments/export?status=paid`);
      expect(res.headers()["content-type"]).toContain("text/csv");
      expect(await res.text()).toContain(title);
    });
  });
});
