// Turns zod issues into sentences a person can act on, each naming the field it is about.
// Schemas set their own messages where the wording matters; `fieldErrorMap` covers the rest.
import { z } from "zod";

export interface FieldIssue {
  /** JSON location, e.g. `palette[2].hex` */
  path: string;
  message: string;
  /** row from the bottom, from 1 (chart rows only) */
  row?: number;
  /** stitch from the right, from 1 (chart cells only) */
  stitch?: number;
}

export function formatPath(path: readonly PropertyKey[] | undefined, prefix = ""): string {
  let out = prefix;
  for (const part of path ?? []) {
    if (typeof part === "number") out += `[${part}]`;
    else out += out === "" ? String(part) : `.${String(part)}`;
  }
  return out;
}

function describeValue(value: unknown): string {
  if (value === null) return "null";
  if (Array.isArray(value)) return "a list";
  if (typeof value === "string") return JSON.stringify(value.length > 24 ? value.slice(0, 24) + "…" : value);
  if (typeof value === "object") return "an object";
  return String(value);
}

/** Builds a per-parse error map whose messages start with the field's JSON path. */
export function fieldErrorMap(prefix = "") {
  return (issue: z.core.$ZodRawIssue): string => {
    const label = formatPath(issue.path, prefix) || "input";
    switch (issue.code) {
      case "invalid_type":
        if (issue.input === undefined) return `${label} is missing`;
        return `${label} must be ${issue.expected === "int" ? "a whole number" : `${/^[aeiou]/.test(issue.expected) ? "an" : "a"} ${issue.expected}`} (got ${describeValue(issue.input)})`;
      case "too_small":
        return `${label} must be at least ${String(issue.minimum)}`;
      case "too_big":
        return `${label} must be at most ${String(issue.maximum)}`;
      case "invalid_value":
        return `${label} must be ${issue.values.map((v) => JSON.stringify(v)).join(" or ")} (got ${describeValue(issue.input)})`;
      case "unrecognized_keys":
        return `${label} has unknown field${issue.keys.length === 1 ? "" : "s"}: ${issue.keys.join(", ")}`;
      case "invalid_format":
        return `${label} is not in the expected format`;
      default:
        return `${label} is not valid`;
    }
  };
}

export function toFieldIssues(issues: readonly z.core.$ZodIssue[], prefix = ""): FieldIssue[] {
  return issues.map((issue) => {
    const out: FieldIssue = { path: formatPath(issue.path, prefix), message: issue.message };
    if (issue.code === "custom") {
      const params = issue.params as { row?: unknown; stitch?: unknown } | undefined;
      if (typeof params?.row === "number") out.row = params.row;
      if (typeof params?.stitch === "number") out.stitch = params.stitch;
    }
    return out;
  });
}

/** Joins issues into one message, listing at most `limit` and counting the rest. */
export function joinIssues(issues: readonly { message: string }[], limit = 10): string {
  const shown = issues.slice(0, limit).map((i) => i.message);
  const rest = issues.length - shown.length;
  return rest > 0 ? `${shown.join("; ")}; … and ${rest} more` : shown.join("; ");
}

/** Parses with readable, field-named messages; throws an Error listing them. */
export function parseWithMessages<S extends z.ZodType>(schema: S, input: unknown, what: string): z.output<S> {
  const result = schema.safeParse(input, { error: fieldErrorMap() });
  if (result.success) return result.data;
  throw new Error(`${what}: ${joinIssues(toFieldIssues(result.error.issues))}`);
}

/** A number field whose type error says "is missing" or shows what came instead. */
export function numberField(label: string) {
  return z.number({
    error: (iss) => (iss.input === undefined ? `${label} is missing` : `${label} must be a number (got ${describeValue(iss.input)})`),
  });
}
