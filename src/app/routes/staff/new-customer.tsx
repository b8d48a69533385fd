import { useNavigate } from "react-router";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { canGoBack } from "@/utils/can-go-back";
import { AccessGate } from "@/features/auth/components/access-gate";
import { useCreateCustomer } from "@/features/customers/api/customers.queries";
import { CustomerForm } from "@/features/customers/components/customer-form";

export default function NewCustomerRoute() {
  return (
    <AccessGate access="office">
      <NewCustomerPage />
    </AccessGate>
  );
}

function NewCustomerPage() {
  const navigate = useNavigate();
  const create = useCreateCustomer();
  return (
    <>
      <PageHeader title="New customer" />
      <Panel className="max-w-2xl">
        <CustomerForm
          submitLabel="Create customer"
          onCancel={() => (canGoBack() ? navigate(-1) : navigate(paths.customers))}
          onSubmit={async (values) => {
            const customer = await create.mutateAsync(values);
            toast.success(`Added ${customer.name}`);
            navigate(paths.customer(customer.id));
          }}
        />
      </Panel>
    </>
  );
}
