import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, PHONE, POLL, signInAs, withPage } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("signing in as each demo role", () => {
  test.each([
    { who: "owner", email: "maren@hollin.test", home: "/studio", heading: "Commissions" },
    { who: "assistant", email: "tobias@hollin.test", home: "/studio", heading: "Commissions" },
    { who: "client", email: "priya@example.test", home: "/portal", heading: "My commissions" },
  ])("the $who lands on $home and can sign out", ({ who, email, home, heading }) =>
    withPage(browser, `sign-in-${who}`, async (page) => {
      await page.goto("/");
      await expectAccessible(page);
      await signInAs(page, email);
      await page.waitForURL(`${BASE}${home}`);
      await expect.poll(() => page.getByRole("heading", { level: 1, name: heading }).count(), POLL).toBe(1);
      await expectAccessible(page);
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL(`${BASE}/`);
      await expect.poll(() => page.getByRole("link", { name: "Sign in" }).count(), POLL).toBeGreaterThan(0);
      // Signed out, the area is closed again.
      await page.goto(home);
      expect(new URL(page.url()).pathname).toBe("/sign-in");
    }),
  );

  test.each([
    { who: "owner", email: "maren@hollin.test", form: 1 },
    { who: "assistant", email: "tobias@hollin.test", form: 0 },
  ])("the $who sees the price form $form time(s) on a commission", ({ who, email, form }) =>
    withPage(browser, `price-form-${who}`, async (page) => {
      await signInAs(page, email);
      await page.waitForURL(`${BASE}/studio`);
      await page.getByRole("link", { name: "Watch cap with E.B. band", exact: true }).click();
      await page.waitForURL(/\/studio\/commissions\//);
      await expectAccessible(page);
      expect(await page.getByRole("button", { name: "Save price" }).count()).toBe(form);
    }),
  );

  test("a client cannot open the studio area (404) and sees only their own commissions", () =>
    withPage(browser, "client-isolation", async (page) => {
      await signInAs(page, "saoirse@example.test");
      await page.waitForURL(`${BASE}/portal`);
      await expect.poll(() => page.locator("tbody a").allTextContents(), POLL).toEqual(["First mittens for Aoife"]);
      const res = await page.goto("/studio");
      expect(res?.status()).toBe(404);
      await expectAccessible(page);
    }),
  );

  test("a wrong password shows a clear message and keeps the e-mail typed", () =>
    withPage(
      browser,
      "wrong-password",
      async (page) => {
        await signInAs(page, "priya@example.test", "definitely-wrong");
        await expect.poll(() => page.getByRole("alert").first().textContent(), POLL).toMatch(/do not match an account/);
        expect(await page.getByLabel("E-mail").inputValue()).toBe("priya@example.test");
        expect(await page.getByLabel("Password", { exact: true }).inputValue()).toBe("");
        await expectAccessible(page);
      },
      PHONE,
    ),
  );
});

describe("forms, public pages and errors", () => {
  test("sign-up shows field errors from the schema and keeps what was typed", () =>
    withPage(browser, "sign-up-errors", async (page) => {
      await page.goto("/sign-up?studio=hollin-knitworks");
      await page.getByLabel("Your name").fill("Wren Talbot");
      await page.getByLabel("E-mail").fill("not-an-address");
      await page.getByLabel("Password", { exact: true }).fill("short");
      await page.getByLabel("Password again").fill("shorter");
      await page.getByRole("button", { name: "Create my account" }).click();
      await expect.poll(() => page.getByText("does not look like an e-mail address").count(), POLL).toBe(1);
      expect(await page.getByText("Use at least 10 characters.").count()).toBe(1);
      expect(await page.getByText("The two passwords are not the same.").count()).toBe(1);
      expect(await page.getByLabel("Your name").inputValue()).toBe("Wren Talbot");
      await expectAccessible(page);
    }),
  );

  test("the public studio page and an unknown route", () =>
    withPage(
      browser,
      "public-and-404",
      async (page) => {
        const ok = await page.goto("/studios/hollin-knitworks");
        expect(ok?.status()).toBe(200);
        await expectAccessible(page);
        const missing = await page.goto("/no/such/page");
        expect(missing?.status()).toBe(404);
        await expect.poll(() => page.getByRole("heading", { name: "We could not find that page" }).count(), POLL).toBe(1);
        await expectAccessible(page);
        const noStudio = await page.goto("/studios/no-such-studio");
        expect(noStudio?.status()).toBe(404);
      },
      PHONE,
    ),
  );

  test("the local inbox lists caught mail with working links", () =>
    withPage(browser, "local-inbox", async (page) => {
      // The mail service may hold older reset mail for Elias (an earlier run against it): wait for a new one.
      const message = page.locator("li", { hasText: "To elias@example.test" }).filter({ hasText: "Reset your Darnwell password" });
      await page.goto("/local-inbox");
      const before = await message.count();
      await page.goto("/forgot-password");
      await page.getByLabel("E-mail").fill("elias@example.test");
      await page.getByRole("button", { name: "Send me a reset link" }).click();
      await expect.poll(() => page.getByText("Check your inbox").count(), POLL).toBe(1);
      // The outbox sends within a few seconds; reload the inbox until Elias's new message is there (newest first).
      await expect
        .poll(async () => {
          await page.goto("/local-inbox");
          return message.count();
        }, POLL)
        .toBeGreaterThan(before);
      await expectAccessible(page);
      await message.first().locator("a[href*='/api/auth/reset-password/']").first().click();
      await page.waitForURL(/\/reset-password\?token=/);
      await page.getByLabel("New password", { exact: true }).fill("darnwell-demo");
      await page.getByLabel("New password again").fill("darnwell-demo");
      await page.getByRole("button", { name: "Save my new password" }).click();
      await expect.poll(() => page.getByText("Password changed").count(), POLL).toBe(1);
    }),
  );
});
