import type { ComponentProps } from "react";

type Variant = "primary" | "secondary" | "quiet";

const styles: Record<Variant, string> = {
  primary: "bg-madder text-white hover:bg-madder-dark disabled:opacity-60",
  secondary: "bg-white text-peat border border-bark/40 hover:bg-fleece disabled:opacity-60",
  quiet: "text-madder-dark underline underline-offset-2 hover:text-peat",
};

export function buttonClass(variant: Variant = "primary", extra = "") {
  return `inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-base font-semibold no-underline transition-colors ${styles[variant]} ${extra}`;
}

export function Button({
  variant = "primary",
  className = "",
  type = "button",
  ...props
}: ComponentProps<"button"> & { variant?: Variant }) {
  return <button type={type} className={buttonClass(variant, className)} {...props} />;
}
