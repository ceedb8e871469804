// The commission journey in Chromium: a visitor requests a commission with a photo and signs up;
// the maker sends a proof; the client asks for a change on a stitch; the maker sends proof 2; the
// client approves it on a phone. Everything here is new data of this file's own.
import { randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import pg from "pg";
import type { Browser, Page } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, newPage, PHONE, signInAs } from "./browser";

// A generous bound for the page to catch up (a first request may compile or send mail); not a timing assertion.
const POLL = { timeout: 45_000, interval: 150 };

const MAIL_API = process.env.LOCAL_MAIL_API ?? "http://127.0.0.1:2580";
const band = JSON.parse(readFileSync("tests/fixtures/charts/peerie-band.json", "utf8")) as { rows: string[]; palette: unknown[] } & Record<string, unknown>;

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function mailLink(to: string, match: (link: string) => boolean): Promise<string> {
  let found: string | undefined;
  await expect
    .poll(async () => {
      const list = (await (await fetch(`${MAIL_API}/messages?to=${encodeURIComponent(to)}`)).json()) as { links: string[] }[];
      found = list.flatMap((m) => m.links).find(match);
      return Boolean(found);
    }, { timeout: 30_000, interval: 250 })
    .toBe(true);
  return found!;
}

/** The quote and deposit belong to other areas (and their own tests): here the commission is put at "Designing" directly. */
async function startDesigning(commissionId: string) {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    await client.query("update commissions set state = 'designing' where id = $1 and state = 'enquiry'", [commissionId]);
  } finally {
    await client.end();
  }
}

async function shot(page: Page, name: string, body: () => Promise<void>) {
  try {
    await body();
  } catch (err) {
    await page.screenshot({ path: `test-results/e2e/journey-${name}.png`, fullPage: true, timeout: 5000 }).catch(() => undefined);
    throw new Error(`${(err as Error).message}\n(at ${page.url()})`, { cause: err });
  }
}

