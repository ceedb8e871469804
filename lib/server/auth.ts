import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { magicLink } from "better-auth/plugins/magic-link";
import { db } from "@/db";
import { account, rateLimit, session, user, verification } from "@/db/schema";
import { env } from "@/lib/env";
import { magicLinkMessage, resetPasswordMessage, verifyEmailMessage } from "@/templates/email/auth";
import { enqueueMail } from "./outbox";

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
      ipAddress: { ipAddressHeaders: ["x-forwarded-for", "x-real-ip"] },
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

export type Auth = ReturnType<typeof createAuth>;
const globalForAuth = globalThis as unknown as { darnwellAuth?: Auth };

/** Created on first use so that importing a module never needs the environment. */
export function getAuth(): Auth {
  globalForAuth.darnwellAuth ??= createAuth();
  return globalForAuth.darnwellAuth;
}
