import { Plus } from "lucide-react";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { paths } from "@/config/paths";
import { AccessGate } from "@/features/auth/components/access-gate";
import { CustomersTable } from "@/features/customers/components/customers-table";

export default function CustomersRoute() {
  const newCustomer = (
    <ButtonLink to={paths.newCustomer} icon={<Plus aria-hidden className="size-5" />}>
      New customer
    </ButtonLink>
  );
  return (
    <AccessGate access="office">
      <PageHeader title="Customers" description="People and businesses the shop paints for." actions={newCustomer} />
      <CustomersTable emptyAction={newCustomer} />
    </AccessGate>
  );
}
