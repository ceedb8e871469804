"use client";
// Re-reads a server-rendered page now and then, so hours logged elsewhere show up (e.g. the board).
import { useRouter } from "next/navigation";
import { useEffect } from "react";

export function RefreshEvery({ seconds }: { seconds: number }) {
  const router = useRouter();
  useEffect(() => {
    const t = setInterval(() => {
      if (document.visibilityState === "visible") router.refresh();
    }, seconds * 1000);
    return () => clearInterval(t);
  }, [router, seconds]);
  return null;
}
