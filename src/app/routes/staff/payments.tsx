import { PageHeader } from "@/components/ui/page-header";
import { AccessGate } from "@/features/auth/components/access-gate";
import { PaymentsTable } from "@/features/payments/components/payments-table";

export default function PaymentsRoute() {
  return (
    <AccessGate access="owner">
      <PageHeader
        title="Payments"
        description="Card payments received, newest first. A payment to check (an amount that does not match, or more than was still due, such as a deposit paid twice) comes first: refund it or accept it."
      />
      <PaymentsTable />
    </AccessGate>
  );
}
