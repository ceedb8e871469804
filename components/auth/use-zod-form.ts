"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, type FieldValues } from "react-hook-form";
import type { z } from "zod";

/** react-hook-form with a zod schema, validating on blur and on submit. */
export function useZodForm<S extends z.ZodType<FieldValues, FieldValues>>(schema: S, defaultValues?: z.input<S>) {
  return useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema),
    mode: "onBlur",
    defaultValues: defaultValues as never,
  });
}

export function errorsOf(err: { message?: string } | undefined): string[] | undefined {
  return err?.message ? [err.message] : undefined;
}
