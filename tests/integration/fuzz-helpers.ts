// Generators for the input fuzz test: fast-check arbitraries derived from zod schemas (through
// z.toJSONSchema, refinements left out on purpose so that near-valid values come up), hostile
// values, and a mutation that puts one hostile value at one place of a generated input.
import fc from "fast-check";
import { z } from "zod";

interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  prefixItems?: JsonSchema[];
  enum?: unknown[];
  const?: unknown;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  minLength?: number;
  maxLength?: number;
  pattern?: string;
  format?: string;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
}

export interface Pools {
  /** ids that exist (so some calls get past the "not found" checks) */
  ids: string[];
  /** ids of the kind a field's name asks for (commissionId → commissions), when there are some */
  byName?: (name: string) => string[] | undefined;
}

const deep = (n: number): unknown => {
  let v: unknown = "bottom";
  for (let i = 0; i < n; i++) v = i % 2 ? [v] : { a: v };
  return v;
};

/** Values that have crashed or could crash a layer below zod. */
export const HOSTILE_VALUES: unknown[] = [
  "\u0000",
  "knit\u0000purl",
  "\ud800",
  "half \udc00 emoji",
  "\udfff\ud800",
  "2026-99-99",
  "2026-02-30",
  "0000-00-00",
  "9999-12-31",
  "2026-13-01",
  "1e400",
  "Infinity",
  "NaN",
  "-0",
  "",
  " \t\n ",
  "%00",
  "../../etc/passwd",
  "' or 1=1 --",
  "<script>alert(1)</script>",
  "x".repeat(20_000),
  1e308,
  -1e308,
  2 ** 53 + 1,
  -1,
  0.1,
  2_147_483_648,
  -2_147_483_649,
  true,
  null,
  [],
  {},
  [[[[]]]],
  { __proto__: { polluted: true } },
  JSON.parse('{"__proto__":{"polluted":true}}'),
  deep(40),
  deep(200),
  Array.from({ length: 2_000 }, (_, i) => i),
];

export const hostileValue = fc.constantFrom(...HOSTILE_VALUES);

function clampNum(v: number | undefined, fallback: number): number {
  if (v === undefined || !Number.isFinite(v)) return fallback;
  return Math.max(-1e9, Math.min(1e9, v));
}

function stringArb(s: JsonSchema, pools: Pools, hint: string): fc.Arbitrary<unknown> {
  if (s.format === "uuid") {
    const named = pools.byName?.(hint);
    return named?.length ? fc.oneof({ arbitrary: fc.constantFrom(...named), weight: 3 }, { arbitrary: fc.uuid(), weight: 1 }) : fc.oneof(fc.constantFrom(...pools.ids), fc.uuid());
  }
  if (s.format === "email") return fc.emailAddress();
  const max = Math.min(s.maxLength ?? 40, 60);
  const min = Math.min(s.minLength ?? 0, max);
  if (s.pattern) {
    try {
      return fc.stringMatching(new RegExp(s.pattern)).map((v) => v.slice(0, Math.max(max, 1) + 20));
    } catch {
      // a pattern fast-check cannot read (\p{…}): plain text instead
    }
  }
  return fc.string({ minLength: min, maxLength: max, unit: "grapheme" });
}

/** An arbitrary of inputs of roughly the schema's shape (refinements ignored). */
export function arbitraryFromJsonSchema(s: JsonSchema | boolean | undefined, pools: Pools, depth = 0, hint = ""): fc.Arbitrary<unknown> {
  if (s === undefined || s === true || typeof s !== "object" || depth > 6) return fc.jsonValue({ maxDepth: 2 });
  if (s.const !== undefined) return fc.constant(s.const);
  if (s.enum) return fc.constantFrom(...s.enum);
  const alts = s.anyOf ?? s.oneOf;
  if (alts?.length) return fc.oneof(...alts.map((a) => arbitraryFromJsonSchema(a, pools, depth + 1, hint)));
  if (s.allOf?.length) return arbitraryFromJsonSchema(s.allOf[0], pools, depth + 1, hint);
  const type = Array.isArray(s.type) ? s.type[0] : s.type;
  switch (type) {
    case "string":
      return stringArb(s, pools, hint);
    case "integer":
      return fc.integer({ min: Math.ceil(clampNum(s.minimum ?? s.exclusiveMinimum, -1000)), max: Math.floor(clampNum(s.maximum ?? s.exclusiveMaximum, 1_000_000)) });
    case "number":
      return fc.double({ min: clampNum(s.minimum ?? s.exclusiveMinimum, -1000), max: clampNum(s.maximum ?? s.exclusiveMaximum, 1_000_000), noNaN: true, noDefaultInfinity: true });
    case "boolean":
      return fc.boolean();
    case "null":
      return fc.constant(null);
    case "array": {
      if (s.prefixItems?.length) return fc.tuple(...s.prefixItems.map((p) => arbitraryFromJsonSchema(p, pools, depth + 1, hint)));
      const minLength = s.minItems ?? 0;
      const maxLength = Math.max(minLength, Math.min(s.maxItems ?? 3, 3));
      return fc.array(arbitraryFromJsonSchema(s.items, pools, depth + 1, hint), { minLength, maxLength });
    }
    case "object": {
      const props = s.properties ?? {};
      const model: Record<string, fc.Arbitrary<unknown>> = {};
      for (const [k, v] of Object.entries(props)) model[k] = arbitraryFromJsonSchema(v, pools, depth + 1, k);
      if (!Object.keys(model).length) return fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 1 }), { maxKeys: 3 });
      return fc.record(model, { requiredKeys: (s.required ?? []).filter((k) => k in model) });
    }
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

