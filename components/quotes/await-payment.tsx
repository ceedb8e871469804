"use client";
// After the pay page sends the client back, the provider's confirmation (a webhook) may land a moment
// later: ask the server every couple of seconds for a while and refresh the page once it has.
import { useQuery } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { Providers } from "@/components/providers";

const PAID = new Set(["paid", "partially_refunded", "refunded"]);
const POLL_MS = 2000;
const GIVE_UP_MS = 2 * 60_000;

/** Carries its own query client: the portal's layout has none (without it the page fails to render). */
export function AwaitPayment(props: { commissionId: string; kind: "deposit" | "balance" }) {
  return (
    <Providers>
      <AwaitPaymentPoll {...props} />
    </Providers>
  );
}

function AwaitPaymentPoll({ commissionId, kind }: { commissionId: string; kind: "deposit" | "balance" }) {
  const router = useRouter();
  const [startedAt] = useState(() => Date.now());
  const [gaveUp, setGaveUp] = useState(false);
  const state = useQuery({
    queryKey: ["commission-payments", commissionId],
    queryFn: async () => {
      const res = await fetch(`/api/commissions/${commissionId}/payments`, { cache: "no-store" });
      if (!res.ok) throw new Error(String(res.status));
      return (await res.json()) as { payments: { kind: string; status: string }[] };
    },
    refetchInterval: gaveUp ? false : POLL_MS,
  });
  const latest = state.data ? [...state.data.payments].reverse().find((p) => p.kind === kind) : undefined;
  const paid = latest ? PAID.has(latest.status) : false;
  useEffect(() => {
    if (paid) router.refresh();
  }, [paid, router]);
  useEffect(() => {
    const t = setTimeout(() => setGaveUp(true), Math.max(0, startedAt + GIVE_UP_MS - Date.now()));
    return () => clearTimeout(t);
  }, [startedAt]);
  if (paid) return null;
  return (
    <p className="text-sm text-bark" aria-live="polite">
      {gaveUp ? "The confirmation is taking longer than usual; reload this page in a few minutes." : "Waiting for the payment service to confirm your payment…"}
    </p>
  );
}
