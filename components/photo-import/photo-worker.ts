// The photo import's quantising and garment reading, off the page's thread (a large crop and a whole
// garment take from a tenth of a second to a few seconds). The page numbers its jobs and keeps only
// the answer to the latest (photo-import.tsx); the same function runs on the page if no worker starts.
import { runPhotoJob, type PhotoJob } from "./photo-job";

interface WorkerScope {
  onmessage: ((e: MessageEvent<PhotoJob>) => void) | null;
  postMessage(message: unknown): void;
}

const scope = self as unknown as WorkerScope;
scope.onmessage = (e) => scope.postMessage(runPhotoJob(e.data));
