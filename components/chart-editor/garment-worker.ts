// The live price's garment reading, off the page's thread: a whole garment takes from a few tenths
// of a second to several seconds to read, which would freeze the chart editor on every edit. The
// page numbers its requests and keeps only the answer to the latest (use-garment-reading.ts).
import { answer, type GarmentRequest } from "./garment-reading";

interface WorkerScope {
  onmessage: ((e: MessageEvent<GarmentRequest>) => void) | null;
  postMessage(message: unknown): void;
}

const scope = self as unknown as WorkerScope;
scope.onmessage = (e) => scope.postMessage(answer(e.data));
