import { notFound } from "next/navigation";
import { Suspense } from "react";
import { PageTitle } from "@/components/ui/card";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { PaymentsTable } from "./payments-table";

export const metadata = { title: "Payments" };

export default async function PaymentsPage() {
  const { actor, membership } = await requireStudioMember("/studio/payments");
  if (!can(actor, "payments.manage", membership.studioId)) notFound();
  return (
    <>
      <PageTitle title="Payments" lead="Deposits and balances as the payment service confirmed them, with refunds." />
      <Suspense fallback={<p>Loading payments…</p>}>
        <PaymentsTable />
      </Suspense>
    </>
  );
}
