// Nothing lost, errors a person can act on: the request draft keeps every valid field through a
// reload while one field is wrong; the quote builder asks before unsaved changes are left behind,
// keeps them on the device, shows each error on its field, and waits for valid input to price.
import { randomBytes } from "node:crypto";
import type { Browser } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";
import { insertDemoCommission, withDb } from "./demo-db";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("the request draft", () => {
  test("one invalid field is marked and named; a reload keeps every other field and the photo", async () => {
    await withPage(browser, "forms-request-draft", async (page) => {
      const photo = await sharp({ create: { width: 80, height: 60, channels: 3, background: "#5b6f8a" } }).jpeg().toBuffer();
      await page.goto("/studios/hollin-knitworks");
      await page.getByLabel("Mittens", { exact: true }).check();
      await page.getByLabel("Size, if you know it").fill("Woman M");
      await page.getByLabel("Anything else").fill("Warm enough for the ferry.");
      await page.getByLabel(/Reference photos/).setInputFiles({ name: "idea.jpg", mimeType: "image/jpeg", buffer: photo });
      await expect.poll(() => page.getByRole("img", { name: "Reference photo 1" }).count(), POLL).toBe(1);
      // Characters the lettering cannot knit: the draft is still saved, and says what is wrong.
      await page.getByLabel("Initials or a name to knit in").fill("A<B>");
      await expect.poll(() => page.getByText("Draft saved, except the initials or name", { exact: false }).count(), POLL).toBe(1);
      expect(await page.getByText("check your connection", { exact: false }).count()).toBe(0);
      expect(await page.getByLabel("Initials or a name to knit in").getAttribute("aria-invalid")).toBe("true");
      await expectAccessible(page);

      // Leaving now asks first (the lettering is not saved), so the reload is answered with "leave".
      page.once("dialog", (d) => void d.accept());
      await page.reload();
      await expect.poll(() => page.getByLabel("Size, if you know it").inputValue(), POLL).toBe("Woman M");
      expect(await page.getByLabel("Anything else").inputValue()).toBe("Warm enough for the ferry.");
      expect(await page.getByLabel("Mittens", { exact: true }).isChecked()).toBe(true);
      expect(await page.getByRole("img", { name: "Reference photo 1" }).count()).toBe(1);
    });
  });
});

describe("the quote builder", () => {
  test("errors land on their fields, the price waits for valid input, and unsaved changes are guarded and kept", async () => {
    const title = `Forms hat ${randomBytes(3).toString("hex")}`;
    const id = await withDb((c) => insertDemoCommission(c, { clientEmail: "priya@example.test", title, garment: "mittens", brief: { sizeLabel: "child" } }));
    await withPage(browser, "forms-quote-builder", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto(`/studio/commissions/${id}/quote`);
      await expect.poll(() => page.getByTestId("quote-total").count(), POLL).toBe(1);

      // A message one character over the limit: counted, refused on its field, and no price until corrected.
      const message = page.getByLabel("Message to the client");
      await message.fill("x".repeat(2001));
      await expect.poll(() => page.getByText("2,001 of 2,000 characters", { exact: false }).count(), POLL).toBe(1);
      expect(await message.getAttribute("aria-invalid")).toBe("true");
      expect(await page.getByText("Keep the message to 2,000 characters or fewer.").count()).toBe(1);
      expect(await page.getByTestId("quote-total").count()).toBe(0);
      expect(await page.getByTestId("quote-total-waiting").count()).toBe(1);
      // Saving is not silently disabled: the reason is beside the button, and pressing it names the field.
      expect(await page.getByTestId("quote-save-blocked").textContent()).toContain("Correct the marked fields");
      await page.getByRole("button", { name: "Save draft" }).click();
      await expect.poll(() => page.getByTestId("quote-status").textContent(), POLL).toContain("the message to the client");
      await expectAccessible(page);

      // The server says the same on the same field (for a body that skipped the page's check).
      const res = await page.request.post(`/api/commissions/${id}/quotes`, {
        data: { pieces: [{ label: "Hat" }], materials: [], messageToClient: "y".repeat(2001) },
      });
      expect(res.status()).toBe(422);
      const body = (await res.json()) as { error: { fieldErrors: Record<string, string[]> } };
      expect(body.error.fieldErrors.messageToClient?.join(" ")).toContain("Keep the message to 2,000 characters or fewer.");

      // A discount larger than the work: in money, on the discount field.
      await message.fill("Thank you for the commission.");
      await page.getByLabel("Discount").fill("99999");
      await expect.poll(() => page.getByLabel("Discount").getAttribute("aria-invalid"), POLL).toBe("true");
      expect(await page.getByText("The discount (£99,999.00) is larger than the work and materials (£", { exact: false }).count()).toBeGreaterThan(0);
      expect(await page.getByText("minor units", { exact: false }).count()).toBe(0);
      await page.getByLabel("Discount").fill("");
      await expect.poll(() => page.getByTestId("quote-total").count(), POLL).toBe(1);

      // Unsaved changes: an in-app link asks first; answering "stay" keeps the page and the work.
      const asked: string[] = [];
      page.on("dialog", (d) => {
        asked.push(d.type());
        void d.dismiss();
      });
      await page.getByRole("link", { name: "Change in settings" }).click();
      await expect.poll(() => asked.length, POLL).toBe(1);
      expect(asked[0]).toBe("confirm");
      expect(new URL(page.url()).pathname).toBe(`/studio/commissions/${id}/quote`);
      expect(await message.inputValue()).toBe("Thank you for the commission.");

      // Closing the tab asks too (beforeunload), and the page stays when the answer is "stay".
      await page.close({ runBeforeUnload: true });
      await expect.poll(() => asked.includes("beforeunload"), POLL).toBe(true);
      expect(page.isClosed()).toBe(false);

      // The unsaved quote is kept on this device and offered back on the next visit.
      const again = await page.context().newPage();
      again.on("dialog", (d) => {
        asked.push(d.type());
        void d.dismiss();
      });
      await again.goto(`/studio/commissions/${id}/quote`);
      await expect.poll(() => again.getByText("A quote you did not save").count(), POLL).toBe(1);
      await again.getByRole("button", { name: "Restore those changes" }).click();
      expect(await again.getByLabel("Message to the client").inputValue()).toBe("Thank you for the commission.");
      await again.getByRole("button", { name: "Save draft" }).click();
      await expect.poll(() => again.getByText("Draft version 1 saved.").count(), POLL).toBe(1);
      // Saved: leaving asks nothing now.
      const before = asked.length;
      await again.getByRole("link", { name: "Change in settings" }).click();
      await again.waitForURL(/\/studio\/settings/);
      expect(asked.length).toBe(before);
    });
  });
});
