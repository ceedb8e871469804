// Chromium (Debian's) driven by playwright-core, with an axe-core check for every page opened.
import { mkdirSync, readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { expect } from "vitest";

export const BASE = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";
const require = createRequire(import.meta.url);
const axeSource = readFileSync(require.resolve("axe-core/axe.min.js"), "utf8");

export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
      "--disable-quic",
    ],
  });
}

export const PHONE = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true };

// Every page of the app runs under its Content-Security-Policy (proxy.ts): a violation fails the test.
// Chromium reports each one as a console error and as a `securitypolicyviolation` event.
const CSP_MARK = "[csp-violation]";
const violations = new WeakMap<Page, string[]>();

async function watchCsp(context: BrowserContext): Promise<void> {
  await context.addInitScript((mark: string) => {
    document.addEventListener("securitypolicyviolation", (e) => {
      console.error(`${mark} ${e.effectiveDirective} blocked ${e.blockedURI || "inline"} at ${e.sourceFile}:${e.lineNumber}`);
    });
  }, CSP_MARK);
  context.on("page", (page) => {
    violations.set(page, []);
    page.on("console", (msg) => {
      const text = msg.text();
      if (msg.type() === "error" && (text.startsWith(CSP_MARK) || text.includes("Content Security Policy"))) {
        violations.get(page)!.push(`${page.url()}: ${text}`);
      }
    });
  });
}

/** Fails the test if the page has reported any Content-Security-Policy violation so far. */
export function expectNoCspViolations(page: Page): void {
  expect(violations.get(page) ?? [], "Content-Security-Policy violations").toEqual([]);
}

export async function newPage(browser: Browser, opts: Parameters<Browser["newContext"]>[0] = {}): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL: BASE, ...opts });
  context.setDefaultTimeout(20_000);
  context.setDefaultNavigationTimeout(30_000);
  await watchCsp(context);
  const page = await context.newPage();
  return { context, page };
}

/** Runs a test body in a fresh context; on failure keeps a screenshot in test-results/e2e/. */
export async function withPage(
  browser: Browser,
  name: string,
  body: (page: Page) => Promise<void>,
  opts: Parameters<Browser["newContext"]>[0] = {},
): Promise<void> {
  const { context, page } = await newPage(browser, opts);
  try {
    await body(page);
    for (const p of context.pages()) expectNoCspViolations(p);
  } catch (err) {
    mkdirSync("test-results/e2e", { recursive: true });
    await page
      .screenshot({ path: `test-results/e2e/${name.replace(/[^a-z0-9]+/gi, "-")}.png`, fullPage: true, timeout: 5000 })
      .catch(() => undefined);
    throw new Error(`${(err as Error).message}\n(at ${page.url()})`, { cause: err });
  } finally {
    await context.close();
  }
}

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

/** Fails the test on any serious or critical accessibility violation (or CSP violation) on the current page. */
export async function expectAccessible(page: Page): Promise<void> {
  await page.waitForLoadState("load");
  expectNoCspViolations(page);
  // Evaluated through the DevTools protocol: a <script> tag would (rightly) be refused by the page's CSP.
  await page.evaluate(`${axeSource}\n;void 0`);
  const violations = (await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<{ violations: unknown[] }> } }).axe;
    const r = await axe.run(document, { runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "best-practice"] } });
    return r.violations;
  })) as AxeViolation[];
  const bad = violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(
    bad.map((v) => `${v.impact} ${v.id}: ${v.help} at ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`),
    `accessibility of ${page.url()}`,
  ).toEqual([]);
}

export async function signInAs(page: Page, email: string, password = "darnwell-demo"): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
}

/** How long an expect.poll waits for the page to catch up (not a timing assertion). */
export const POLL = { timeout: 15_000, interval: 100 };

/** Creates a one-chart design on a commission through the API, as the signed-in studio member. */
export async function createDesign(
  page: Page,
  commissionTitle: string,
  title: string,
  chart: { width: number; height: number; palette: { key: string; name: string; hex: string }[]; rows: string[] },
): Promise<string> {
  const list = (await (await page.request.get("/api/commissions")).json()).commissions as { id: string; title: string }[];
  const commissionId = list.find((c) => c.title === commissionTitle)?.id;
  expect(commissionId, `commission "${commissionTitle}"`).toBeTruthy();
  const res = await page.request.post("/api/designs", {
    data: {
      commissionId,
      title,
      charts: [
        {
          area: "back-of-hand",
          label: "Back of hand",
          chart: { version: 1, gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 }, ...chart },
        },
      ],
    },
  });
  expect(res.status()).toBe(201);
  return (await res.json()).design.id as string;
}
