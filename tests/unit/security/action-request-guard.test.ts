// Server-action requests that Next.js's own decoding would answer 500 are refused in the proxy first
// (403 foreign/unparsable Origin, 411 no length, 413 over the limit, 400 not React's reply encoding),
// while the bodies React's client really sends (encodeReply) pass unchanged.
import { createRequire } from "node:module";
import { describe, expect, test } from "vitest";
import { MAX_ACTION_BYTES } from "@/lib/action-body-limit";
import { actionBodyRefusal, actionHeaderRefusal, isActionRequest, MAX_ACTION_ARGS } from "@/lib/action-request-guard";

const require = createRequire(import.meta.url);
// The encoder the browser uses to send action arguments (the same React build Next ships).
const { encodeReply } = require("next/dist/compiled/react-server-dom-webpack/client.node") as {
  encodeReply: (v: unknown) => Promise<string | FormData>;
};

const HOST = "127.0.0.1:3301";
const ID = "7f".padEnd(42, "a");

function actionRequest(body: string | FormData, headers: Record<string, string> = {}): Request {
  const h: Record<string, string> = { "next-action": ID, origin: `http://${HOST}`, host: HOST, ...headers };
  if (typeof body === "string") h["content-type"] ??= "text/plain;charset=UTF-8";
  return new Request(`http://${HOST}/portal`, { method: "POST", headers: h, body });
}
async function multipart(fields: [string, string][], headers: Record<string, string> = {}): Promise<Request> {
  const fd = new FormData();
  for (const [k, v] of fields) fd.append(k, v);
  return actionRequest(fd, headers);
}
const status = async (r: Request) => (await actionBodyRefusal(r))?.status ?? null;

describe("which requests Next treats as server actions", () => {
  test.each([
    ["POST", { "next-action": "x" }, "/api/health", true],
    ["POST", { "content-type": "multipart/form-data; boundary=z" }, "/studio", true],
    ["POST", { "content-type": "multipart/form-data; boundary=z" }, "/api/yarns", false],
    ["POST", { "content-type": "application/json" }, "/studio", false],
    ["GET", { "next-action": "x" }, "/studio", false],
  ] as const)("%s %j %s → %s", (method, headers, path, expected) => {
    expect(isActionRequest(method, new Headers(headers), path)).toBe(expected);
  });
});

describe("header checks", () => {
  const h = (o: Record<string, string>) => new Headers({ host: HOST, ...o });
  test.each([
    [{ origin: `http://${HOST}`, "content-length": "10" }, null],
    [{ "content-length": "10" }, null], // no Origin (a script): Next lets it through, so do we
    [{ origin: "https://evil.test", "content-length": "10" }, 403],
    [{ origin: "null", "content-length": "10" }, 403],
    [{ origin: "garbage", "content-length": "10" }, 403],
    [{ origin: `http://${HOST}` }, 411], // chunked or no body: Next would read past its limit and 500
    [{ origin: `http://${HOST}`, "content-length": "abc" }, 411],
    [{ origin: `http://${HOST}`, "content-length": String(MAX_ACTION_BYTES) }, null],
    [{ origin: `http://${HOST}`, "content-length": String(MAX_ACTION_BYTES + 1) }, 413],
  ] as const)("%j → %s", (headers, expected) => {
    expect(actionHeaderRefusal(h(headers))?.status ?? null).toBe(expected);
  });
});

