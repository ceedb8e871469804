// zod's default messages never reach a page: the shared layer words them, and a schema's own
// message still wins.
import { describe, expect, test } from "vitest";
import { z } from "zod";
import "@/lib/schemas/common";

const first = (schema: z.ZodType, input: unknown) => {
  const r = schema.safeParse(input);
  if (r.success) throw new Error("expected a refusal");
  return r.error.issues[0].message;
};

describe("error words", () => {
  test.each([
    ["a string over its limit", z.string().max(500), "x".repeat(501), "Keep it to 500 characters or fewer."],
    ["an empty required string", z.string().min(1), "", "This is needed."],
    ["a missing field", z.object({ name: z.string() }), {}, "This is needed."],
    ["text where a number goes", z.number(), "twelve", "Enter a number."],
    ["a number over its limit", z.number().max(100), 101, "Use a number no larger than 100."],
    ["a number at an exclusive floor", z.number().gt(0), 0, "Use a number above 0."],
    ["an option not offered", z.enum(["a", "b"]), "c", "Choose one of the options offered."],
    ["a malformed address", z.email(), "not-an-address", "Enter an e-mail address like name@example.com."],
    ["an unknown field", z.strictObject({ a: z.string() }), { a: "x", b: 1 }, "Something was sent that this form does not use; reload the page and try again."],
  ])("%s", (_label, schema, input, words) => {
    expect(first(schema, input)).toBe(words);
  });

  test("no default message leaks the schema's vocabulary", () => {
    for (const [schema, input] of [
      [z.string().max(3), "abcd"],
      [z.array(z.string()).min(2), ["a"]],
      [z.number().int(), 1.5],
    ] as const) {
      expect(first(schema, input)).not.toMatch(/expected|Too (big|small)|Invalid/);
    }
  });

  test("a schema's own message wins", () => {
    expect(first(z.string().max(3, "Three letters at most."), "abcd")).toBe("Three letters at most.");
  });
});
