// One place that turns zod's default messages ("Too big: expected string to have <=500 characters")
// into words a person can act on. Messages a schema sets itself always win; this only fills the gaps.
// Installed once, for browser and server alike, by importing this module (lib/schemas/common.ts does).
import { z } from "zod";

type Issue = z.core.$ZodRawIssue;

const n = (v: unknown) => (typeof v === "bigint" ? v.toString() : typeof v === "number" ? v.toLocaleString("en-GB") : String(v));

/** The words for one issue, or undefined to keep zod's own (never reached for issues we cover). */
export function wordsForIssue(iss: Issue): string | undefined {
  switch (iss.code) {
    case "invalid_type":
      if (iss.input === undefined || iss.input === null) return "This is needed.";
      if (iss.expected === "number" || iss.expected === "int" || iss.expected === "bigint") return "Enter a number.";
      if (iss.expected === "string") return "Enter some text.";
      if (iss.expected === "boolean") return "Choose yes or no.";
      if (iss.expected === "date") return "Enter a date.";
      if (iss.expected === "array") return "Choose one or more.";
      return "This is not the kind of value expected here.";
    case "too_big": {
      const max = n(iss.maximum);
      if (iss.origin === "string") return `Keep it to ${max} characters or fewer.`;
      if (iss.origin === "array" || iss.origin === "set") return `Choose at most ${max}.`;
      if (iss.origin === "file") return "This file is too large.";
      return iss.inclusive === false ? `Use a number below ${max}.` : `Use a number no larger than ${max}.`;
    }
    case "too_small": {
      const min = n(iss.minimum);
      if (iss.origin === "string") return Number(iss.minimum) <= 1 ? "This is needed." : `Use at least ${min} characters.`;
      if (iss.origin === "array" || iss.origin === "set") return Number(iss.minimum) <= 1 ? "Choose at least one." : `Choose at least ${min}.`;
      return iss.inclusive === false ? `Use a number above ${min}.` : `Use a number no smaller than ${min}.`;
    }
    case "invalid_format":
      if (iss.format === "email") return "Enter an e-mail address like name@example.com.";
      if (iss.format === "url") return "Enter a web address starting with https://.";
      if (iss.format === "uuid" || iss.format === "guid") return "This reference is not valid; go back and try again from the page.";
      if (iss.format === "date" || iss.format === "datetime") return "Enter a date like 2027-01-31.";
      return "This is not written the way it is expected here.";
    case "not_multiple_of":
      return `Use a multiple of ${n(iss.divisor)}.`;
    case "invalid_value":
      return "Choose one of the options offered.";
    case "unrecognized_keys":
      return "Something was sent that this form does not use; reload the page and try again.";
    case "invalid_union":
    case "invalid_key":
    case "invalid_element":
    case "custom":
      return "Check this value.";
    default:
      return undefined;
  }
}

z.config({ customError: (iss) => wordsForIssue(iss) });
