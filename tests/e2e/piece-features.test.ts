// The maker corrects a piece's features on the piece page and the stage estimate follows.
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

/** A commission of this file's own in production with one hat piece, set up with few darned stitches. */
async function pieceInProduction(title: string): Promise<string> {
  return withDb(async (client) => {
    await client.query("begin");
    const id = await insertDemoCommission(client, { clientEmail: "priya@example.test", title, state: "in_production" });
    const p = await client.query<{ id: string }>(
      `insert into pieces (studio_id, commission_id, name, features, estimate)
       select studio_id, id, 'Hat', '{"plainStitches":6000,"strandedStitches":3000,"duplicateStitches":20,"ends":2}'::jsonb,
              '{"knitting":{"p50":600,"p80":720},"embroidery":{"p50":10,"p80":15},"blocking":{"p50":20,"p80":30},"finishing":{"p50":20,"p80":30}}'::jsonb
       from commissions where id = $1
       returning id`,
      [id],
    );
    await client.query("commit");
    return p.rows[0].id;
  });
}

describe("a piece's features", () => {
  test("more duplicate stitches raise the embroidery estimate on the piece page", async () => {
    const id = await pieceInProduction(`Feature hat ${randomBytes(3).toString("hex")}`);
    await withPage(browser, "piece-features", async (page) => {
      await signInAs(page, "tobias@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await page.goto(`/studio/pieces/${id}`);
      const embroidery = page.getByRole("row", { name: /^Embroidery/ });
      await expect.poll(() => embroidery.count(), POLL).toBe(1);
      const before = await embroidery.textContent();
      await page.getByLabel("Duplicate stitches").fill("900");
      await page.getByLabel("Ends to weave in").fill("24");
      await page.getByRole("button", { name: "Save the features" }).click();
      await expect.poll(() => page.getByText(/Saved\. The stage estimates above/).count(), POLL).toBe(1);
      await expect.poll(() => embroidery.textContent(), POLL).not.toBe(before);
      await expectAccessible(page);
      // A bad value is refused on its field and nothing is saved.
      await page.getByLabel("Ends to weave in").fill("-4");
      await page.getByRole("button", { name: "Save the features" }).click();
      await expect.poll(() => page.getByText("Use 0 or more.").count(), POLL).toBe(1);
      await page.reload();
      await expect.poll(() => page.getByLabel("Ends to weave in").inputValue(), POLL).toBe("24");
    });
  });
});
