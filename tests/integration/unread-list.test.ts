// The commission lists say how many messages each viewer has not read, as the thread counts them.
import { randomBytes } from "node:crypto";
import { beforeAll, expect, test } from "vitest";
import { getThread, postMessage } from "@/lib/server/messages";
import { listCommissionsFor } from "@/lib/server/queries/commissions";
import { makeWorld, type World } from "./helpers";

let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

const key = () => `k-${randomBytes(6).toString("hex")}`;
const unreadOn = async (userId: string, commissionId: string) => {
  const rows = await listCommissionsFor(await w.actor(userId));
  return rows.find((r) => r.id === commissionId)?.unread;
};

test("two studio messages show as 2 new for the client until the thread is opened; never for their author", async () => {
  const owner = await w.actor(w.owner.id);
  await postMessage(owner, w.commissionA, { body: "Your swatch is drying.", clientKey: key(), uploadIds: [] });
  await postMessage(owner, w.commissionA, { body: "Photos tomorrow.", clientKey: key(), uploadIds: [] });
  expect(await unreadOn(w.clientA.id, w.commissionA)).toBe(2);
  expect(await unreadOn(w.owner.id, w.commissionA)).toBe(0);
  // Client B's list does not hold client A's commission at all.
  expect(await unreadOn(w.clientB.id, w.commissionA)).toBeUndefined();

  await getThread(await w.actor(w.clientA.id), w.commissionA, { markRead: true });
  expect(await unreadOn(w.clientA.id, w.commissionA)).toBe(0);

  // The client's reply is new for the owner and for the assistant, each by their own reading.
  await postMessage(await w.actor(w.clientA.id), w.commissionA, { body: "Thank you!", clientKey: key(), uploadIds: [] });
  expect(await unreadOn(w.owner.id, w.commissionA)).toBe(1);
  expect(await unreadOn(w.assistant.id, w.commissionA)).toBeGreaterThanOrEqual(1);
  await getThread(owner, w.commissionA, { markRead: true });
  expect(await unreadOn(w.owner.id, w.commissionA)).toBe(0);
  expect(await unreadOn(w.assistant.id, w.commissionA)).toBeGreaterThanOrEqual(1);
});
