// The shared input rules: calendar dates, storable text, bounded numbers, same-origin redirect
// targets, and the body reader / input walk the wrappers use (tables at every threshold).
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { safeNext } from "@/lib/safe-redirect";
import { boundedInt, calendarDate, isCalendarDate, isStorableText, safeText } from "@/lib/schemas/common";
import { paymentFiltersSchema } from "@/lib/schemas/payments";
import { manualEntrySchema } from "@/lib/schemas/production";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { AppError } from "@/lib/server/errors";
import { assertSafeForm, assertSafeInput, MAX_DEPTH, MAX_JSON_BYTES, readJsonBody } from "@/lib/server/input-guard";

describe("calendar dates", () => {
  test.each([
    ["2026-01-31", true],
    ["2026-02-28", true],
    ["2026-02-29", false], // 2026 is not a leap year
    ["2028-02-29", true],
    ["2100-02-29", false], // divisible by 100, not by 400
    ["2000-02-29", true], // divisible by 400
    ["2026-02-30", false],
    ["2026-04-31", false],
    ["2026-12-31", true],
    ["2026-13-01", false],
    ["2026-00-10", false],
    ["2026-01-00", false],
    ["2026-99-99", false],
    ["1999-12-31", false], // before the window
    ["2000-01-01", true], // first day of the window
    ["2100-12-31", true], // last day of the window
    ["2101-01-01", false],
    ["2026-1-01", false],
    ["2026-01-01T00:00", false],
    ["", false],
  ])("%s → %s", (s, ok) => {
    expect(isCalendarDate(s)).toBe(ok);
    expect(calendarDate().safeParse(s).success).toBe(ok);
  });

  test("every day that Date round-trips in the window is accepted, and only those", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1990, max: 2110 }), fc.integer({ min: 0, max: 99 }), fc.integer({ min: 0, max: 99 }), (y, m, d) => {
        const s = `${y}-${String(m).padStart(2, "0")}-${String(d).padStart(2, "0")}`;
        const date = new Date(`${s}T00:00:00Z`);
        const real = !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === s && y >= 2000 && y <= 2100;
        return isCalendarDate(s) === real;
      }),
    );
  });

  test.each([
    ["payments filter", () => paymentFiltersSchema.safeParse({ from: "2026-99-99" })],
    ["time entry", () => manualEntrySchema.safeParse({ pieceId: "00000000-0000-4000-8000-000000000000", stage: "knitting", date: "2026-02-30", minutes: 10 })],
    ["quote valid-until", () => quoteDraftSchema.safeParse({ pieces: [{ label: "Mitten" }], materials: [], validUntil: "2026-02-30" })],
  ])("the %s refuses a date that does not exist", (_label, parse) => {
    expect(parse().success).toBe(false);
  });
});

describe("storable text: NUL and lone surrogates are refused, whole emoji kept", () => {
  test.each([
    ["plain", true],
    ["emoji 🧶 ok", true],
    ["\u0000", false],
    ["a\u0000b", false],
    ["\ud800", false],
    ["x\udc00", false],
    ["\udc00\ud800", false],
    ["\ud83e\uddf6", true], // 🧶 as a pair
    ["", true],
  ])("%j → %s", (s, ok) => {
    expect(isStorableText(s)).toBe(ok);
    expect(safeText(100).safeParse(s).success).toBe(ok);
  });

  test("a refused value names the field (422 with field errors)", () => {
    const err = (() => {
      try {
        assertSafeInput({ note: "ok", charts: [{ label: "a\u0000" }] });
      } catch (e) {
        return e;
      }
    })();
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(422);
    expect(Object.keys((err as AppError).fieldErrors ?? {})).toEqual(["charts.0.label"]);
  });

  test("keys are checked too, and FormData values", () => {
    expect(() => assertSafeInput({ "a\u0000": 1 })).toThrow(AppError);
    // (FormData itself turns a lone surrogate into U+FFFD, so only NUL reaches an action this way.)
    const form = new FormData();
    form.set("note", "x\u0000");
    expect(() => assertSafeForm(form)).toThrow(AppError);
    const ok = new FormData();
    ok.set("note", "knit 🧶");
    expect(() => assertSafeForm(ok)).not.toThrow();
  });

  test("nesting at the limit passes, one level deeper is refused (400), and a 100,000-deep value does not overflow", () => {
    const nest = (n: number) => {
      let v: unknown = 1;
      for (let i = 0; i < n; i++) v = [v];
      return v;
    };
    expect(() => assertSafeInput(nest(MAX_DEPTH))).not.toThrow();
    expect(() => assertSafeInput(nest(MAX_DEPTH + 1))).toThrow(expect.objectContaining({ status: 400 }));
    expect(() => assertSafeInput(nest(100_000))).toThrow(expect.objectContaining({ status: 400 }));
  });
});

