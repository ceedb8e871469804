// A page on another local port (same site, another origin: the signed-in owner's cookies go with its
// requests) tries to post a message as the owner with a text/plain form and a no-cors fetch. Nothing
// may be created; the same post from the app's own origin works (so the test can fail). Also checks the
// security headers of a page and that the pages opened here report no CSP violation.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { BASE, expectAccessible, launch, POLL, signInAs, withPage } from "./browser";

let browser: Browser;
let foreign: Server;
let FOREIGN = "";

// The classic text/plain trick: the field name and value join into a JSON document.
const formPage = (target: string, key: string) => `<!doctype html><html lang="en"><head><title>Win a prize</title></head><body>
<form method="post" action="${target}" enctype="text/plain">
<input type="hidden" name='{"body":"sent from another site","clientKey":"${key}","pad":"' value='"}'>
<button type="submit">Claim</button></form></body></html>`;

const fetchPage = (target: string, key: string) => `<!doctype html><html lang="en"><head><title>Win a prize</title></head><body>
<button id="go" type="button">Claim</button><p id="out">waiting</p>
<script>
document.getElementById("go").onclick = async () => {
  try {
    await fetch(${JSON.stringify(target)}, { method: "POST", mode: "no-cors", credentials: "include",
      headers: { "content-type": "text/plain" }, body: JSON.stringify({ body: "fetched from another site", clientKey: ${JSON.stringify(key)} }) });
    document.getElementById("out").textContent = "sent";
  } catch (e) { document.getElementById("out").textContent = "failed"; }
};
</script></body></html>`;

beforeAll(async () => {
  browser = await launch();
  foreign = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://x");
    const target = url.searchParams.get("target") ?? "";
    const key = url.searchParams.get("key") ?? "";
    const html = url.pathname === "/fetch" ? fetchPage(target, key) : formPage(target, key);
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(html);
  });
  await new Promise<void>((resolve) => foreign.listen(0, "127.0.0.1", resolve));
  FOREIGN = `http://127.0.0.1:${(foreign.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await browser?.close();
  await new Promise((r) => foreign?.close(r));
});

describe("cross-site requests as a signed-in owner", () => {
  test("a form and a no-cors fetch from another port create nothing; the app's own origin still can", () =>
    withPage(browser, "cross-site", async (page) => {
      await signInAs(page, "maren@hollin.test");
      await page.waitForURL(`${BASE}/studio`);
      await expectAccessible(page);
      const list = (await (await page.request.get("/api/commissions")).json()).commissions as { id: string }[];
      const id = list[0]!.id;
      const target = `${BASE}/api/commissions/${id}/messages?as=studio`;
      const thread = async () => ((await (await page.request.get(`/api/commissions/${id}/messages?as=studio`)).json()).messages as { clientKey: string | null }[]);
      const before = (await thread()).length;
      const run = Date.now().toString(36);

      // 1. A plain form on the foreign page, posting text/plain that reads as JSON.
      await page.goto(`${FOREIGN}/form?target=${encodeURIComponent(target)}&key=form${run}`);
      const [answer] = await Promise.all([page.waitForResponse((r) => r.url().startsWith(target)), page.getByRole("button", { name: "Claim" }).click()]);
      expect(answer.status()).toBe(403);
      expect((await answer.json()).error.code).toBe("cross_site");
      // The browser did send the owner's session with it: only the origin check stopped it.
      expect((await answer.request().allHeaders()).cookie ?? "").toMatch(/session_token=/);

      // 2. A no-cors fetch (no preflight) from the foreign page.
      await page.goto(`${FOREIGN}/fetch?target=${encodeURIComponent(target)}&key=fetch${run}`);
      const [fetched] = await Promise.all([page.waitForResponse((r) => r.url().startsWith(target)), page.getByRole("button", { name: "Claim" }).click()]);
      expect(fetched.status()).toBe(403);
      await expect.poll(() => page.locator("#out").textContent(), POLL).toBe("sent");

      const after = await thread();
      expect(after.length).toBe(before);
      expect(after.some((m) => m.clientKey === `form${run}` || m.clientKey === `fetch${run}`)).toBe(false);

      // Control: from the app's own origin, as JSON, the same post works.
      const own = await page.request.post(target, {
        headers: { origin: BASE, "content-type": "application/json" },
        data: JSON.stringify({ body: "from the studio itself", clientKey: `own${run}` }),
      });
      expect(own.status()).toBe(201);
      // …but not as text/plain, even from the app's own origin.
      const plain = await page.request.post(target, { headers: { origin: BASE, "content-type": "text/plain" }, data: JSON.stringify({ body: "plain", clientKey: `plain${run}` }) });
      expect(plain.status()).toBe(415);
      expect((await thread()).length).toBe(before + 1);
    }));

  test("pages carry the security headers and a fresh nonce each time, and refuse to be framed", () =>
    withPage(browser, "security-headers", async (page) => {
      const first = await page.goto("/sign-in");
      const h = first!.headers();
      expect(h["content-security-policy"]).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
      expect(h["content-security-policy"]).toContain("frame-ancestors 'none'");
      expect(h["x-content-type-options"]).toBe("nosniff");
      expect(h["referrer-policy"]).toBe("strict-origin-when-cross-origin");
      expect(h["permissions-policy"]).toContain("camera=()");
      expect(h["strict-transport-security"]).toBeUndefined(); // http here
      const nonceOf = (csp: string) => /'nonce-([^']+)'/.exec(csp)?.[1];
      const second = await page.goto("/sign-in");
      expect(nonceOf(second!.headers()["content-security-policy"]!)).not.toBe(nonceOf(h["content-security-policy"]!));
      // The page hydrated under the policy: the form's own (client-side) check answers.
      const form = page.getByRole("form", { name: "Sign in with password" });
      await form.getByLabel("E-mail").fill("not-an-address");
      await form.getByRole("button", { name: "Sign in", exact: true }).click();
      await expect.poll(() => page.getByText("That does not look like an e-mail address").count(), POLL).toBeGreaterThan(0);
      await expectAccessible(page);

    }));

  test("another origin cannot frame a page", async () => {
    // A context of its own: the refusal is itself reported as a CSP message, which withPage would fail on.
    const context = await browser.newContext();
    try {
      const page = await context.newPage();
      await page.goto(`${FOREIGN}/form`);
      const refused = page.waitForEvent("console", { predicate: (m) => m.text().includes("frame-ancestors"), timeout: 20_000 });
      await page.setContent(`<!doctype html><html lang="en"><head><title>frame</title></head><body><iframe title="app" src="${BASE}/sign-in"></iframe></body></html>`);
      await refused;
      const frame = page.frames().find((f) => f !== page.mainFrame());
      expect(await frame?.getByLabel("E-mail").count().catch(() => 0)).toBe(0);
    } finally {
      await context.close();
    }
  });
});
