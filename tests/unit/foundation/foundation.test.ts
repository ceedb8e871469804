import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { authErrorMessage, safeNext, signUpSchema } from "@/lib/schemas/auth";
import { majorToMinor } from "@/lib/schemas/money";
import { roleAllows, type Permission } from "@/lib/server/authz";
import { renderEmail } from "@/templates/email/layout";

describe("role rules", () => {
  // The brief: an assistant may work on commissions but not change prices or payments.
  test.each<[Permission, boolean, boolean]>([
    ["studio.view", true, true],
    ["commission.work", true, true],
    ["commission.price", true, false],
    ["payments.manage", true, false],
    ["commission.ship", true, false],
    ["studio.team", true, false],
    ["studio.settings", true, false],
  ])("%s: owner %s, assistant %s", (permission, owner, assistant) => {
    expect(roleAllows("owner", permission)).toBe(owner);
    expect(roleAllows("assistant", permission)).toBe(assistant);
  });
});

describe("safeNext keeps redirects on this site", () => {
  test.each([
    ["/portal", "/portal"],
    ["/studio/commissions/1?x=2", "/studio/commissions/1?x=2"],
    ["//evil.test/x", "/home"],
    ["https://evil.test", "/home"],
    ["/\\evil.test", "/home"],
    [undefined, "/home"],
    ["", "/home"],
  ])("%s → %s", (input, out) => expect(safeNext(input)).toBe(out));

  test("never returns an address that leaves the site", () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        const r = safeNext(s);
        return r.startsWith("/") && !r.startsWith("//") && new URL(r, "https://darnwell.test").host === "darnwell.test";
      }),
    );
  });
});

describe("major units to minor units by string arithmetic", () => {
  test.each([
    ["88", "GBP", 8800],
    ["88.5", "GBP", 8850],
    ["88.05", "GBP", 8805],
    ["1,234.56", "GBP", 123456],
    ["0.10", "EUR", 10],
    ["8800", "JPY", 8800],
    ["1.234", "KWD", 1234],
    ["88.505", "GBP", null],
    ["8800.5", "JPY", null],
    ["-1", "GBP", null],
    ["abc", "GBP", null],
  ])("%s %s → %s", (text, currency, minor) => expect(majorToMinor(text, currency)).toBe(minor));

  test("round-trips every whole number of pence", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), (pence) => {
        const text = `${Math.floor(pence / 100)}.${String(pence % 100).padStart(2, "0")}`;
        return majorToMinor(text, "GBP") === pence;
      }),
    );
  });
});

describe("auth form messages", () => {
  test("rate limiting and each known code have a sentence of their own", () => {
    expect(authErrorMessage(undefined, 429)).toMatch(/Too many attempts/);
    for (const code of ["INVALID_EMAIL_OR_PASSWORD", "EMAIL_NOT_VERIFIED", "USER_ALREADY_EXISTS", "INVALID_TOKEN"]) {
      expect(authErrorMessage(code)).not.toBe(authErrorMessage("SOMETHING_ELSE"));
    }
  });

  test("sign-up names each field at fault", () => {
    const r = signUpSchema.safeParse({ name: "", email: "x", password: "short", confirm: "other" });
    expect(r.success).toBe(false);
    const paths = new Set(r.error!.issues.map((i) => i.path.join(".")));
    expect(paths).toEqual(new Set(["name", "email", "password", "confirm"]));
    const mismatch = signUpSchema.safeParse({ name: "A", email: "a@b.test", password: "long-enough-1", confirm: "long-enough-2" });
    expect(mismatch.error!.issues[0].path).toEqual(["confirm"]);
  });
});

describe("e-mail layout", () => {
  test("escapes what people typed and repeats the link in the text part", () => {
    const m = renderEmail({
      subject: "Hi <b>",
      heading: "A & B",
      paragraphs: ['<script>alert("x")</script>'],
      action: { label: "Go", url: "https://darnwell.test/a?b=1&c=2" },
    });
    expect(m.html).not.toContain("<script>");
    expect(m.html).toContain("&lt;script&gt;");
    expect(m.html).toContain("A &amp; B");
    expect(m.text).toContain("Go: https://darnwell.test/a?b=1&c=2");
    expect(m.html).toContain('lang="en"');
  });
});
