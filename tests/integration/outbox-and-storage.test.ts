import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import nodemailer from "nodemailer";
import { SMTPServer } from "smtp-server";
import { afterAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { outboxMessages } from "@/db/schema";
import { backoffSeconds, enqueueMail, processOutbox } from "@/lib/server/outbox";
import { getObject, putObject, signedDownloadUrl } from "@/lib/server/storage";
import type { MailMessage } from "@/lib/server/mail";

// A mail server of the test's own that can be stopped and started again on the same port.
const received: string[] = [];
let server: SMTPServer | null = null;
const port = 20000 + (randomBytes(2).readUInt16BE() % 20000);
function startSmtp(): Promise<void> {
  server = new SMTPServer({
    disabledCommands: ["STARTTLS", "AUTH"],
    authOptional: true,
    logger: false,
    onData(stream, _session, cb) {
      let raw = "";
      stream.on("data", (c: Buffer) => (raw += c.toString()));
      stream.on("end", () => {
        received.push(raw);
        cb();
      });
    },
  });
  return new Promise((r) => server!.listen(port, "127.0.0.1", () => r()));
}
const stopSmtp = () => new Promise<void>((r) => (server ? server.close(() => r()) : r()));
afterAll(stopSmtp);

const transport = nodemailer.createTransport({ host: "127.0.0.1", port, ignoreTLS: true, connectionTimeout: 2000 });
const send = async (m: MailMessage) => {
  await transport.sendMail({ from: "studio@darnwell.test", ...m });
};

describe("outbox", () => {
  test("mail queued while the SMTP server is down is delivered exactly once after it is back", async () => {
    const key = `it-outbox-${randomBytes(4).toString("hex")}`;
    const subject = `Proof ready ${key}`;
    await enqueueMail({ to: "client@it.test", subject, html: "<p>hi</p>", text: "hi", dedupeKey: key });
    await enqueueMail({ to: "client@it.test", subject, html: "<p>hi</p>", text: "hi", dedupeKey: key }); // queued once
    const rows = await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, key));
    expect(rows).toHaveLength(1);

    // Server down: the attempt fails and is rescheduled with backoff.
    await processOutbox(50, send);
    let [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, key));
    expect(row.status).toBe("pending");
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());

    // Server back; the retry comes due.
    await startSmtp();
    await db.update(outboxMessages).set({ nextAttemptAt: new Date(Date.now() - 1000) }).where(eq(outboxMessages.id, row.id));
    await processOutbox(50, send);
    await processOutbox(50, send); // a second pass sends nothing more
    [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, key));
    expect(row.status).toBe("sent");
    expect(received.filter((r) => r.includes(subject))).toHaveLength(1);
  });

  test("backoff grows and is capped", () => {
    expect([1, 2, 3, 4].map(backoffSeconds)).toEqual([5, 10, 20, 40]);
    expect(backoffSeconds(30)).toBe(3600);
  });
});

describe("object storage (local S3 fake through the AWS SDK)", () => {
  test("put, get and a signed URL that works and carries its expiry", async () => {
    const key = `it/${randomBytes(6).toString("hex")}.txt`;
    await putObject(key, Buffer.from("two colours knitted, the rest darned"), "text/plain");
    expect((await getObject(key)).toString()).toContain("darned");
    const url = await signedDownloadUrl(key, 60);
    expect(url).toContain("X-Amz-Signature");
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(await res.text()).toContain("two colours");
    // The local fake does not check signatures (real S3 does); what we can check is what we ask for.
    expect(new URL(url).searchParams.get("X-Amz-Expires")).toBe("60");
  });
});
