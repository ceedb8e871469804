// Turn zod issues into one line per problem, each naming the field a person has to fix.
import type { z } from "zod";

function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const key of path) {
    if (typeof key === "number") out += `[${key}]`;
    else out += out === "" ? String(key) : `.${String(key)}`;
  }
  return out;
}

export function describeIssues(error: z.ZodError, root = "input"): string {
  return error.issues
    .map((issue) => {
      const where = formatPath(issue.path);
      return `${where === "" ? root : where}: ${issue.message}`;
    })
    .join("\n");
}

/** Parse with a schema, throwing an Error whose message lists every problem. */
export function parseOrThrow<T>(schema: z.ZodType<T>, input: unknown, root = "input"): T {
  const result = schema.safeParse(input);
  if (!result.success) throw new Error(describeIssues(result.error, root));
  return result.data;
}
