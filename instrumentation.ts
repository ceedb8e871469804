// Runs once when a server process starts: background work that every instance may do.
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { startOutboxWorker } = await import("./lib/server/outbox");
    startOutboxWorker();
    const { startDraftSweeper } = await import("./lib/server/request-upkeep");
    startDraftSweeper();
  }
}
