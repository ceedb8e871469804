// The client's commission list marks a commission with messages they have not read; opening the
// thread clears the mark.
import { randomBytes } from "node:crypto";
import type { Browser } from "playwright-core";
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

/** A commission of this file's own for Saoirse, with two messages from Maren she has not read. */
async function commissionWithMessages(title: string): Promise<string> {
  return withDb(async (client) => {
    await client.query("begin");
    const id = await insertDemoCommission(client, { clientEmail: "saoirse@example.test", title, state: "quoting" });
    await client.query(
      `insert into messages (commission_id, author_user_id, author_role, body, client_key)
       select $1, u.id, 'owner', b.body, b.k from "user" u, (values ('The yarn is here.', 'e2e-1'), ('Swatching tonight.', 'e2e-2')) as b(body, k)
       where u.email = 'maren@hollin.test'`,
      [id],
    );
    await client.query("commit");
    return id;
  });
}

describe("unread messages on the commission list", () => {
  test("two new messages are marked; reading the thread clears the mark", async () => {
    const title = `Unread hat ${randomBytes(3).toString("hex")}`;
    const id = await commissionWithMessages(title);
    await withPage(browser, "unread-badge", async (page) => {
      await signInAs(page, "saoirse@example.test");
      await page.waitForURL(`${BASE}/portal`);
      const badge = page.getByRole("link", { name: `2 new messages on ${title}` });
      await expect.poll(() => badge.count(), POLL).toBe(1);
      await expectAccessible(page);
      await badge.click();
      await page.waitForURL(`${BASE}/portal/commissions/${id}#messages`);
      await expect.poll(() => page.getByText("Swatching tonight.").count(), POLL).toBe(1);
      await page.goto("/portal");
      await expect.poll(() => page.getByRole("link", { name: title, exact: true }).count(), POLL).toBe(1);
      expect(await page.getByRole("link", { name: `2 new messages on ${title}` }).count()).toBe(0);
    });
  });
});
