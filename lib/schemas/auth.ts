// Form schemas for signing in and up, shared by the forms and the server checks.
import { z } from "zod";
import { safeString } from "./common";

export const PASSWORD_MIN = 10;

export const email = safeString()
  .trim()
  .min(1, "Enter your e-mail address.")
  .email("That does not look like an e-mail address (it needs an @ and a domain).");

export const password = z
  .string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(128, "Use at most 128 characters.");

// Checked even while other fields are wrong, so every message shows at once.
const sameTwice = {
  path: ["confirm"],
  message: "The two passwords are not the same.",
  when: (p: { value: unknown }) => {
    const v = p.value as { password?: unknown; confirm?: unknown } | undefined;
    return typeof v?.password === "string" && typeof v?.confirm === "string";
  },
};

export const signInSchema = z.object({
  email,
  password: z.string().min(1, "Enter your password."),
});

export const magicLinkSchema = z.object({ email });

export const signUpSchema = z
  .object({
    name: safeString().trim().min(1, "Tell us your name.").max(80, "Use at most 80 characters."),
    email,
    password,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, sameTwice);

export const forgotSchema = z.object({ email });

export const resetSchema = z
  .object({ password, confirm: z.string() })
  .refine((v) => v.password === v.confirm, sameTwice);

export const inviteSchema = z.object({ email });

/** Only same-site paths may be used as a "come back here" target (the one helper: lib/safe-redirect). */
export { safeNext } from "@/lib/safe-redirect";

/** Messages for better-auth's error codes, in our words. */
export function authErrorMessage(code: string | undefined, status?: number): string {
  if (code === "ACCOUNT_LOCKED") return "Too many wrong passwords for this account. Wait a few minutes, or sign in with an e-mail link instead.";
  if (status === 429) return "Too many attempts from here. Wait a minute and try again.";
  switch (code) {
    case "INVALID_EMAIL_OR_PASSWORD":
      return "That e-mail and password do not match an account. Check both, or use “Forgot your password?”.";
    case "EMAIL_NOT_VERIFIED":
      return "Please confirm your e-mail address first. We have just sent you a new link.";
    case "USER_ALREADY_EXISTS":
    case "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL":
      return "There is already an account with this e-mail address. Sign in instead, or reset the password.";
    case "PASSWORD_TOO_SHORT":
      return `Use at least ${PASSWORD_MIN} characters.`;
    case "INVALID_TOKEN":
    case "TOKEN_EXPIRED":
    case "EXPIRED_TOKEN":
      return "This link has expired or was already used. Ask for a new one below.";
    default:
      return "We could not do that just now. Please try again.";
  }
}
