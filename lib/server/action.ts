import "server-only";
// The one wrapper for server actions: session → zod parse → call → a state the form can show.
// Returned state never carries secrets; `values` echoes what was typed, minus any password.
import { unstable_rethrow } from "next/navigation";
import { z } from "zod";
import { requireActor, type Actor } from "./authz";
import type { ActionState } from "@/lib/action-state";
import { busyError } from "./db-busy";
import { AppError, fieldErrorsOf } from "./errors";
import { assertSafeForm, dataExceptionAsInputError } from "./input-guard";

export type { ActionState };

function echo(form: FormData | Record<string, unknown>): Record<string, string> {
  const entries = form instanceof FormData ? [...form.entries()] : Object.entries(form);
  const out: Record<string, string> = {};
  for (const [k, v] of entries) if (typeof v === "string" && !/password/i.test(k)) out[k] = v;
  return out;
}

export function toErrorState(err: unknown, values?: Record<string, string>): ActionState<never> {
  err = busyError(err) ?? err; // the database is saturated: say so, and that a retry will do
  if (err instanceof AppError) {
    return { status: "error", message: err.message, fieldErrors: err.fieldErrors, values };
  }
  if (err instanceof z.ZodError) return toErrorState(new AppError(422, "invalid_input", "Some fields need attention.", fieldErrorsOf(err)), values);
  const input = dataExceptionAsInputError(err);
  if (input) return toErrorState(input, values);
  console.error(err);
  return { status: "error", message: "Something went wrong on our side. Nothing was saved; please try again.", values };
}

/** A server action for a form posting FormData (works before JavaScript loads). */
export function formAction<S extends z.ZodType, T>(
  schema: S,
  run: (input: z.output<S>, actor: Actor) => Promise<T>,
  opts: { message?: string } = {},
) {
  const act = async (...args: unknown[]): Promise<ActionState<T>> => {
    // Called as (previous state, FormData) by useActionState; anything else is refused, not thrown.
    const [prev, form] = args;
    if (args.length !== 2 || (prev !== null && prev !== undefined && typeof prev !== "object") || !(form instanceof FormData)) {
      return { status: "error", message: "This form was sent in a shape we do not accept. Reload the page and try again." };
    }
    let values: Record<string, string> | undefined;
    try {
      assertSafeForm(form);
      values = echo(form);
      const actor = await requireActor();
      const parsed = schema.safeParse(Object.fromEntries(form.entries()));
      if (!parsed.success) {
        return { status: "error", message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error), values };
      }
      const data = await run(parsed.data, actor);
      return { status: "ok", data, message: opts.message };
    } catch (err) {
      unstable_rethrow(err); // let redirect() and notFound() through
      return toErrorState(err, values);
    }
  };
  // The schema travels with the action so the fuzz test can generate forms from it.
  return Object.assign(act, { schema });
}