describe("bodies React's client really sends pass", () => {
  test("a form with its previous state (multipart: root, dates, bigints, escaped $, FormData)", async () => {
    const fd = new FormData();
    fd.append("quoteId", "0b0e8a52-4d1c-4d7e-9a51-0f4b5a3c2d10");
    fd.append("name", "$ literally");
    const prev = { status: "error", message: "x", values: { a: "$b" }, when: new Date(0), n: 5n, u: undefined, f: { x: ["a"] } };
    const body = await encodeReply([prev, fd]);
    expect(body).toBeInstanceOf(FormData);
    expect(await status(actionRequest(body))).toBeNull();
  });
  test.each([
    ["no arguments", []],
    ["a slug and values", ["hollin-knitworks", { name: "Ada", sizes: ["S", "M"], chest: 92.5, note: "$5 off" }]],
    ["a shared object (path reference)", (() => { const s = { a: 1 }; return [s, s]; })()],
    ["null state and undefined", [null, undefined]],
  ])("%s", async (_label, args) => {
    const body = await encodeReply(args);
    expect(await status(actionRequest(body as string | FormData))).toBeNull();
  });
});

describe("bodies Next would fail on are 400", () => {
  test.each([
    ["garbage{"],
    [""],
    ["{}"],
    ['"x"'],
    ['[null,"$nxyz"]'],
    ['["$@5"]'],
    ['["$Q3"]'],
    ['["$h1"]'],
    ['["$T"]'],
    ['["$"]'],
    ['["$1:constructor:prototype"]'],
    ['["$0:constructor"]'],
    ["[".repeat(5000) + "]".repeat(5000)],
    [JSON.stringify(Array.from({ length: MAX_ACTION_ARGS + 1 }, () => 0))],
    ['[{"__proto__":{"x":1}}]'],
  ])("text %s", async (body) => {
    expect(await status(actionRequest(body.slice(0, 20000)))).toBe(400);
  });

  test.each([
    ["no root", [["_1_quoteId", "x"]]],
    ["garbage root", [["0", "{garbage"]]],
    ["non-array root", [["0", '"$K1"']]],
    ["missing outlined part", [["0", '["$2"]']]],
    ["garbage outlined part", [["0", '["$2","$K1"]'], ["2", "{bad"]]],
    ["missing chunk", [["0", '["$@9"]']]],
  ] as [string, [string, string][]][])("multipart %s", async (_label, fields) => {
    expect(await status(await multipart(fields))).toBe(400);
  });

  test("an outlined part that exists passes", async () => {
    expect(await status(await multipart([["0", '["$2","$K1"]'], ["2", '{"a":1}']]))).toBeNull();
  });

  test("a multipart body that is not multipart", async () => {
    const r = actionRequest("garbage", { "content-type": "multipart/form-data; boundary=zz" });
    expect(await status(r)).toBe(400);
  });
});

describe("no-JavaScript form posts (multipart, no Next-Action header)", () => {
  const mpa = (fields: [string, string][]) => {
    const fd = new FormData();
    for (const [k, v] of fields) fd.append(k, v);
    return new Request(`http://${HOST}/portal`, { method: "POST", headers: { origin: `http://${HOST}` }, body: fd });
  };
  test("a bound action with its state passes; garbage metadata or bound arguments are 400", async () => {
    const ok = [["$ACTION_REF_1", ""], ["$ACTION_1:0", `{"id":"${ID}","bound":"$@1"}`], ["$ACTION_1:1", '[{"status":"idle"}]'], ["$ACTION_KEY", "k"], ["name", "x"]] as [string, string][];
    expect(await status(mpa(ok))).toBeNull();
    expect(await status(mpa([["$ACTION_ID_" + ID, ""], ["name", "\u0000"]]))).toBeNull(); // the action's own checks answer
    expect(await status(mpa([["$ACTION_REF_1", ""], ["$ACTION_1:0", "{garbage"]]))).toBe(400);
    expect(await status(mpa([["$ACTION_REF_1", ""], ["$ACTION_1:0", `{"id":"${ID}","bound":"$@1"}`], ["$ACTION_1:1", "{bad"]]))).toBe(400);
    expect(await status(mpa([["$ACTION_REF_1", ""], ["$ACTION_1:0", `{"id":"${ID}","bound":"$@1"}`]]))).toBe(400);
    expect(await status(mpa([["plain", "form"]]))).toBeNull(); // not an action at all: Next renders the page
  });
});
