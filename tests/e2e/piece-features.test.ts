// The maker corrects a piece's features on the piece page and the stage estimate follows.
import { randomBytes } from "node:crypto";
import pg from "pg";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** A commission of this file's own in production with one hat piece, set up with few darned stitches. */
async function pieceInProduction(title: string): Promise<string> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    await client.query("begin");
    const s = await client.query<{ id: string; no: number }>(
      "update studios set next_commission_no = next_commission_no + 1 where slug = 'hollin-knitworks' returning id, next_commission_no - 1 as no",
    );
    const c = await client.query<{ id: string }>(
      `insert into commissions (studio_id, client_id, number, title, garment, wearer, state, currency, brief)
       select $1, sc.id, $2, $3, 'hat', 'adult', 'in_production', 'GBP', '{}'::jsonb
       from studio_clients sc join "user" u on u.id = sc.user_id where sc.studio_id = $1 and u.email = 'priya@example.test'
       returning id`,
      [s.rows[0].id, s.rows[0].no, title],
    );
    const p = await client.query<{ id: string }>(
      `insert into pieces (studio_id, commission_id, name, features, estimate)
       values ($1, $2, 'Hat', '{"plainStitches":6000,"strandedStitches":3000,"duplicateStitches":20,"ends":2}'::jsonb,
               '{"knitting":{"p50":600,"p80":720},"embroidery":{"p50":10,"p80":15},"blocking":{"p50":20,"p80":30},"finishing":{"p50":20,"p80":30}}'::jsonb)
       returning id`,
      [s.rows[0].id, c.rows[0].id],
    );
    await client.query("commit");
    return p.rows[0].id;
  } finally {
    await client.end();
  }
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
