import "server-only";
import { betterAuth } from "better-auth";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { magicLink } from "better-auth/plugins/magic-link";
import { db } from "@/db";
import { account, rateLimit, session, user, verification } from "@/db/schema";
import { env } from "@/lib/env";
import { existingAccountSignUpMessage, magicLinkMessage, resetPasswordMessage, verifyEmailMessage } from "@/templates/email/auth";
import { CLIENT_ADDRESS_HEADER } from "./client-address";
import { enqueueMail } from "./outbox";
import { clearSignInAttempts, noticeFailedSignIn, recordSignInAttempt } from "./sign-in-lock";

import { PASSWORD_MIN } from "@/lib/schemas/auth";
export { PASSWORD_MIN };

// Through the outbox: if the mail server is down the message waits and is retried.
async function deliver(to: string, message: { subject: string; html: string; text: string }) {
  await enqueueMail({ to, ...message });
}

function createAuth() {
  return betterAuth({
    appName: "Darnwell",
    baseURL: env.BETTER_AUTH_URL,
    secret: env.BETTER_AUTH_SECRET,
    trustedOrigins: [env.BETTER_AUTH_URL],
    database: drizzleAdapter(db, {
      provider: "pg",
      schema: { user, session, account, verification, rateLimit },
    }),
    emailAndPassword: {
      enabled: true,
      requireEmailVerification: true,
      minPasswordLength: PASSWORD_MIN,
      maxPasswordLength: 128,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user: u, url }) => deliver(u.email, resetPasswordMessage(u.name, url)),
      // The page says "we sent a link" either way (nothing revealed); the owner of the address gets a
      // mail saying so, at most one an hour, so the page stays true without a flood.
      onExistingUserSignUp: async ({ user: u }) => {
        const hour = new Date().toISOString().slice(0, 13);
        const signInUrl = new URL("/sign-in", env.BETTER_AUTH_URL).toString();
        const resetUrl = new URL("/forgot-password", env.BETTER_AUTH_URL).toString();
        await enqueueMail({ to: u.email, ...existingAccountSignUpMessage(u.name, signInUrl, resetUrl), dedupeKey: `existing-sign-up:${u.id}:${hour}` });
      },
    },
    emailVerification: {
      sendOnSignUp: true,
      sendOnSignIn: true,
      autoSignInAfterVerification: true,
      expiresIn: 24 * 60 * 60,
      sendVerificationEmail: async ({ user: u, url }) => deliver(u.email, verifyEmailMessage(u.name, url)),
    },
    session: {
      expiresIn: 60 * 60 * 24 * 14,
      updateAge: 60 * 60 * 24,
      // No cookie cache: a removed member or changed role takes effect on the next request.
      cookieCache: { enabled: false },
    },
    rateLimit: {
      enabled: env.AUTH_RATE_LIMIT === "on",
      storage: "database",
      window: 60,
      max: 120,
      customRules: {
        "/sign-in/email": { window: 60, max: env.AUTH_SIGNIN_LIMIT },
        "/sign-in/magic-link": { window: 60, max: env.AUTH_SIGNIN_LIMIT },
        "/request-password-reset": { window: 60, max: env.AUTH_SIGNIN_LIMIT },
        "/sign-up/email": { window: 60, max: env.AUTH_SIGNIN_LIMIT * 2 },
      },
    },
    advanced: {
      // Tests run with NODE_ENV=test, where better-auth would skip the check by default.
      disableOriginCheck: false,
      // Set by app/api/auth/[...all]/route.ts from clientAddress() (TRUSTED_PROXIES), replacing any
      // value a client sends; x-forwarded-for only for in-process calls (tests), where no client exists.
      ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER, "x-forwarded-for"] },
    },
    hooks: {
      // Wrong passwords per account (lib/server/sign-in-lock.ts), whatever address they come from.
      before: createAuthMiddleware(async (ctx) => {
        const email = signInEmailOf(ctx.path, ctx.body);
        if (!email) return;
        const refused = await recordSignInAttempt(email);
        if (refused) {
          throw new APIError(
            "TOO_MANY_REQUESTS",
            { code: "ACCOUNT_LOCKED", message: "Too many wrong passwords for this account. Wait and try again, or sign in with an e-mail link." },
            { "Retry-After": String(refused.retryAfterSeconds) },
          );
        }
      }),
      after: createAuthMiddleware(async (ctx) => {
        const email = signInEmailOf(ctx.path, ctx.body);
        if (!email) return;
        const returned = ctx.context.returned;
        const failed = isAPIError(returned) && returned.body?.code === "INVALID_EMAIL_OR_PASSWORD";
        // EMAIL_NOT_VERIFIED comes only after the password matched: that ends the series too.
        if (!isAPIError(returned) || returned.body?.code === "EMAIL_NOT_VERIFIED") await clearSignInAttempts(email);
        else if (failed) await noticeFailedSignIn(email);
      }),
    },
    plugins: [
      magicLink({
        expiresIn: 10 * 60,
        disableSignUp: true,
        sendMagicLink: async ({ email, url }) => deliver(email, magicLinkMessage(url)),
      }),
      nextCookies(), // must stay last
    ],
  });
}

function signInEmailOf(path: string | undefined, body: unknown): string | null {
  if (path !== "/sign-in/email" || !body || typeof body !== "object") return null;
  const email = (body as { email?: unknown }).email;
  return typeof email === "string" && email.length <= 320 ? email : null;
}

export type Auth = ReturnType<typeof createAuth>;
const globalForAuth = globalThis as unknown as { darnwellAuth?: Auth };

/** Created on first use so that importing a module never needs the environment. */
export function getAuth(): Auth {
  globalForAuth.darnwellAuth ??= createAuth();
  return globalForAuth.darnwellAuth;
}