describe("the commission journey", () => {
  test("request with a photo and sign-up → proof → a change on a stitch → proof 2 → approval on a phone", async () => {
    const tag = randomBytes(3).toString("hex").toUpperCase().replace(/[^A-Z]/g, "Q");
    const lettering = `Z${tag.slice(0, 3)}`;
    const email = `journey-${randomBytes(4).toString("hex")}@e2e.test`;
    const password = "a-long-journey-password";
    const photo = await sharp({ create: { width: 120, height: 90, channels: 3, background: "#6f8a5b" } })
      .withExif({ IFD3: { GPSLatitudeRef: "N", GPSLatitude: "57/1 30/1 0/1" } })
      .jpeg()
      .toBuffer();

    // 1. A signed-out visitor fills in the request, adds a photo and creates an account at the end.
    const visitor = await newPage(browser);
    const page = visitor.page;
    let commissionId = "";
    await shot(page, "request", async () => {
      await page.goto("/studios/hollin-knitworks");
      await page.getByLabel("Mittens", { exact: true }).check();
      await page.getByLabel("A young child (1 to 6 years)", { exact: true }).check();
      // The cautions for a young child's mittens: no cord through the sleeves, no EN 14682 claim.
      await expect.poll(() => page.getByText("No cord through the sleeves").count(), POLL).toBeGreaterThan(0);
      await expect.poll(() => page.getByText("EN 14682 does not apply to mittens and hats", { exact: false }).count(), POLL).toBeGreaterThan(0);
      await expectAccessible(page);
      await page.getByLabel("Size, if you know it").fill("Child 4–6 years");
      await page.getByLabel("Gull white", { exact: true }).check();
      await page.getByLabel("Initials or a name to knit in").fill(lettering);
      await page.getByLabel("Reindeer", { exact: true }).check();
      await page.getByLabel("Anything else").fill("For the school walk.");
      await page.getByLabel(/Reference photos/).setInputFiles({ name: "mitten-idea.jpg", mimeType: "image/jpeg", buffer: photo });
      await expect.poll(() => page.getByRole("img", { name: "Reference photo 1" }).count(), POLL).toBe(1);
      await expect.poll(() => page.getByText("Draft saved.").count(), POLL).toBe(1);
      // The draft is kept: a reload restores what was typed and the photo.
      await page.reload();
      await expect.poll(() => page.getByLabel("Initials or a name to knit in").inputValue(), POLL).toBe(lettering);
      expect(await page.getByRole("img", { name: "Reference photo 1" }).count()).toBe(1);
      await page.getByRole("button", { name: "Continue: create an account" }).click();
      await expect.poll(() => page.getByText("Your request is kept").count(), POLL).toBe(1);
      await page.getByLabel("Your name").fill("Juniper Hale");
      await page.getByLabel("E-mail").fill(email);
      await page.getByLabel("Password", { exact: true }).fill(password);
      await page.getByLabel("Password again").fill(password);
      await page.getByRole("button", { name: "Create my account" }).click();
      await expect.poll(() => page.getByText("Check your inbox").count(), POLL).toBe(1);
      await expectAccessible(page);
      // 2. The confirmation link signs them in and turns the draft into the commission.
      const link = await mailLink(email, (l) => l.includes("/api/auth/verify-email"));
      await page.goto(link);
      await page.waitForURL(/\/portal\/commissions\/[0-9a-f-]{36}/);
      commissionId = new URL(page.url()).pathname.split("/")[3];
      await expect.poll(() => page.getByRole("heading", { level: 1, name: `Mittens with ${lettering}` }).count(), POLL).toBe(1);
      expect(await page.getByRole("img", { name: "Reference photo 1" }).count()).toBe(1);
      expect(await page.getByText("Request received").count()).toBeGreaterThan(0);
      expect(await page.getByText("Your request is sent").count()).toBe(1);
      await expectAccessible(page);
      await mailLink(email, (l) => l.includes(`/portal/commissions/${commissionId}`));
    });

    // 3. The maker: a design for it (through the design API), then proof 1.
    await startDesigning(commissionId);
    const maker = await newPage(browser);
    let designId = "";
    let headId = "";
    await shot(maker.page, "proof-1", async () => {
      await signInAs(maker.page, "maren@hollin.test");
      await maker.page.waitForURL(`${BASE}/studio`);
      const res = await maker.page.request.post("/api/designs", {
        data: { commissionId, title: `Cuff band ${lettering}`, charts: [{ area: "cuff-band", label: "Cuff band", chart: band }] },
      });
      expect(res.status()).toBe(201);
      const made = (await res.json()) as { design: { id: string }; version: { id: string } };
      designId = made.design.id;
      headId = made.version.id;
      await maker.page.goto(`/studio/commissions/${commissionId}`);
      await expect.poll(() => maker.page.getByText("For the school walk.").count(), POLL).toBe(1);
      await expectAccessible(maker.page);
      await maker.page.getByLabel("Note to the client (optional)").fill("The peerie band for the cuffs.");
      await maker.page.getByRole("button", { name: "Send proof 1" }).click();
      // Sent: the form gives way to the proof in the list (the commission is now at "Proof sent").
      await expect.poll(() => maker.page.getByRole("link", { name: "Proof 1", exact: true }).count(), POLL).toBe(1);
    });

    // 4. The client asks for a change, pinned to a stitch they tap on the chart.
    await shot(page, "changes", async () => {
      await page.goto(await mailLink(email, (l) => /\/proofs\/[0-9a-f-]{36}$/.test(l)));
      await expect.poll(() => page.getByRole("heading", { name: "Approve proof 1" }).count(), POLL).toBe(1);
      await expectAccessible(page);
      const chart = page.getByTestId("proof-chart-0");
      // The grid starts 12 px in; stitch cells are 18 px for a 24-stitch chart: the top-left cell is row 5, stitch 24.
      await chart.click({ position: { x: 12 + 9, y: 12 + 9 } });
      expect(await page.getByLabel("Row", { exact: true }).inputValue()).toBe("5");
      expect(await page.getByLabel("Stitch", { exact: true }).inputValue()).toBe("24");
      await page.getByLabel("Comment for this stitch").fill("Could this corner be red?");
      await page.getByRole("button", { name: "Pin comment" }).click();
      await expect.poll(() => page.getByText("row 5, stitch 24: Could this corner be red?").count(), POLL).toBe(1);
      await page.getByLabel("A general note (optional)").fill("Otherwise lovely.");
      await page.getByRole("button", { name: "Send my changes" }).click();
      await expect.poll(() => page.getByText("Changes asked").count(), POLL).toBeGreaterThan(0);
      await expectAccessible(page);
    });

    // 5. The maker saves a new version (one stitch in a new colour) and sends proof 2.
    await shot(maker.page, "proof-2", async () => {
      const rows = [...band.rows];
      rows[0] = `C${rows[0].slice(1)}`;
      const chart2 = { ...band, rows, palette: [...band.palette, { key: "C", name: "Gorse", hex: "#E0B33A" }] };
      const res = await maker.page.request.post(`/api/designs/${designId}/versions`, {
        data: { parentVersionId: headId, charts: [{ area: "cuff-band", label: "Cuff band", chart: chart2 }], note: "corner in Gorse" },
      });
      expect(res.status()).toBe(201);
      await maker.page.goto(`/studio/commissions/${commissionId}`);
      await expect.poll(() => maker.page.getByText("Changes asked").count(), POLL).toBeGreaterThan(0);
      await maker.page.getByRole("button", { name: "Send proof 2" }).click();
      await expect.poll(() => maker.page.getByRole("link", { name: "Proof 2", exact: true }).count(), POLL).toBe(1);
      await expectAccessible(maker.page);
    });

    // 6. On a phone, the client sees what changed and approves proof 2.
    const phone = await newPage(browser, PHONE);
    await shot(phone.page, "approve", async () => {
      await signInAs(phone.page, email, password);
      await phone.page.waitForURL(`${BASE}/portal`);
      await phone.page.goto(`/portal/commissions/${commissionId}`);
      await phone.page.getByRole("link", { name: "Check proof 2" }).click();
      await phone.page.waitForURL(/\/proofs\//);
      await expect.poll(() => phone.page.getByText("Cuff band: 1 stitch changed; colours added: Gorse.").count(), POLL).toBe(1);
      await expectAccessible(phone.page);
      await phone.page.getByRole("button", { name: "Approve this proof" }).click();
      await expect.poll(() => phone.page.getByText(/Tick the box/).count(), POLL).toBe(1);
      await phone.page.getByLabel("I have checked the charts, the colours and the lettering.").check();
      await phone.page.getByRole("button", { name: "Approve this proof" }).click();
      await expect.poll(() => phone.page.getByText(/Approved by Juniper Hale/).count(), POLL).toBe(1);
      await expectAccessible(phone.page);
      // The earlier proof is still there and says a newer one exists.
      await phone.page.getByRole("link", { name: "Proof 1", exact: true }).click();
      await expect.poll(() => phone.page.getByText("There is a newer proof.").count(), POLL).toBe(1);
      await phone.page.goto(`/portal/commissions/${commissionId}`);
      await expect.poll(() => phone.page.getByText("Proof approved").count(), POLL).toBeGreaterThan(0);
      await expectAccessible(phone.page);
    });
    await Promise.all([visitor.context.close(), maker.context.close(), phone.context.close()]);
  }, 300_000);

  test("the demo's open proof on a phone, the message thread, and the owner's mail page (read only)", async () => {
    const phone = await newPage(browser, PHONE);
    await shot(phone.page, "demo-proof", async () => {
      await signInAs(phone.page, "priya@example.test");
      await phone.page.waitForURL(`${BASE}/portal`);
      await phone.page.getByRole("link", { name: "Yoke pullover with a fox band", exact: true }).click();
      await phone.page.waitForURL(/\/portal\/commissions\//);
      await expect.poll(() => phone.page.getByText("Could the foxes face the other way on the back?").count(), POLL).toBe(1);
      await expectAccessible(phone.page);
      await phone.page.getByRole("link", { name: "Check proof 1" }).click();
      await phone.page.waitForURL(/\/proofs\//);
      await expect.poll(() => phone.page.getByText(/“PO”: [\d.]+ cm wide/).count(), POLL).toBe(1);
      expect(await phone.page.getByRole("heading", { name: "Approve proof 1" }).count()).toBe(1);
      await expectAccessible(phone.page);
    });
    const owner = await newPage(browser);
    await shot(owner.page, "mail-page", async () => {
      await signInAs(owner.page, "maren@hollin.test");
      await owner.page.waitForURL(`${BASE}/studio`);
      await owner.page.getByRole("link", { name: "Mail", exact: true }).click();
      await expect.poll(() => owner.page.getByRole("heading", { level: 1, name: "Mail that did not go out" }).count(), POLL).toBe(1);
      await expectAccessible(owner.page);
    });
    await Promise.all([phone.context.close(), owner.context.close()]);
  }, 120_000);
});
