// Shared zod building blocks for every boundary: calendar dates, storable text, bounded numbers.
// One rule for text everywhere: a NUL (U+0000) or a lone UTF-16 surrogate is REFUSED with a field
// error (422), never stripped silently; PostgreSQL cannot store either in text or jsonb.
import { z } from "zod";
import "./error-words";

/** Dates outside this window are typing slips (or probes), not dates this product plans with. */
export const MIN_YEAR = 2000;
export const MAX_YEAR = 2100;

// A NUL, a high surrogate not followed by a low one, or a low surrogate not preceded by a high one.
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** True when PostgreSQL can store the text: no NUL, no lone surrogate. */
export function isStorableText(s: string): boolean {
  return !UNSTORABLE.test(s);
}

export const UNSTORABLE_MESSAGE = "This text contains a character that cannot be saved (a NUL byte or half of an emoji). Remove it and try again.";

/** A string that can be stored; chain `.trim()`, `.min()`, `.max()` after it as with `z.string()`. */
export const safeString = (message = UNSTORABLE_MESSAGE) => z.string().refine(isStorableText, { message });

/** Free text: storable, trimmed, at most `max` characters. */
export const safeText = (max: number, message = `Keep it to ${max} characters or fewer.`) => safeString().trim().max(max, message);

/** Is `YYYY-MM-DD` a day that exists (2026-02-30 and 2026-99-99 do not) within the sane window? */
export function isCalendarDate(s: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s);
  if (!m) return false;
  const y = Number(m[1]);
  const mo = Number(m[2]);
  const d = Number(m[3]);
  if (y < MIN_YEAR || y > MAX_YEAR || mo < 1 || mo > 12 || d < 1) return false;
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][mo - 1];
  return d <= days;
}

/** A calendar date as `YYYY-MM-DD` (a string, as forms, URLs and PostgreSQL `date` columns use it). */
export const calendarDate = (message = "Use a date like 2027-01-31.") =>
  z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, message)
    .refine(isCalendarDate, { message: `That date does not exist, or is outside ${MIN_YEAR}–${MAX_YEAR}. ${message}`, abort: true });

/** A whole number within [min, max] (JSON numbers; NaN, Infinity and fractions refused). */
export const boundedInt = (min: number, max: number, message = `Use a whole number from ${min} to ${max}.`) =>
  z.number({ error: message }).int(message).min(min, message).max(max, message);

/** A finite number within [min, max]. */
export const boundedNumber = (min: number, max: number, message = `Use a number from ${min} to ${max}.`) =>
  z.number({ error: message }).finite(message).min(min, message).max(max, message);

/** Typed into a form field: a whole number within [min, max] (the text is read, never Number("1e400")). */
export const boundedIntText = (min: number, max: number, message = `Use a whole number from ${min} to ${max}.`) =>
  z.coerce.number({ error: message }).int(message).min(min, message).max(max, message);

/** A studio's address name as it appears in /studios/<slug> (anything else names no studio). */
export const studioSlugSchema = z.string().regex(/^[a-z0-9][a-z0-9-]{0,79}$/, "Not a studio address.");