describe("bounded numbers", () => {
  test.each([
    [0, true],
    [10, true],
    [-1, false],
    [11, false],
    [1.5, false],
    [Number.NaN, false],
    [Number.POSITIVE_INFINITY, false],
    [1e308, false],
  ])("%s in 0..10 → %s", (n, ok) => expect(boundedInt(0, 10).safeParse(n).success).toBe(ok));
});

describe("reading a JSON body", () => {
  const req = (body: BodyInit | null, type = "application/json", headers: Record<string, string> = {}) =>
    new Request("http://x.test/api", { method: "POST", body, headers: { ...(type ? { "content-type": type } : {}), ...headers }, duplex: "half" } as RequestInit);
  const statusOf = async (p: Promise<unknown>) => p.then(() => 200, (e: AppError) => e.status);

  test("exactly at the limit is read; one byte over is 413", async () => {
    const at = `"${"x".repeat(MAX_JSON_BYTES - 2)}"`;
    expect(await readJsonBody(req(at))).toHaveLength(MAX_JSON_BYTES - 2);
    expect(await statusOf(readJsonBody(req(`${at} `)))).toBe(413);
  });

  test("a declared length over the limit is refused before reading", async () => {
    let pulled = 0;
    const stream = new ReadableStream({ pull: (c) => (pulled++ < 1 ? c.enqueue(new TextEncoder().encode("{}")) : c.close()) }, { highWaterMark: 0 });
    expect(await statusOf(readJsonBody(req(stream, "application/json", { "content-length": String(MAX_JSON_BYTES + 1) })))).toBe(413);
    expect(pulled).toBe(0);
  });

  test("a stream without a length stops being read just past the limit", async () => {
    let pulled = 0;
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    const stream = new ReadableStream({ pull: (c) => (pulled++ < 1000 ? c.enqueue(chunk) : c.close()) });
    expect(await statusOf(readJsonBody(req(stream)))).toBe(413);
    // 1 MB is 16 chunks of 64 KB: the reader gave up on the 17th, not after all 1000 (64 MB).
    expect(pulled).toBeLessThan(20);
  });

  test.each([
    ["text/plain", '{"a":1}', 415],
    ["application/x-www-form-urlencoded", "a=1", 415],
    ["application/json; charset=utf-8", '{"a":1}', 200],
    ["application/merge-patch+json", '{"a":1}', 200],
    ["application/json", "{", 400],
    ["application/json", "", 400],
  ])("%s %j → %s", async (type, body, status) => {
    expect(await statusOf(readJsonBody(req(body, type)))).toBe(status);
  });

  test("bytes that are not UTF-8 are 400", async () => {
    expect(await statusOf(readJsonBody(req(new Uint8Array([0x22, 0xff, 0xfe, 0x22]))))).toBe(400);
  });
});

describe("safeNext: redirect targets stay on this site", () => {
  test.each([
    ["/portal", "/portal"],
    ["/studio/commissions/1?x=2#top", "/studio/commissions/1?x=2#top"],
    ["/welcome?studio=hollin&request=1", "/welcome?studio=hollin&request=1"],
    ["//evil.test/x", "/home"],
    ["///evil.test", "/home"],
    ["https://evil.test", "/home"],
    ["http:/evil.test", "/home"],
    ["javascript:alert(1)", "/home"],
    ["evil.test", "/home"],
    ["/\\evil.test", "/home"],
    ["\\\\evil.test", "/home"],
    ["/\t/evil.test", "/home"],
    ["/\n/evil.test", "/home"],
    ["/\r\nSet-Cookie: x=1", "/home"],
    ["/a\u0000b", "/home"],
    ["/\u2028", "/home"],
    ["/x\ud800", "/home"],
    [" /portal", "/home"],
    ["/" + "a".repeat(2001), "/home"],
    ["/café", "/caf%C3%A9"],
    ["/a/../b", "/b"],
    [undefined, "/home"],
    [null, "/home"],
    [["/a", "/b"], "/home"],
    ["", "/home"],
  ])("%j → %s", (input, out) => expect(safeNext(input)).toBe(out));

  test("the fallback is used as given", () => expect(safeNext("//x", "/studio")).toBe("/studio"));

  test("never returns an address that leaves the site, nor a character a Location header refuses", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.string({ unit: "binary" }), fc.webUrl(), fc.string().map((s) => `/${s}`)), (s) => {
        const r = safeNext(s);
        return r.startsWith("/") && !r.startsWith("//") && new URL(r, "https://darnwell.test").host === "darnwell.test" && /^[\x21-\x7e]*$/.test(r);
      }),
    );
  });
});