/** The arbitrary for a zod schema (input side), or plain JSON when it cannot be described. */
export function arbitraryFromZod(schema: z.ZodType | undefined, pools: Pools): fc.Arbitrary<unknown> {
  if (!schema) return fc.jsonValue({ maxDepth: 2 });
  try {
    const js = z.toJSONSchema(schema, { io: "input", unrepresentable: "any" }) as JsonSchema;
    return arbitraryFromJsonSchema(js, pools);
  } catch {
    return fc.jsonValue({ maxDepth: 2 });
  }
}

/** Puts `bad` at the `pick`-th place (leaf or branch) of `value`; the root when there is no place. */
export function plant(value: unknown, pick: number, bad: unknown): unknown {
  const places: (string | number)[][] = [];
  const walk = (v: unknown, path: (string | number)[]) => {
    if (path.length) places.push(path);
    if (path.length > 6 || v === null || typeof v !== "object") return;
    if (Array.isArray(v)) v.forEach((c, i) => walk(c, [...path, i]));
    else for (const [k, c] of Object.entries(v)) walk(c, [...path, k]);
  };
  walk(value, []);
  if (!places.length) return bad;
  const path = places[pick % places.length];
  const copy = structuredClone(value) as Record<string | number, unknown>;
  let at: Record<string | number, unknown> = copy;
  for (const k of path.slice(0, -1)) at = at[k] as Record<string | number, unknown>;
  at[path[path.length - 1]] = bad;
  return copy;
}

/** Generated inputs: some as the schema describes, most with one hostile value planted somewhere. */
export function inputsFor(schema: z.ZodType | undefined, pools: Pools, runs: number, seed: number): unknown[] {
  const base = arbitraryFromZod(schema, pools);
  const planted = fc.tuple(base, fc.nat(), hostileValue).map(([v, pick, bad]) => plant(v, pick, bad));
  const sampled = fc.sample(fc.oneof({ arbitrary: base, weight: 1 }, { arbitrary: planted, weight: 2 }), { numRuns: runs, seed });
  // A date that passes a month and day range check but does not exist, wherever a date was generated.
  const dated = sampled.filter(hasDate).map((v) => replaceDates(v, "2026-02-30"));
  return [...sampled, ...dated.slice(0, 1)];
}

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const hasDate = (v: unknown): boolean =>
  typeof v === "string" ? DATE.test(v) : v !== null && typeof v === "object" && Object.values(v).some(hasDate);
function replaceDates(v: unknown, to: string): unknown {
  if (typeof v === "string") return DATE.test(v) ? to : v;
  if (Array.isArray(v)) return v.map((x) => replaceDates(x, to));
  if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, replaceDates(x, to)]));
  return v;
}

/** An input as a browser form would post it: every value a string (objects as JSON). */
export function toFormData(value: unknown): FormData {
  const form = new FormData();
  if (value === null || typeof value !== "object" || Array.isArray(value)) {
    form.set("value", typeof value === "string" ? value : JSON.stringify(value) ?? "");
    return form;
  }
  for (const [k, v] of Object.entries(value)) {
    if (v === undefined) continue;
    if (Array.isArray(v)) for (const item of v) form.append(k, typeof item === "string" ? item : JSON.stringify(item) ?? "");
    else form.set(k, typeof v === "string" ? v : typeof v === "boolean" ? (v ? "on" : "") : JSON.stringify(v) ?? "");
  }
  return form;
}

/**
 * Inputs the schema accepts (found by sampling): the one with the fewest values and the one with the
 * most among the first few. `asSent` turns a value into what the schema sees (FormData entries for actions).
 */
export function validBases(schema: z.ZodType | undefined, pools: Pools, seed: number, asSent: (v: unknown) => unknown = (v) => v): unknown[] {
  if (!schema) return [];
  const found = fc
    .sample(arbitraryFromZod(schema, pools), { numRuns: 150, seed })
    .filter((v) => schema.safeParse(asSent(v)).success)
    .slice(0, 8);
  const size = (v: unknown): number => (v && typeof v === "object" ? Object.values(v).reduce<number>((n, x) => n + size(x), 1) : 1);
  // The fullest reaches optional fields; the barest names the fewest other rows, so it gets furthest.
  const sorted = found.sort((a, b) => size(b) - size(a));
  return sorted.length > 1 ? [sorted[sorted.length - 1], sorted[0]] : sorted;
}

/** One bad value at each leaf of a valid input in turn: unstorable text, impossible dates, numbers out of range. */
export function plantEach(base: unknown): unknown[] {
  const out: unknown[] = [];
  let n = 0;
  const visit = (v: unknown, at: (bad: unknown) => unknown) => {
    if (typeof v === "string") {
      out.push(at(DATE.test(v) ? "2026-02-30" : n++ % 2 ? `${v}\ud800` : `${v}\u0000`));
    } else if (typeof v === "number") {
      out.push(at([2_147_483_648, -1, 1e308][n++ % 3]));
    } else if (Array.isArray(v)) {
      v.forEach((x, i) => visit(x, (bad) => at(v.map((y, j) => (j === i ? bad : y)))));
    } else if (v && typeof v === "object") {
      for (const [k, x] of Object.entries(v)) visit(x, (bad) => at({ ...v, [k]: bad }));
    }
  };
  visit(base, (bad) => bad);
  return out;
}
