// Local mail service: an SMTP server on loopback that keeps every message it receives, and a
// small HTTP API listing them (read by the app's local inbox page and by the tests).
//   tsx scripts/fakes/mail.ts --smtp-port 2525 --http-port 2580 --store .data/mail/messages.jsonl
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import path from "node:path";
import { parseArgs } from "node:util";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

interface StoredMessage {
  id: string;
  receivedAt: string;
  envelopeFrom: string;
  envelopeTo: string[];
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  links: string[];
  attachments: { filename: string; contentType: string; size: number }[];
}

const { values } = parseArgs({
  options: {
    "smtp-port": { type: "string", default: "2525" },
    "http-port": { type: "string", default: "2580" },
    store: { type: "string", default: ".data/mail/messages.jsonl" },
  },
});
const smtpPort = Number(values["smtp-port"]);
const httpPort = Number(values["http-port"]);
const store = path.resolve(values.store!);
mkdirSync(path.dirname(store), { recursive: true });

const messages: StoredMessage[] = existsSync(store)
  ? readFileSync(store, "utf8")
      .split("\n")
      .filter(Boolean)
      .map((l) => JSON.parse(l) as StoredMessage)
  : [];
let counter = messages.length;

function linksIn(text: string, html: string | null): string[] {
  const found = new Set<string>();
  for (const source of [text, html ?? ""]) {
    for (const m of source.matchAll(/https?:\/\/[^\s"'<>)]+/g)) found.add(m[0].replace(/&amp;/g, "&"));
  }
  return [...found];
}

const smtp = new SMTPServer({
  // nodemailer would upgrade to STARTTLS and then reject a self-signed certificate.
  disabledCommands: ["STARTTLS", "AUTH"],
  authOptional: true,
  logger: false,
  banner: "Darnwell local mail",
  size: 25 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const text = mail.text ?? "";
        const html = typeof mail.html === "string" ? mail.html : null;
        const to = Array.isArray(mail.to) ? mail.to.map((a) => a.text).join(", ") : (mail.to?.text ?? "");
        counter += 1;
        const msg: StoredMessage = {
          id: `m${counter}`,
          receivedAt: new Date().toISOString(),
          envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          envelopeTo: session.envelope.rcptTo.map((r) => r.address),
          from: mail.from?.text ?? "",
          to,
          subject: mail.subject ?? "",
          text,
          html,
          links: linksIn(text, html),
          attachments: mail.attachments.map((a) => ({
            filename: a.filename ?? "attachment",
            contentType: a.contentType,
            size: a.size,
          })),
        };
        messages.push(msg);
        appendFileSync(store, JSON.stringify(msg) + "\n");
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});

const http = createServer((req, res) => {
  const url = new URL(req.url ?? "/", `http://127.0.0.1:${httpPort}`);
  const send = (status: number, body: unknown) => {
    res.writeHead(status, { "content-type": "application/json" });
    res.end(JSON.stringify(body));
  };
  if (req.method === "GET" && url.pathname === "/health") return send(200, { ok: true });
  if (req.method === "GET" && url.pathname === "/messages") {
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = to ? messages.filter((m) => m.envelopeTo.some((a) => a.toLowerCase() === to)) : messages;
    return send(200, [...list].reverse());
  }
  const one = url.pathname.match(/^\/messages\/([\w-]+)$/);
  if (req.method === "GET" && one) {
    const m = messages.find((x) => x.id === one[1]);
    return m ? send(200, m) : send(404, { error: "no such message" });
  }
  if (req.method === "DELETE" && url.pathname === "/messages") {
    messages.length = 0;
    writeFileSync(store, "");
    return send(200, { ok: true });
  }
  send(404, { error: "not found" });
});

smtp.listen(smtpPort, "127.0.0.1", () => {
  http.listen(httpPort, "127.0.0.1", () => {
    console.log(`mail: SMTP on 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${httpPort}/messages`);
  });
});

const stop = () => {
  http.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
