import Link from "next/link";

const STATUS: Record<string, string> = { sent: "Open", approved: "Approved", changes_requested: "Changes asked", superseded: "Replaced" };
const fmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" });

export function ProofList({ proofs, base }: { proofs: { id: string; number: number; status: string; sentAt: Date }[]; base: string }) {
  if (!proofs.length) return <p className="text-bark">No proof has been sent yet.</p>;
  return (
    <ul className="flex flex-col gap-1">
      {proofs.map((p) => (
        <li key={p.id}>
          <Link href={`${base}/proofs/${p.id}`}>Proof {p.number}</Link> · {STATUS[p.status] ?? p.status} · sent {fmt.format(p.sentAt)}
        </li>
      ))}
    </ul>
  );
}
