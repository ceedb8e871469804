import { sql } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { db } from "@/db";
import { seedDemo } from "@/db/seed";
import { loadEnv } from "@/lib/env";

describe("environment and demo data", () => {
  test("a missing or short secret refuses to start and names the variable", () => {
    const base = { DATABASE_URL: "postgres://x@127.0.0.1:1/x", SMTP_URL: "smtp://127.0.0.1:25" };
    expect(() => loadEnv(base)).toThrow(/BETTER_AUTH_SECRET/);
    expect(() => loadEnv({ ...base, BETTER_AUTH_SECRET: "short" })).toThrow(/at least 32/);
    expect(() => loadEnv({ BETTER_AUTH_SECRET: "x".repeat(40), SMTP_URL: "smtp://127.0.0.1:25" })).toThrow(/DATABASE_URL/);
    expect(loadEnv({ ...base, BETTER_AUTH_SECRET: "x".repeat(40) }).AUTH_SIGNIN_LIMIT).toBe(5);
  });

  test("seeding twice adds nothing the second time", async () => {
    const count = async () =>
      (await db.execute<{ n: string }>(sql`select (select count(*) from commissions) + (select count(*) from "user") as n`)).rows[0].n;
    await seedDemo();
    const before = await count();
    const again = await seedDemo();
    expect(again.created).toBe(false);
    expect(await count()).toBe(before);
  });
});
