// Several instances each run an outbox worker against one database: rows are leased (FOR UPDATE
// SKIP LOCKED, then pushed past the lease), so each mail is sent exactly once however the workers'
// rounds interleave. Four workers here run side by side on separate pool connections; mail that
// belongs to other test files is passed on to the real sender untouched.
import { randomBytes } from "node:crypto";
import { inArray } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { db } from "@/db";
import { outboxMessages } from "@/db/schema";
import { sendMail, type MailMessage } from "@/lib/server/mail";
import { enqueueMail, processOutbox } from "@/lib/server/outbox";

describe("outbox workers in several instances", { timeout: 60_000 }, () => {
  test("60 mails, 4 workers in parallel: every mail sent exactly once", async () => {
    const tag = randomBytes(4).toString("hex");
    const to = Array.from({ length: 60 }, (_, i) => `lease-${tag}-${i}@it.test`);
    for (const address of to) await enqueueMail({ to: address, subject: `Lease ${tag}`, html: "<p>x</p>", text: "x" });
    const sent = new Map<string, number>();
    const send = async (m: MailMessage) => {
      if (!m.to.startsWith(`lease-${tag}-`)) return sendMail(m);
      sent.set(m.to, (sent.get(m.to) ?? 0) + 1);
      // a slow server, so the workers' rounds overlap
      await new Promise((r) => setTimeout(r, 5));
    };
    const worker = async () => {
      for (let round = 0; round < 40; round++) {
        const r = await processOutbox(7, send);
        if (r.sent === 0 && sent.size === to.length) return;
      }
    };
    await Promise.all([worker(), worker(), worker(), worker()]);
    expect(sent.size).toBe(to.length);
    expect([...sent.values()].every((n) => n === 1)).toBe(true);
    const rows = await db.select().from(outboxMessages).where(inArray(outboxMessages.to, to));
    expect(rows).toHaveLength(60);
    expect(rows.every((r) => r.status === "sent" && r.attempts === 1)).toBe(true);
  });

  test("a leased row is not taken by another worker before its lease ends", async () => {
    const tag = randomBytes(4).toString("hex");
    const address = `lease-held-${tag}@it.test`;
    await enqueueMail({ to: address, subject: "Held", html: "<p>x</p>", text: "x" });
    let calls = 0;
    let release: () => void = () => undefined;
    const held = new Promise<void>((r) => (release = r));
    const slow = async (m: MailMessage) => {
      if (m.to !== address) return sendMail(m);
      calls++;
      await held;
    };
    // the first worker leases the row and hangs in the send; a second worker finds nothing of ours
    const first = processOutbox(50, slow);
    for (let i = 0; i < 50 && calls === 0; i++) await new Promise((r) => setTimeout(r, 20));
    expect(calls).toBe(1);
    await processOutbox(50, slow);
    expect(calls).toBe(1);
    release();
    await first;
    const [row] = await db.select().from(outboxMessages).where(inArray(outboxMessages.to, [address]));
    expect(row.status).toBe("sent");
  });
});
