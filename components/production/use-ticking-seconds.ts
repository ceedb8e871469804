"use client";
import { useEffect, useState } from "react";

/** Seconds shown for a timer: the server's count, ticking locally while it runs. */
export function useTickingSeconds(serverSeconds: number | null, running: boolean, fetchedAt: number): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!running) return;
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, [running]);
  if (serverSeconds === null) return 0;
  return running ? serverSeconds + Math.max(0, Math.floor((now - fetchedAt) / 1000)) : serverSeconds;
}
